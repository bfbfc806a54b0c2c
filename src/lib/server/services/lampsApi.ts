/** Orchestration of /api/lamps and the /lamps pages: validate → authorise → persist → describe. */
import { lampCreateSchema, lampPatchSchema } from '$lib/schemas/lamps';
import { findLamp, insertLamp, listLampCalibrations, listLamps, updateLampIfVersion, type LampRow } from '$lib/server/db/lamps';
import { ApiError, zodToApiError } from '$lib/server/http';
import { membershipsOf, requireGroupRole, requireUser, roleAtLeast } from '$lib/server/policy';
import { groupForNewRow, loadGroupRow, requireMemberSomewhere } from './groupChoice';
import { calibrationToApi, lampBasis } from './lampCalibrations';
import { describeLamp, describeModel, exposureOf, resolveLamp, resolveLampModel, vesselPowerW } from './lamps';

/**
 * The JSON shape of a lamp (API.md: name, powerW, model, peakNm, photonFluxEinsteinPerS; after a calibration
 * photonFluxBasis 'actinometry' | 'radiometer' and calibrations). photonFluxEinsteinPerS is the calibrated flux entering
 * the solution through the calibration vessel when there is one, else the model × power × coupling flux at the vessel
 * (`modelPhotonFluxEinsteinPerS` always gives the latter).
 */
export async function lampToApi(lamp: LampRow, locals: App.Locals) {
	let derived: { peakNm: number | null; modelPhotonFluxEinsteinPerS: number | null; problem?: string; warnings: string[]; emission?: unknown; exposure?: ReturnType<typeof describeLamp>['exposure'] } = { peakNm: null, modelPhotonFluxEinsteinPerS: null, warnings: [] };
	try {
		const resolved = await resolveLamp(lamp.model, locals);
		const d = describeLamp(resolved.model, vesselPowerW(lamp), undefined, lamp.powerW, exposureOf(lamp));
		const warnings = [...(resolved.emission?.warnings ?? [])];
		if (d.spectrum.outsideGridFraction > 0.001) warnings.push(`${(d.spectrum.outsideGridFraction * 100).toPrecision(2)} % of the lamp's optical power lies outside 190–1100 nm (e.g. the 185 nm mercury line) and is not part of the planner's photon flux.`);
		derived = { peakNm: d.peakNm, modelPhotonFluxEinsteinPerS: d.photonFluxEinsteinPerS, warnings, emission: resolved.emission, exposure: d.exposure };
	} catch (e) {
		derived.problem = e instanceof Error ? e.message : String(e);
	}
	const calibrations = await listLampCalibrations(lamp.id);
	const basis = await lampBasis(lamp, calibrations);
	return {
		id: lamp.id,
		groupId: lamp.groupId,
		name: lamp.name,
		powerW: lamp.powerW,
		couplingFactor: lamp.couplingFactor,
		distanceNote: lamp.distanceNote,
		exposureDistanceCm: lamp.exposureDistanceCm,
		exposureIrradianceWPerM2: lamp.exposureIrradianceWPerM2,
		exposure: derived.exposure ?? null,
		notes: lamp.notes,
		model: lamp.model,
		modelLabel: describeModel(lamp.model),
		version: lamp.version,
		...derived,
		photonFluxEinsteinPerS: basis.latest ? basis.latest.photonFluxEinsteinPerS : derived.modelPhotonFluxEinsteinPerS,
		photonFluxBasis: basis.photonFluxBasis,
		photonFluxBasisLabel: basis.label,
		calibrationIntervalDays: basis.intervalDays,
		calibrationAgeDays: basis.ageDays,
		calibrationStale: basis.stale,
		calibrations: calibrations.map(calibrationToApi)
	};
}

/** Lamps of every group the caller belongs to (401 when anonymous). */
export async function listLampsFor(locals: App.Locals): Promise<LampRow[]> {
	const user = requireUser(locals);
	const ms = await membershipsOf(user.id);
	return listLamps(ms.map((m) => m.groupId));
}

/** A lamp the caller may see (404 otherwise, never revealing another group's lamp). */
export const visibleLamp = (locals: App.Locals, idParam: string | undefined) => loadGroupRow(locals, idParam, findLamp, 'lamp');

/** Creates a lamp in the caller's group (member+). Validates the model by computing it. */
export async function createLamp(locals: App.Locals, body: unknown): Promise<LampRow> {
	await requireMemberSomewhere(locals);
	const parsed = lampCreateSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error);
	const input = parsed.data;
	requireDistanceForReading(input.exposureDistanceCm, input.exposureIrradianceWPerM2);
	const groupId = input.groupId ?? (await groupForNewRow(locals));
	await requireGroupRole(locals, groupId, 'member');
	checkComputable(await resolveLampModel(input.model, locals), input.powerW);
	try {
		const id = await insertLamp({
			groupId,
			ownerId: locals.user!.id,
			name: input.name,
			model: input.model,
			powerW: input.powerW,
			couplingFactor: input.couplingFactor ?? 1,
			distanceNote: input.distanceNote ?? null,
			exposureDistanceCm: input.exposureDistanceCm ?? null,
			exposureIrradianceWPerM2: input.exposureIrradianceWPerM2 ?? null,
			notes: input.notes ?? null
		});
		return (await findLamp(id))!;
	} catch (e) {
		if ((e as { code?: string }).code === 'ER_DUP_ENTRY') throw new ApiError(409, 'duplicate', `The group already has a lamp named “${input.name}”.`, { field: 'name' });
		throw e;
	}
}

/** Changes a lamp (member+ of its group); `version` guards against stale saves (409). */
export async function patchLamp(locals: App.Locals, idParam: string | undefined, body: unknown): Promise<LampRow> {
	const lamp = await visibleLamp(locals, idParam);
	const role = await requireGroupRole(locals, lamp.groupId, 'member');
	if (role !== 'admin' && !roleAtLeast(role, 'member')) throw new ApiError(403, 'forbidden', 'Members and leads may change lamps.');
	const parsed = lampPatchSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error);
	const { version, ...patch } = parsed.data;
	requireDistanceForReading(
		patch.exposureDistanceCm !== undefined ? patch.exposureDistanceCm : lamp.exposureDistanceCm,
		patch.exposureIrradianceWPerM2 !== undefined ? patch.exposureIrradianceWPerM2 : lamp.exposureIrradianceWPerM2
	);
	if (patch.model || patch.powerW) checkComputable(await resolveLampModel(patch.model ?? lamp.model, locals), patch.powerW ?? lamp.powerW);
	const changed = await updateLampIfVersion(lamp.id, version ?? lamp.version, patch);
	if (!changed) throw new ApiError(409, 'version_conflict', 'Someone changed this lamp since you loaded it; reload and apply your change again.', { field: 'version' });
	return (await findLamp(lamp.id))!;
}

/** A radiometer reading means nothing without the distance it was taken at (400 naming exposureDistanceCm). */
function requireDistanceForReading(distanceCm: number | null | undefined, irradiance: number | null | undefined) {
	if (irradiance != null && distanceCm == null)
		throw new ApiError(400, 'invalid', 'exposureDistanceCm: state the distance at which the irradiance was measured.', { field: 'exposureDistanceCm' });
}

function checkComputable(model: Parameters<typeof describeLamp>[0], powerW: number) {
	try {
		describeLamp(model, powerW);
	} catch (e) {
		const msg = e instanceof Error ? e.message : String(e);
		throw new ApiError(422, 'invalid_model', `model.${msg}`, { field: `model.${msg.split(':')[0]}` });
	}
}
