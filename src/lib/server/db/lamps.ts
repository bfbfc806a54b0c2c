import type { Knex } from 'knex';
import { db } from './index';
import type { LampModelInput } from '$lib/schemas/lamps';

/** A lamp row as the services use it. */
export interface LampRow {
	id: number;
	groupId: number;
	ownerId: string | null;
	name: string;
	model: LampModelInput;
	powerW: number;
	couplingFactor: number;
	distanceNote: string | null;
	/** Stated distance to the person, cm, and an optional radiometer reading there (W m⁻²). */
	exposureDistanceCm: number | null;
	exposureIrradianceWPerM2: number | null;
	notes: string | null;
	version: number;
	createdAt: Date;
	updatedAt: Date;
}

function toLamp(r: Record<string, unknown>): LampRow {
	return {
		id: Number(r.id),
		groupId: Number(r.group_id),
		ownerId: (r.owner_id as string) ?? null,
		name: String(r.name),
		model: (typeof r.model === 'string' ? JSON.parse(r.model) : r.model) as LampModelInput,
		powerW: Number(r.power_w),
		couplingFactor: Number(r.coupling_factor),
		distanceNote: (r.distance_note as string) ?? null,
		exposureDistanceCm: r.exposure_distance_cm == null ? null : Number(r.exposure_distance_cm),
		exposureIrradianceWPerM2: r.exposure_irradiance_w_m2 == null ? null : Number(r.exposure_irradiance_w_m2),
		notes: (r.notes as string) ?? null,
		version: Number(r.version),
		createdAt: r.created_at as Date,
		updatedAt: r.updated_at as Date
	};
}

/** Lamps of the given groups, by name. */
export async function listLamps(groupIds: number[]): Promise<LampRow[]> {
	if (!groupIds.length) return [];
	return (await db()('lamps').whereIn('group_id', groupIds).orderBy('name')).map(toLamp);
}

/** One lamp by id, or null. */
export async function findLamp(id: number): Promise<LampRow | null> {
	const r = await db()('lamps').where({ id }).first();
	return r ? toLamp(r) : null;
}

/** Inserts a lamp; returns its id. */
export async function insertLamp(
	row: Omit<LampRow, 'id' | 'version' | 'createdAt' | 'updatedAt'>,
	conn: Knex | Knex.Transaction = db()
): Promise<number> {
	const [id] = await conn('lamps').insert({
		group_id: row.groupId,
		owner_id: row.ownerId,
		name: row.name,
		model: JSON.stringify(row.model),
		power_w: row.powerW,
		coupling_factor: row.couplingFactor,
		distance_note: row.distanceNote,
		exposure_distance_cm: row.exposureDistanceCm,
		exposure_irradiance_w_m2: row.exposureIrradianceWPerM2,
		notes: row.notes
	});
	return Number(id);
}

/** Updates a lamp when its version still matches; returns the number of rows changed (0 = stale). */
export async function updateLampIfVersion(
	id: number,
	version: number,
	patch: Partial<Pick<LampRow, 'name' | 'model' | 'powerW' | 'couplingFactor' | 'distanceNote' | 'exposureDistanceCm' | 'exposureIrradianceWPerM2' | 'notes'>>
): Promise<number> {
	const row: Record<string, unknown> = { version: version + 1, updated_at: db().fn.now() };
	if (patch.name !== undefined) row.name = patch.name;
	if (patch.model !== undefined) row.model = JSON.stringify(patch.model);
	if (patch.powerW !== undefined) row.power_w = patch.powerW;
	if (patch.couplingFactor !== undefined) row.coupling_factor = patch.couplingFactor;
	if (patch.distanceNote !== undefined) row.distance_note = patch.distanceNote;
	if (patch.exposureDistanceCm !== undefined) row.exposure_distance_cm = patch.exposureDistanceCm;
	if (patch.exposureIrradianceWPerM2 !== undefined) row.exposure_irradiance_w_m2 = patch.exposureIrradianceWPerM2;
	if (patch.notes !== undefined) row.notes = patch.notes;
	return db()('lamps').where({ id, version }).update(row);
}

/** One stored calibration: the photon flux entering the solution through the named vessel wall. */
export interface LampCalibrationRow {
	id: number;
	lampId: number;
	method: 'actinometry' | 'radiometer' | string;
	actinometer: string | null;
	concentrationM: number | null;
	photonFluxEinsteinPerS: number;
	wavelengthNm: number | null;
	wallMaterialId: number | null;
	wallMaterialName: string | null;
	wallThicknessMm: number | null;
	vesselPathCm: number | null;
	irradiatedVolumeMl: number | null;
	irradiationTimeS: number | null;
	quantumYieldUsed: number | null;
	fractionAbsorbed: number | null;
	opticalPowerW: number | null;
	operator: string | null;
	lampPowerW: number | null;
	lampVersion: number | null;
	inputs: Record<string, unknown> | null;
	notes: string | null;
	createdByName: string | null;
	measuredAt: Date;
}

const numOrNull = (v: unknown) => (v == null ? null : Number(v));

function toCalibration(r: Record<string, unknown>): LampCalibrationRow {
	return {
		id: Number(r.id),
		lampId: Number(r.lamp_id),
		method: String(r.method),
		actinometer: (r.actinometer as string) ?? null,
		concentrationM: numOrNull(r.concentration_m),
		photonFluxEinsteinPerS: Number(r.photon_flux_einstein_per_s),
		wavelengthNm: numOrNull(r.wavelength_nm),
		wallMaterialId: numOrNull(r.wall_material_id),
		wallMaterialName: (r.wall_material_name as string) ?? null,
		wallThicknessMm: numOrNull(r.wall_thickness_mm),
		vesselPathCm: numOrNull(r.vessel_path_cm),
		irradiatedVolumeMl: numOrNull(r.irradiated_volume_ml),
		irradiationTimeS: numOrNull(r.irradiation_time_s),
		quantumYieldUsed: numOrNull(r.quantum_yield_used),
		fractionAbsorbed: numOrNull(r.fraction_absorbed),
		opticalPowerW: numOrNull(r.optical_power_w),
		operator: (r.operator as string) ?? null,
		lampPowerW: numOrNull(r.lamp_power_w),
		lampVersion: numOrNull(r.lamp_version),
		inputs: r.inputs == null ? null : ((typeof r.inputs === 'string' ? JSON.parse(r.inputs) : r.inputs) as Record<string, unknown>),
		notes: (r.notes as string) ?? null,
		createdByName: (r.created_by_name as string) ?? null,
		measuredAt: r.measured_at as Date
	};
}

/** Calibrations of a lamp, newest first (by measurement date, then by entry). */
export async function listLampCalibrations(lampId: number): Promise<LampCalibrationRow[]> {
	const rows = await db()('lamp_calibrations as c')
		.leftJoin('users as u', 'u.id', 'c.created_by')
		.leftJoin('wall_materials as w', 'w.id', 'c.wall_material_id')
		.where('c.lamp_id', lampId)
		.orderBy([{ column: 'c.measured_at', order: 'desc' }, { column: 'c.id', order: 'desc' }])
		.select('c.*', 'u.name as created_by_name', 'w.name as wall_material_name');
	return rows.map(toCalibration);
}

export type NewCalibration = Omit<LampCalibrationRow, 'id' | 'wallMaterialName' | 'createdByName'> & { createdBy: string };

/** Stores a calibration; returns its id. */
export async function insertLampCalibration(c: NewCalibration, conn: Knex | Knex.Transaction = db()): Promise<number> {
	const [id] = await conn('lamp_calibrations').insert({
		lamp_id: c.lampId,
		method: c.method,
		actinometer: c.actinometer,
		concentration_m: c.concentrationM,
		photon_flux_einstein_per_s: c.photonFluxEinsteinPerS,
		wavelength_nm: c.wavelengthNm,
		wall_material_id: c.wallMaterialId,
		wall_thickness_mm: c.wallThicknessMm,
		vessel_path_cm: c.vesselPathCm,
		irradiated_volume_ml: c.irradiatedVolumeMl,
		irradiation_time_s: c.irradiationTimeS,
		quantum_yield_used: c.quantumYieldUsed,
		fraction_absorbed: c.fractionAbsorbed,
		optical_power_w: c.opticalPowerW,
		operator: c.operator,
		lamp_power_w: c.lampPowerW,
		lamp_version: c.lampVersion,
		inputs: c.inputs ? JSON.stringify(c.inputs) : null,
		notes: c.notes,
		created_by: c.createdBy,
		measured_at: c.measuredAt
	});
	return Number(id);
}

/** Days after which a group's lamp calibrations count as stale (null: the default). */
export async function groupCalibrationIntervalDays(groupId: number): Promise<number | null> {
	const r = await db()('groups').where({ id: groupId }).first('calibration_interval_days');
	return r?.calibration_interval_days == null ? null : Number(r.calibration_interval_days);
}

export async function setGroupCalibrationIntervalDays(groupId: number, days: number): Promise<void> {
	await db()('groups').where({ id: groupId }).update({ calibration_interval_days: days });
}
