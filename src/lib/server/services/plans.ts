/**
 * Irradiation plans: a saved Window finder run with the decision taken (lamp, wall, solvent, path, time, safety
 * measures) and the numbers for those conditions, recomputed on the server. Review lives in planReview.ts.
 * States: draft → submitted (author) → approved or returned (another lead, or an admin); returned → submitted again.
 */
import { planCreateSchema, planListQuerySchema, planPatchSchema } from '$lib/schemas/plans';
import { audit } from '$lib/server/db/audit';
import { db } from '$lib/server/db';
import { findPlan, findPlanByIdempotencyKey, insertPlan, listPlans, updatePlanIfVersion, type PlanRow, type PlanState } from '$lib/server/db/plans';
import { ApiError, forbidden, zodToApiError } from '$lib/server/http';
import { membershipsOf, requireGroupRole, requireUser, roleAtLeast } from '$lib/server/policy';
import { groupForNewRow, loadGroupRow, requireMemberSomewhere } from './groupChoice';
import { applyDecision, completeDecision, computePlanResults, intendedAbsorberId, withDecided, type PlanDecision } from './planDecision';

/** Plans of the caller's groups (filters: state, lamp, substrate); submitted ones first. */
export async function plansFor(locals: App.Locals, query: URLSearchParams | Record<string, string> = {}): Promise<PlanRow[]> {
	const user = requireUser(locals);
	const raw = query instanceof URLSearchParams ? Object.fromEntries(query) : query;
	const parsed = planListQuerySchema.safeParse(Object.fromEntries(Object.entries(raw).filter(([, v]) => v !== '')));
	if (!parsed.success) throw zodToApiError(parsed.error);
	const groupIds = (await membershipsOf(user.id)).map((m) => m.groupId);
	return listPlans(groupIds, { state: parsed.data.state, lampId: parsed.data.lamp, absorberSpectrumId: parsed.data.substrate });
}

/** A plan the caller may see (404 otherwise). */
export const visiblePlan = (locals: App.Locals, idParam: string | undefined) => loadGroupRow(locals, idParam, findPlan, 'plan');

/** The caller's role in the plan's group ('admin' for site admins). */
export async function roleInPlanGroup(locals: App.Locals, plan: PlanRow): Promise<'admin' | 'lead' | 'member' | 'viewer' | null> {
	const user = requireUser(locals);
	if (user.siteRole === 'admin') return 'admin';
	return (await membershipsOf(user.id)).find((m) => m.groupId === plan.groupId)?.role ?? null;
}

const bestLampOf = (results: { lamps?: { id: number }[] }) => results.lamps?.[0]?.id ?? null;

/**
 * Saves a draft plan (member+ of the group). The results are computed here for the decided conditions, never taken
 * from the client. With an `idempotencyKey`, a repeated save (double click, retried request) returns the plan saved
 * the first time (`created: false`); the unique (author, key) index makes that hold under concurrent requests too.
 */
export async function createPlan(locals: App.Locals, body: unknown): Promise<{ plan: PlanRow; created: boolean }> {
	const user = requireUser(locals);
	await requireMemberSomewhere(locals);
	const parsed = planCreateSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error);
	const { title, query, decision: partial, idempotencyKey } = parsed.data;
	if (idempotencyKey) {
		const again = await findPlanByIdempotencyKey(user.id, idempotencyKey);
		if (again) return { plan: again, created: false };
	}
	const groupId = parsed.data.groupId ?? (await groupForNewRow(locals));
	await requireGroupRole(locals, groupId, 'member');
	const inputs0 = { ...parsed.data.inputs, ...(query ? { query } : {}) };
	// A first pass ranks the lamps when no lamp was chosen; the decision then fixes wall, solvent and path.
	const preliminary = partial?.lampId ? null : await computePlanResults(locals, inputs0, null);
	const decision = await completeDecision(partial, inputs0, groupId, preliminary ? bestLampOf(preliminary) : null);
	const inputs = applyDecision(inputs0, decision);
	// The first pass already holds these numbers when the decision kept the inputs' conditions.
	const results =
		preliminary && JSON.stringify(inputs) === JSON.stringify(inputs0) ? await withDecided(locals, preliminary, decision) : await computePlanResults(locals, inputs, decision);
	try {
		const id = await db().transaction(async (trx) => {
			const id = await insertPlan(
				{ groupId, ownerId: user.id, title, inputs, decision, results, lampId: decision.lampId, absorberSpectrumId: intendedAbsorberId(inputs), idempotencyKey: idempotencyKey ?? null },
				trx
			);
			await audit({ actorId: user.id, action: 'plan.create', target: `plan:${id}`, groupId, details: { title, lampId: decision.lampId } }, trx);
			return id;
		});
		return { plan: (await findPlan(id))!, created: true };
	} catch (e) {
		// The concurrent twin of a double submit lost the race on the unique index: answer with the winner.
		if (idempotencyKey && (e as { code?: string }).code === 'ER_DUP_ENTRY') {
			const again = await findPlanByIdempotencyKey(user.id, idempotencyKey);
			if (again) return { plan: again, created: false };
		}
		throw e;
	}
}

/** 409 unless the plan is in one of `allowed`. */
export function expectState(plan: PlanRow, allowed: PlanState[], action: string): void {
	if (!allowed.includes(plan.state)) throw new ApiError(409, 'wrong_state', `A ${plan.state} plan cannot be ${action}; it must be ${allowed.join(' or ')}.`, { field: 'state', state: plan.state });
}

/** 409 when the caller's version is not the plan's. */
export function expectVersion(plan: PlanRow, version: number | undefined): void {
	if (version !== undefined && version !== plan.version) throw staleVersion(plan.version);
}

export const staleVersion = (current?: number) =>
	new ApiError(409, 'version_conflict', 'The plan changed since you loaded it; reload it and try again.', { field: 'version', ...(current ? { currentVersion: current } : {}) });

/** Edits title, inputs or decision (the author, while draft or returned); the numbers are recomputed. */
export async function patchPlan(locals: App.Locals, idParam: string | undefined, body: unknown): Promise<PlanRow> {
	const plan = await visiblePlan(locals, idParam);
	const user = locals.user!;
	if (plan.ownerId !== user.id) throw forbidden('Only the plan’s author may edit it.');
	await requireGroupRole(locals, plan.groupId, 'member');
	expectState(plan, ['draft', 'returned'], 'edited');
	const parsed = planPatchSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error);
	expectVersion(plan, parsed.data.version);
	const { title, decision: partial, query } = parsed.data;
	let inputs = parsed.data.inputs ? { ...parsed.data.inputs, ...(query ? { query } : {}) } : plan.inputs;
	if (!parsed.data.inputs && query) inputs = { ...inputs, query };
	// New inputs take their wall, solvent and path with them unless the decision names others.
	const previous = parsed.data.inputs ? { ...(plan.decision as PlanDecision), wall: undefined, solventId: undefined, pathCm: undefined } : (plan.decision as PlanDecision | null);
	const decision = await completeDecision(partial, inputs, plan.groupId, plan.lampId, previous as PlanDecision);
	inputs = applyDecision(inputs, decision);
	const results = await computePlanResults(locals, inputs, decision);
	await db().transaction(async (trx) => {
		const n = await updatePlanIfVersion(plan.id, plan.version, { title, inputs, decision, results, lampId: decision.lampId, absorberSpectrumId: intendedAbsorberId(inputs) }, trx, ['draft', 'returned']);
		if (!n) throw staleVersion();
		await audit({ actorId: user.id, action: 'plan.update', target: `plan:${plan.id}`, groupId: plan.groupId, details: { fields: Object.keys(parsed.data).filter((k) => k !== 'version') } }, trx);
	});
	return (await findPlan(plan.id))!;
}

/** The JSON shape of a plan. */
export function planToApi(p: PlanRow, withResults = true) {
	return {
		id: p.id,
		groupId: p.groupId,
		title: p.title,
		state: p.state,
		owner: { id: p.ownerId, name: p.ownerName },
		reviewer: p.reviewerId ? { id: p.reviewerId, name: p.reviewerName } : null,
		reviewComment: p.reviewComment,
		lamp: p.lampId ? { id: p.lampId, name: p.lampName } : null,
		absorber: p.absorberSpectrumId ? { spectrumId: p.absorberSpectrumId, name: p.absorberName } : null,
		decision: p.decision,
		inputs: p.inputs,
		...(withResults ? { results: p.results } : {}),
		version: p.version,
		submittedAt: p.submittedAt,
		reviewedAt: p.reviewedAt,
		createdAt: p.createdAt,
		updatedAt: p.updatedAt
	};
}

/** Whether the caller reviews plans of this group: a lead of it or a site admin. */
export const isReviewerRole = (role: string | null) => role === 'admin' || roleAtLeast(role as 'lead', 'lead');
