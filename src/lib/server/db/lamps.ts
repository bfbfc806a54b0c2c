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
		notes: row.notes
	});
	return Number(id);
}

/** Updates a lamp when its version still matches; returns the number of rows changed (0 = stale). */
export async function updateLampIfVersion(
	id: number,
	version: number,
	patch: Partial<Pick<LampRow, 'name' | 'model' | 'powerW' | 'couplingFactor' | 'distanceNote' | 'notes'>>
): Promise<number> {
	const row: Record<string, unknown> = { version: version + 1, updated_at: db().fn.now() };
	if (patch.name !== undefined) row.name = patch.name;
	if (patch.model !== undefined) row.model = JSON.stringify(patch.model);
	if (patch.powerW !== undefined) row.power_w = patch.powerW;
	if (patch.couplingFactor !== undefined) row.coupling_factor = patch.couplingFactor;
	if (patch.distanceNote !== undefined) row.distance_note = patch.distanceNote;
	if (patch.notes !== undefined) row.notes = patch.notes;
	return db()('lamps').where({ id, version }).update(row);
}

/** Calibrations of a lamp, newest first. */
export async function listLampCalibrations(lampId: number) {
	const rows = await db()('lamp_calibrations as c')
		.leftJoin('users as u', 'u.id', 'c.created_by')
		.where('c.lamp_id', lampId)
		.orderBy('c.measured_at', 'desc')
		.select('c.*', 'u.name as created_by_name');
	return rows.map((r: Record<string, unknown>) => ({
		id: Number(r.id),
		method: String(r.method),
		photonFluxEinsteinPerS: Number(r.photon_flux_einstein_per_s),
		wavelengthNm: r.wavelength_nm == null ? null : Number(r.wavelength_nm),
		notes: (r.notes as string) ?? null,
		createdByName: (r.created_by_name as string) ?? null,
		measuredAt: r.measured_at as Date
	}));
}
