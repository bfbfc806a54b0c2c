/**
 * "What changed since approval?": recomputes a plan's inputs and decision with today's reference data, spectra and
 * lamp calibrations and lists the differences field by field. Nothing is stored unless `{ save: true }`; a saved
 * recomputation becomes a new revision of the plan (an approved plan goes back to draft for a new review) while the
 * approved revision stays readable.
 */
import { planRecomputeSchema } from '$lib/schemas/plans';
import { db } from '$lib/server/db';
import { audit } from '$lib/server/db/audit';
import { insertPlanRevision } from '$lib/server/db/planRevisions';
import { findPlan, updatePlanIfVersion, type PlanRow } from '$lib/server/db/plans';
import { forbidden, zodToApiError } from '$lib/server/http';
import { computePlanResults, type PlanDecision } from './planDecision';
import { expectState, expectVersion, isReviewerRole, roleInPlanGroup, staleVersion, visiblePlan } from './plans';

export interface FieldChange {
	field: string;
	before: string | number | null;
	after: string | number | null;
}

type R = Record<string, unknown>;
const o = (v: unknown): R => (v && typeof v === 'object' ? (v as R) : {});
const arr = (v: unknown): R[] => (Array.isArray(v) ? (v as R[]) : []);
const scalar = (v: unknown): string | number | null => (typeof v === 'number' || typeof v === 'string' ? v : typeof v === 'boolean' ? String(v) : null);

/** The fields a reviewer compares, flattened to path → value. */
export function comparableFields(results: R): Map<string, string | number | null> {
	const out = new Map<string, string | number | null>();
	const put = (k: string, v: unknown) => out.set(k, scalar(v));
	put('windows', arr(results.windows).map((w) => `${w.fromNm}–${w.toNm} nm`).join('; ') || 'none');
	const solvent = o(results.solvent);
	put('solvent.cutoffNm', solvent.cutoffNm);
	put('solvent.basis', solvent.basis);
	put('wall.source', o(results.wall).source);
	const band = o(results.wallTransmissionAtBandMaximum);
	if (band.wavelengthNm !== undefined) {
		put('wallTransmissionAtBandMaximum.wavelengthNm', band.wavelengthNm);
		put('wallTransmissionAtBandMaximum.transmission', band.transmission);
	}
	const d = o(results.decided);
	for (const k of ['photonFluxBasisLabel', 'peakNm', 'incidentPhotonFluxEinsteinPerS', 'absorbedPhotonFluxEinsteinPerS', 'absorbedByIntendedEinsteinPerS', 'selectivity', 'timeTo90PctS', 'powerW', 'couplingFactor']) {
		if (k in d) put(`decided.${k}`, d[k]);
	}
	if ('cautions' in d) put('decided.cautions', arr(d.cautions).map((c) => String(c.title)).join('; '));
	for (const l of arr(results.lamps)) {
		const key = `lamps[${l.name}]`;
		for (const k of ['incidentPhotonFluxEinsteinPerS', 'absorbedPhotonFluxEinsteinPerS', 'selectivity', 'timeTo90PctS', 'photonFluxBasis', 'photostationaryProductFraction']) {
			if (k in l) put(`${key}.${k}`, l[k]);
		}
	}
	put('cautions', arr(results.cautions).map((c) => String(c.code)).join(', '));
	return out;
}

/** Numbers that agree to 1 part in 10⁶ are the same (floating-point noise between runs is far below that). */
const same = (a: string | number | null, b: string | number | null) =>
	typeof a === 'number' && typeof b === 'number' ? Math.abs(a - b) <= 1e-6 * Math.max(Math.abs(a), Math.abs(b)) : a === b;

/** The field-by-field differences between two result sets (fields present on either side). */
export function diffResults(before: R, after: R): FieldChange[] {
	const a = comparableFields(before);
	const b = comparableFields(after);
	const keys = [...new Set([...a.keys(), ...b.keys()])];
	return keys.filter((k) => !same(a.get(k) ?? null, b.get(k) ?? null)).map((k) => ({ field: k, before: a.get(k) ?? null, after: b.get(k) ?? null }));
}

/** POST /api/plans/:id/recompute (the author, a lead of the group, an admin). */
export async function recomputePlan(locals: App.Locals, idParam: string | undefined, body: unknown): Promise<{ changes: FieldChange[]; saved: boolean; plan: PlanRow; revision?: number }> {
	const plan = await visiblePlan(locals, idParam);
	const user = locals.user!;
	const role = await roleInPlanGroup(locals, plan);
	if (plan.ownerId !== user.id && !isReviewerRole(role)) throw forbidden('Only the plan’s author or a lead of the group may recompute it.');
	const parsed = planRecomputeSchema.safeParse(body ?? {});
	if (!parsed.success) throw zodToApiError(parsed.error);
	const results = await computePlanResults(locals, plan.inputs, plan.decision as PlanDecision | null);
	const changes = diffResults(plan.results, results);
	if (!parsed.data.save) return { changes, saved: false, plan };
	expectState(plan, ['draft', 'returned', 'approved'], 'recomputed while under review');
	expectVersion(plan, parsed.data.version);
	const nextState = plan.state === 'approved' ? 'draft' : plan.state;
	const revision = await db().transaction(async (trx) => {
		const n = await updatePlanIfVersion(plan.id, plan.version, { results, state: nextState, ...(plan.state === 'approved' ? { reviewerId: null, reviewComment: null, reviewedAt: null } : {}) }, trx, [plan.state]);
		if (!n) throw staleVersion();
		const revision = await insertPlanRevision({ planId: plan.id, reason: 'recomputed', state: nextState, inputs: plan.inputs, decision: plan.decision, results, changes, createdBy: user.id }, trx);
		await audit({ actorId: user.id, action: 'plan.recompute', target: `plan:${plan.id}`, groupId: plan.groupId, details: { revision, from: plan.state, to: nextState, changes: changes.length } }, trx);
		return revision;
	});
	return { changes, saved: true, plan: (await findPlan(plan.id))!, revision };
}
