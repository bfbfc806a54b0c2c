/**
 * Lamp calibrations: actinometry runs and radiometer readings stored as the photon flux entering the solution through
 * the calibration vessel's wall, the lamp's basis ("actinometry, 2026-12-02, ferrioxalate, 1 mm fused silica") and the
 * planner's use of it (src/lib/irradiation/lampCalibration.ts: the wall applied once; another wall scaled by the ratio
 * of the two walls' transmissions weighted by the lamp's photon spectrum).
 */
import { ACTINOMETERS, computeActinometry, type ActinometryIssue } from '$lib/irradiation/actinometry';
import { calibratedPhotonFluxPerNm, radiometerPhotonFlux, wallRatio } from '$lib/irradiation/lampCalibration';
import { wallTransmissionOnGrid } from '$lib/irradiation/walls';
import { COMPUTATION_GRID } from '$lib/irradiation/wavelengthGrid';
import { actinometryRequestSchema, radiometerRequestSchema } from '$lib/schemas/actinometry';
import { audit } from '$lib/server/db/audit';
import { db } from '$lib/server/db/index';
import { groupCalibrationIntervalDays, insertLampCalibration, listLampCalibrations, type LampCalibrationRow, type LampRow } from '$lib/server/db/lamps';
import { getWallMaterial, type WallMaterial } from '$lib/server/db/wallMaterials';
import { ApiError, zodToApiError } from '$lib/server/http';
import { membershipsOf, requireGroupRole, roleAtLeast } from '$lib/server/policy';
import { describeLamp, exposureOf, resolveLampModel, vesselPowerW } from './lamps';
import { findLamp } from '$lib/server/db/lamps';
import { loadGroupRow, requireMemberSomewhere } from './groupChoice';

const visibleLamp = (locals: App.Locals, idParam: string | undefined) => loadGroupRow(locals, idParam, findLamp, 'lamp');

const GRID = COMPUTATION_GRID;
/** Calibration interval when the group has not set one, days (common practice: lamps are re-checked about twice a year). */
export const DEFAULT_CALIBRATION_INTERVAL_DAYS = 180;

const lowerFirst = (s: string) => s.charAt(0).toLowerCase() + s.slice(1);
const day = (d: Date | string) => new Date(d).toISOString().slice(0, 10);

/** GET /api/actinometers: what the app can compute, with Φ tables and their sources. */
export function actinometersToApi() {
	return ACTINOMETERS.map((a) => ({
		id: a.id,
		name: a.name,
		rangeNm: a.rangeNm,
		readout: a.readout,
		strengths: a.strengths.map((s) => ({ concentrationM: s.concentrationM, acceptM: s.acceptM, quantumYield: s.quantumYield.map(([wavelengthNm, phi]) => ({ wavelengthNm, phi })), source: s.source, hasEpsilonTable: !!s.epsilon, epsilonSource: s.epsilonSource ?? null })),
		procedure: a.procedure,
		cautions: a.cautions
	}));
}

async function wallFor(groupId: number, materialId: number): Promise<WallMaterial> {
	const m = await getWallMaterial(materialId, [groupId]);
	if (!m) throw new ApiError(422, 'invalid', `vessel.materialId: no wall material with id ${materialId}.`, { field: 'vessel.materialId' });
	return m;
}

const wallT = (m: WallMaterial, thicknessMm: number) => wallTransmissionOnGrid(m.model, thicknessMm, GRID.fromNm, GRID.stepNm, GRID.count);
const wallLabel = (m: { name: string } | null, thicknessMm: number | null) => (m && thicknessMm != null ? `${+thicknessMm.toPrecision(3)} mm ${lowerFirst(m.name)}` : 'unknown wall');

function fail(issues: ActinometryIssue[]): never {
	const first = issues[0];
	throw new ApiError(first.code === 'invalid' ? 400 : 422, first.code === 'invalid' ? 'invalid' : 'physically_invalid', first.message, { field: first.field, issues });
}

function measuredAtOf(v: string | undefined): Date {
	if (!v) return new Date();
	const d = new Date(v);
	if (Number.isNaN(d.getTime())) throw new ApiError(400, 'invalid', 'measuredAt: not a date (use YYYY-MM-DD or an ISO date-time).', { field: 'measuredAt' });
	if (d.getTime() > Date.now() + 36e5 * 24) throw new ApiError(422, 'physically_invalid', 'measuredAt: the measurement date lies in the future.', { field: 'measuredAt' });
	return d;
}

async function lampForWrite(locals: App.Locals, lampId: number) {
	const lamp = await visibleLamp(locals, String(lampId));
	await requireGroupRole(locals, lamp.groupId, 'member');
	return lamp;
}

/** POST /api/actinometry: compute a run, store it as a calibration of the lamp; writes nothing on bad input. */
export async function recordActinometry(locals: App.Locals, body: unknown) {
	await requireMemberSomewhere(locals);
	const parsed = actinometryRequestSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error);
	const req = parsed.data;
	const lamp = await lampForWrite(locals, req.lampId);
	const material = await wallFor(lamp.groupId, req.vessel.materialId);
	const model = await resolveLampModel(lamp.model, locals);
	const d = describeLamp(model, vesselPowerW(lamp), GRID, lamp.powerW, exposureOf(lamp));
	const t = wallT(material, req.vessel.thicknessMm);
	const incident = new Float64Array(GRID.count);
	for (let i = 0; i < GRID.count; i++) incident[i] = d.photonFluxPerNm[i] * t[i];
	const out = computeActinometry(
		{ ...req, vesselPathCm: req.vessel.pathCm },
		{ wavelengthNm: d.spectrum.wavelengthNm, photonFluxPerNm: incident }
	);
	if (!out.ok) fail(out.issues);
	const r = out.value;
	const measuredAt = measuredAtOf(req.measuredAt);
	const id = await db().transaction(async (trx) => {
		const newId = await insertLampCalibration({
			lampId: lamp.id, method: 'actinometry', actinometer: r.actinometer, concentrationM: req.concentrationM,
			photonFluxEinsteinPerS: r.photonFluxEinsteinPerS, wavelengthNm: Math.round(r.effectiveWavelengthNm * 10) / 10,
			wallMaterialId: material.id, wallThicknessMm: req.vessel.thicknessMm, vesselPathCm: req.vessel.pathCm,
			irradiatedVolumeMl: req.irradiatedVolumeMl, irradiationTimeS: req.irradiationTimeS, quantumYieldUsed: r.quantumYieldUsed,
			fractionAbsorbed: r.fractionAbsorbed, opticalPowerW: null, operator: req.operator ?? locals.user?.name ?? null,
			lampPowerW: lamp.powerW, lampVersion: lamp.version,
			inputs: { ...req, molesProduct: r.molesProduct, basis: r.basis, warnings: r.warnings, outsideTableShare: r.outsideTableShare },
			notes: req.notes ?? null, createdBy: locals.user!.id, measuredAt
		}, trx);
		await audit({ actorId: locals.user!.id, action: 'lamp.calibrate', target: `lamp:${lamp.id}`, groupId: lamp.groupId, details: { calibrationId: newId, method: 'actinometry', actinometer: r.actinometer, photonFluxEinsteinPerS: r.photonFluxEinsteinPerS } }, trx);
		return newId;
	});
	return {
		id, lampId: lamp.id, method: 'actinometry', actinometer: r.actinometer,
		photonFluxEinsteinPerS: r.photonFluxEinsteinPerS, quantumYieldUsed: r.quantumYieldUsed, fractionAbsorbed: r.fractionAbsorbed,
		molesProduct: r.molesProduct, effectiveWavelengthNm: r.effectiveWavelengthNm, basis: r.basis, warnings: r.warnings,
		vessel: { materialId: material.id, materialName: material.name, thicknessMm: req.vessel.thicknessMm, pathCm: req.vessel.pathCm },
		modelPhotonFluxEnteringEinsteinPerS: transmitted(incident), measuredAt: measuredAt.toISOString()
	};
}

const transmitted = (q: Float64Array) => {
	let s = 0;
	for (let i = 0; i < q.length; i++) s += i === 0 || i === q.length - 1 ? q[i] / 2 : q[i];
	return s * GRID.stepNm;
};

/** POST /api/lamps/:id/calibrations `{ kind: 'radiometer', opticalPowerW, vessel }`: a power-meter reading at the vessel. */
export async function recordRadiometer(locals: App.Locals, idParam: string | undefined, body: unknown) {
	const lamp = await visibleLamp(locals, idParam);
	await requireGroupRole(locals, lamp.groupId, 'member');
	const parsed = radiometerRequestSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error);
	const req = parsed.data;
	const material = await wallFor(lamp.groupId, req.vessel.materialId);
	const model = await resolveLampModel(lamp.model, locals);
	const d = describeLamp(model, vesselPowerW(lamp), GRID, lamp.powerW, exposureOf(lamp));
	const flux = radiometerPhotonFlux(req.opticalPowerW, d.spectrum.wavelengthNm, d.spectrum.powerWPerNm, wallT(material, req.vessel.thicknessMm), GRID.stepNm);
	if (!(flux > 0)) throw new ApiError(422, 'physically_invalid', 'vessel: no light of this lamp passes this wall.', { field: 'vessel.materialId' });
	const measuredAt = measuredAtOf(req.measuredAt);
	const id = await db().transaction(async (trx) => {
		const newId = await insertLampCalibration({
			lampId: lamp.id, method: 'radiometer', actinometer: null, concentrationM: null, photonFluxEinsteinPerS: flux, wavelengthNm: null,
			wallMaterialId: material.id, wallThicknessMm: req.vessel.thicknessMm, vesselPathCm: req.vessel.pathCm ?? null, irradiatedVolumeMl: null,
			irradiationTimeS: null, quantumYieldUsed: null, fractionAbsorbed: null, opticalPowerW: req.opticalPowerW,
			operator: req.operator ?? locals.user?.name ?? null, lampPowerW: lamp.powerW, lampVersion: lamp.version, inputs: { ...req },
			notes: req.notes ?? null, createdBy: locals.user!.id, measuredAt
		}, trx);
		await audit({ actorId: locals.user!.id, action: 'lamp.calibrate', target: `lamp:${lamp.id}`, groupId: lamp.groupId, details: { calibrationId: newId, method: 'radiometer', photonFluxEinsteinPerS: flux } }, trx);
		return newId;
	});
	return { id, lampId: lamp.id, method: 'radiometer', photonFluxEinsteinPerS: flux, opticalPowerW: req.opticalPowerW, vessel: { materialId: material.id, materialName: material.name, thicknessMm: req.vessel.thicknessMm }, measuredAt: measuredAt.toISOString() };
}

/** One calibration in API form. */
export function calibrationToApi(c: LampCalibrationRow) {
	return {
		id: c.id, lampId: c.lampId, method: c.method, actinometer: c.actinometer, concentrationM: c.concentrationM,
		photonFluxEinsteinPerS: c.photonFluxEinsteinPerS, effectiveWavelengthNm: c.wavelengthNm,
		vessel: { materialId: c.wallMaterialId, materialName: c.wallMaterialName, thicknessMm: c.wallThicknessMm, pathCm: c.vesselPathCm, irradiatedVolumeMl: c.irradiatedVolumeMl },
		irradiationTimeS: c.irradiationTimeS, quantumYieldUsed: c.quantumYieldUsed, fractionAbsorbed: c.fractionAbsorbed, opticalPowerW: c.opticalPowerW,
		operator: c.operator, lampPowerW: c.lampPowerW, notes: c.notes, createdByName: c.createdByName, measuredAt: new Date(c.measuredAt).toISOString(),
		label: calibrationLabel(c)
	};
}

/** "actinometry, 2026-12-02, ferrioxalate, 1 mm fused silica". */
export function calibrationLabel(c: LampCalibrationRow): string {
	const what = c.method === 'actinometry' ? `actinometry, ${day(c.measuredAt)}, ${c.actinometer ?? 'actinometer'}` : `${c.method}, ${day(c.measuredAt)}`;
	return `${what}, ${wallLabel(c.wallMaterialName ? { name: c.wallMaterialName } : null, c.wallThicknessMm)}`;
}

export interface LampBasis {
	photonFluxBasis: 'actinometry' | 'radiometer' | 'model';
	label: string;
	latest: LampCalibrationRow | null;
	intervalDays: number;
	ageDays: number | null;
	stale: boolean;
}

/** The basis of a lamp's photon flux: its latest calibration (if any) and whether it is older than the group's interval. */
export async function lampBasis(lamp: Pick<LampRow, 'id' | 'groupId'>, calibrations?: LampCalibrationRow[]): Promise<LampBasis> {
	const list = calibrations ?? (await listLampCalibrations(lamp.id));
	const latest = list.find((c) => c.wallMaterialId != null && c.wallThicknessMm != null) ?? null;
	const intervalDays = (await groupCalibrationIntervalDays(lamp.groupId)) ?? DEFAULT_CALIBRATION_INTERVAL_DAYS;
	if (!latest) return { photonFluxBasis: 'model', label: 'model × power × coupling factor (no calibration)', latest: null, intervalDays, ageDays: null, stale: false };
	const ageDays = Math.floor((Date.now() - new Date(latest.measuredAt).getTime()) / 864e5);
	return { photonFluxBasis: latest.method === 'radiometer' ? 'radiometer' : 'actinometry', label: calibrationLabel(latest), latest, intervalDays, ageDays, stale: ageDays > intervalDays };
}

/**
 * The planner's photon flux per nm outside the wall for one lamp: the model × power × coupling, or — after a calibration —
 * the model shape scaled so that the calibration wall lets in exactly the calibrated flux (never the wall twice).
 * `calibrationWall` is returned so that the answer can say how another wall changes it (wallRatioFor).
 */
export async function plannerPhotonFlux(lamp: LampRow, modelPhotonFluxPerNm: Float64Array, groupIds: number[]) {
	const basis = await lampBasis(lamp);
	const c = basis.latest;
	if (!c) return { photonFluxPerNm: modelPhotonFluxPerNm, basis, calibrationWall: null as Float64Array | null };
	const material = await getWallMaterial(c.wallMaterialId!, [lamp.groupId, ...groupIds]);
	if (!material) return { photonFluxPerNm: modelPhotonFluxPerNm, basis: { ...basis, photonFluxBasis: 'model' as const, label: `model (the calibration wall #${c.wallMaterialId} is no longer available)` }, calibrationWall: null };
	const tCal = wallT(material, c.wallThicknessMm!);
	const scaled = calibratedPhotonFluxPerNm(modelPhotonFluxPerNm, tCal, c.photonFluxEinsteinPerS, GRID.stepNm);
	return { photonFluxPerNm: scaled.photonFluxPerNm, basis, calibrationWall: tCal };
}

/** For the Window answer: the lamp's basis and, when calibrated, the factor the planner's wall applies versus the calibration wall. */
export function calibrationNote(entry: { basis: LampBasis; photonFluxPerNm: Float64Array; calibrationWall: Float64Array | null }, plannerWall: ArrayLike<number>) {
	if (!entry.calibrationWall || !entry.basis.latest) return { photonFluxBasis: entry.basis.photonFluxBasis, label: entry.basis.label, wallRatio: null, stale: false };
	return {
		photonFluxBasis: entry.basis.photonFluxBasis,
		label: entry.basis.label,
		// ∫q·T_planner / ∫q·T_calibration (1 for the calibration wall itself)
		wallRatio: wallRatio(entry.photonFluxPerNm, entry.calibrationWall, plannerWall, GRID.stepNm),
		stale: entry.basis.stale
	};
}

/** GET /api/lamps/:id/calibrations. */
export async function calibrationsFor(locals: App.Locals, idParam: string | undefined) {
	const lamp = await visibleLamp(locals, idParam);
	return (await listLampCalibrations(lamp.id)).map(calibrationToApi);
}

/** Whether the caller may record calibrations for / set the interval of this lamp's group. */
export async function calibrationRights(locals: App.Locals, lamp: Pick<LampRow, 'groupId'>) {
	if (locals.user?.siteRole === 'admin') return { canCalibrate: true, canSetInterval: true };
	const role = (await membershipsOf(locals.user?.id)).find((m) => m.groupId === lamp.groupId)?.role;
	return { canCalibrate: roleAtLeast(role, 'member'), canSetInterval: role === 'lead' };
}
