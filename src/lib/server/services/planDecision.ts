/**
 * What a plan decides and what that means for its numbers: the decision (chosen lamp, wall and thickness, solvent,
 * path, irradiation time, safety measures) is completed from the Window-finder inputs, checked against the group's
 * lamps and the reference data, and folded back into the inputs, so the frozen results are always those of the
 * decided conditions. The chosen lamp's own summary (flux, basis, cautions) is frozen with the results.
 */
import { planDecisionSchema, type PlanDecisionInput } from '$lib/schemas/plans';
import { findLamp, listLampCalibrations } from '$lib/server/db/lamps';
import { getSolvent } from '$lib/server/db/solvents';
import { getWallMaterial } from '$lib/server/db/wallMaterials';
import { ApiError, zodToApiError } from '$lib/server/http';
import { describeModel } from './lamps';
import { lampsOnGrid } from './windowInputs';
import { callerOf } from './spectraAccess';
import { computeWindowFor } from './window';

export type PlanDecision = PlanDecisionInput;

type Inputs = Record<string, unknown>;
const obj = (v: unknown): Record<string, unknown> => (v && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : {});

const invalid = (field: string, message: string) => new ApiError(422, 'physically_invalid', `${field}: ${message}`, { field });

/** The spectrum the plan's light is meant for: the photocatalyst in photocatalytic mode, else the substrate. */
export function intendedAbsorberId(inputs: Inputs): number | null {
	const reaction = obj(inputs.reaction);
	const id = reaction.type === 'photocatalytic' ? obj(reaction.photocatalyst).spectrumId : obj(inputs.substrate).spectrumId;
	return Number.isInteger(id) && (id as number) > 0 ? (id as number) : null;
}

/**
 * Completes a (partial) decision from the inputs and the best-ranked lamp of `results`, validates it (400 types,
 * 422 impossible numbers or unknown lamp / wall / solvent, field named `decision.…`).
 */
export async function completeDecision(partial: Partial<PlanDecision> | undefined, inputs: Inputs, groupId: number, bestLampId: number | null, previous?: PlanDecision | null): Promise<PlanDecision> {
	const wall = obj(inputs.wall);
	const merged = {
		lampId: partial?.lampId ?? previous?.lampId ?? bestLampId ?? undefined,
		wall: partial?.wall ?? previous?.wall ?? { materialId: wall.materialId, thicknessMm: wall.thicknessMm },
		solventId: partial?.solventId ?? previous?.solventId ?? obj(inputs.solvent).id,
		pathCm: partial?.pathCm ?? previous?.pathCm ?? inputs.pathCm ?? null,
		irradiationTimeS: partial && 'irradiationTimeS' in partial ? partial.irradiationTimeS : previous?.irradiationTimeS,
		safetyMeasures: partial && 'safetyMeasures' in partial ? partial.safetyMeasures : previous?.safetyMeasures,
		temperatureC: partial && 'temperatureC' in partial ? partial.temperatureC : previous?.temperatureC,
		notes: partial && 'notes' in partial ? partial.notes : previous?.notes
	};
	const parsed = planDecisionSchema.safeParse(merged);
	if (!parsed.success) {
		const e = zodToApiError(parsed.error);
		throw new ApiError(400, e.code, `decision.${e.message}`, { ...e.extra, field: e.extra.field ? `decision.${e.extra.field}` : 'decision' });
	}
	const d = parsed.data;
	const vesselShape = String(obj(inputs.vessel).shape ?? 'slab');
	if (d.pathCm == null && vesselShape === 'slab') throw invalid('decision.pathCm', 'a flat vessel needs its optical path in cm');
	if (d.pathCm != null && d.pathCm <= 0) throw invalid('decision.pathCm', 'the optical path must be above 0 cm');
	if (d.pathCm != null && d.pathCm > 100) throw invalid('decision.pathCm', 'an optical path above 100 cm is not a vessel');
	if (d.wall.thicknessMm <= 0) throw invalid('decision.wall.thicknessMm', 'the wall thickness must be above 0 mm');
	if (d.wall.thicknessMm > 100) throw invalid('decision.wall.thicknessMm', 'the wall thickness must be at most 100 mm');
	if (d.irradiationTimeS != null && d.irradiationTimeS <= 0) throw invalid('decision.irradiationTimeS', 'the irradiation time must be above 0 s');
	if (d.irradiationTimeS != null && d.irradiationTimeS > 90 * 86400) throw invalid('decision.irradiationTimeS', 'more than 90 days of irradiation is not a plan');
	// −196 °C (liquid nitrogen) to 300 °C brackets every liquid-phase photoreactor (common practice).
	if (d.temperatureC != null && (d.temperatureC < -196 || d.temperatureC > 300)) throw invalid('decision.temperatureC', 'the temperature must lie between −196 and 300 °C');
	const lamp = await findLamp(d.lampId);
	if (!lamp || lamp.groupId !== groupId) throw invalid('decision.lampId', `no lamp with id ${d.lampId} in the plan's group`);
	if (!(await getSolvent(d.solventId))) throw invalid('decision.solventId', `no solvent with id ${d.solventId}`);
	if (!(await getWallMaterial(d.wall.materialId, [groupId]))) throw invalid('decision.wall.materialId', `no wall material with id ${d.wall.materialId}`);
	return { ...d, pathCm: d.pathCm ?? null, irradiationTimeS: d.irradiationTimeS ?? null, safetyMeasures: d.safetyMeasures || null, temperatureC: d.temperatureC ?? null, notes: d.notes || null };
}

/** The inputs with the decided wall, solvent and path, and the chosen lamp among the compared lamps. */
export function applyDecision(inputs: Inputs, d: PlanDecision): Inputs {
	const out: Inputs = { ...inputs, wall: { ...obj(inputs.wall), materialId: d.wall.materialId, thicknessMm: d.wall.thicknessMm }, solvent: { id: d.solventId }, ...(d.pathCm != null ? { pathCm: d.pathCm } : {}) };
	if (Array.isArray(inputs.lamps) && inputs.lamps.length && !inputs.lamps.includes(d.lampId)) out.lamps = [...inputs.lamps, d.lampId];
	return out;
}

/** The request body for POST /api/window from stored inputs (the link query is not part of it). */
export function windowBody(inputs: Inputs): Inputs {
	const { query: _query, ...body } = inputs;
	return { ...body, includeCurves: true };
}

/** How a lamp's photon flux is known: its latest calibration (with date) or the emission model. */
export async function photonFluxBasisOf(lampId: number): Promise<{ basis: 'model' | 'actinometry' | 'radiometry'; method: string | null; measuredAt: string | null; label: string }> {
	const [latest] = await listLampCalibrations(lampId);
	if (!latest) return { basis: 'model', method: null, measuredAt: null, label: 'model: emission model × optical power × coupling factor' };
	const date = new Date(latest.measuredAt).toISOString().slice(0, 10);
	const basis = /radiomet|thermopile|photodiode|power ?meter/i.test(latest.method) ? 'radiometry' : 'actinometry';
	return { basis, method: latest.method, measuredAt: date, label: `${basis}: ${latest.method}, ${date}` };
}

/** Computes the Window-finder answer for the decided conditions and adds the frozen summary of the chosen lamp. */
export async function computePlanResults(locals: App.Locals, inputs: Inputs, d: PlanDecision | null) {
	const results = (await computeWindowFor(locals, windowBody(inputs))) as Record<string, unknown> & { lamps: { id: number; name: string }[] };
	if (!d) return results;
	return withDecided(locals, results, d);
}

/** Adds the frozen summary of the chosen lamp to computed results. */
export async function withDecided<T extends { lamps: { id: number; name: string }[] }>(locals: App.Locals, results: T, d: PlanDecision) {
	return { ...results, decided: await decidedLampSummary(locals, d, results.lamps) };
}

/** The chosen lamp as the plan freezes it: description, power, distance, photon flux and its basis, numbers, cautions. */
async function decidedLampSummary(locals: App.Locals, d: PlanDecision, ranked: { id: number; name: string }[]) {
	const lamp = await findLamp(d.lampId);
	if (!lamp) throw invalid('decision.lampId', `no lamp with id ${d.lampId}`);
	const caller = await callerOf(locals);
	const [onGrid] = await lampsOnGrid(locals, caller, [d.lampId]);
	const row = ranked.find((r) => r.id === d.lampId) as Record<string, unknown> | undefined;
	const basis = await photonFluxBasisOf(d.lampId);
	const model = lamp.model as Record<string, unknown>;
	return {
		lampId: lamp.id,
		name: lamp.name,
		modelLabel: describeModel(lamp.model),
		model: lamp.model,
		fwhmNm: typeof model.fwhmNm === 'number' ? model.fwhmNm : null,
		peakNm: onGrid?.peakNm ?? null,
		powerW: lamp.powerW,
		couplingFactor: lamp.couplingFactor,
		distanceNote: lamp.distanceNote,
		photonFluxBasis: basis.basis,
		photonFluxBasisLabel: basis.label,
		calibratedAt: basis.measuredAt,
		incidentPhotonFluxEinsteinPerS: (row?.incidentPhotonFluxEinsteinPerS as number) ?? null,
		absorbedPhotonFluxEinsteinPerS: (row?.absorbedPhotonFluxEinsteinPerS as number) ?? null,
		absorbedByIntendedEinsteinPerS: (row?.absorbedByIntendedEinsteinPerS as number) ?? (row?.absorbedPhotonFluxEinsteinPerS as number) ?? null,
		selectivity: (row?.selectivity as number) ?? null,
		timeTo90PctS: (row?.timeTo90PctS as number | null) ?? null,
		unreachableReason: (row?.unreachableReason as string) ?? null,
		cautions: onGrid?.cautions ?? []
	};
}
