/**
 * Irradiation plans: a saved Window finder run (inputs + results recomputed on the server) and its review:
 * draft → submitted (owner) → approved or returned (a lead of the group, with a comment); returned → submitted again.
 */
import { planCreateSchema, planPatchSchema, planReviewSchema } from '$lib/schemas/plans';
import { findPlan, insertPlan, listPlans, updatePlanIfVersion, type PlanRow, type PlanState } from '$lib/server/db/plans';
import { ApiError, forbidden, zodToApiError } from '$lib/server/http';
import { membershipsOf, requireGroupRole, requireUser, roleAtLeast } from '$lib/server/policy';
import { groupForNewRow, loadGroupRow, requireMemberSomewhere } from './groupChoice';
import { computeWindowFor } from './window';

/** Plans of the caller's groups. */
export async function plansFor(locals: App.Locals): Promise<PlanRow[]> {
	const user = requireUser(locals);
	return listPlans((await membershipsOf(user.id)).map((m) => m.groupId));
}

/** A plan the caller may see (404 otherwise). */
export const visiblePlan = (locals: App.Locals, idParam: string | undefined) => loadGroupRow(locals, idParam, findPlan, 'plan');

/** Saves a draft plan (member+); the results are computed here from the inputs, never taken from the client. */
export async function createPlan(locals: App.Locals, body: unknown): Promise<PlanRow> {
	const user = requireUser(locals);
	const parsed = planCreateSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error);
	await requireMemberSomewhere(locals);
	const groupId = parsed.data.groupId ?? (await groupForNewRow(locals));
	await requireGroupRole(locals, groupId, 'member');
	const results = await computeWindowFor(locals, { ...parsed.data.inputs, includeCurves: true });
	const id = await insertPlan({ groupId, ownerId: user.id, title: parsed.data.title, inputs: { ...parsed.data.inputs, query: parsed.data.query }, results });
	return (await findPlan(id))!;
}

async function move(plan: PlanRow, version: number | undefined, patch: Parameters<typeof updatePlanIfVersion>[2]): Promise<PlanRow> {
	const n = await updatePlanIfVersion(plan.id, version ?? plan.version, patch);
	if (!n) throw new ApiError(409, 'version_conflict', 'The plan changed since you loaded it; reload it.', { field: 'version' });
	return (await findPlan(plan.id))!;
}

const expectState = (plan: PlanRow, allowed: PlanState[], action: string) => {
	if (!allowed.includes(plan.state)) throw new ApiError(409, 'wrong_state', `A ${plan.state} plan cannot be ${action}.`, { field: 'state' });
};

/** Edits title or inputs (owner, draft or returned); inputs are recomputed. */
export async function patchPlan(locals: App.Locals, idParam: string | undefined, body: unknown): Promise<PlanRow> {
	const plan = await visiblePlan(locals, idParam);
	if (plan.ownerId !== locals.user!.id) throw forbidden('Only the plan’s author may edit it.');
	expectState(plan, ['draft', 'returned'], 'edited');
	const parsed = planPatchSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error);
	const results = parsed.data.inputs ? await computeWindowFor(locals, { ...parsed.data.inputs, includeCurves: true }) : undefined;
	return move(plan, parsed.data.version, { title: parsed.data.title, inputs: parsed.data.inputs, results });
}

/** Submits for review (the author). */
export async function submitPlan(locals: App.Locals, idParam: string | undefined, body: unknown): Promise<PlanRow> {
	const plan = await visiblePlan(locals, idParam);
	if (plan.ownerId !== locals.user!.id) throw forbidden('Only the plan’s author may submit it.');
	expectState(plan, ['draft', 'returned'], 'submitted');
	const parsed = planReviewSchema.safeParse(body ?? {});
	if (!parsed.success) throw zodToApiError(parsed.error);
	return move(plan, parsed.data.version, { state: 'submitted' });
}

/** Approves or returns a submitted plan (a lead of its group, or an admin). Returning needs a comment. */
export async function reviewPlan(locals: App.Locals, idParam: string | undefined, body: unknown, verdict: 'approved' | 'returned'): Promise<PlanRow> {
	const plan = await visiblePlan(locals, idParam);
	const user = locals.user!;
	const role = (await membershipsOf(user.id)).find((m) => m.groupId === plan.groupId)?.role;
	if (user.siteRole !== 'admin' && !roleAtLeast(role, 'lead')) throw forbidden('Only a lead of the group reviews plans.');
	expectState(plan, ['submitted'], verdict);
	const parsed = planReviewSchema.safeParse(body ?? {});
	if (!parsed.success) throw zodToApiError(parsed.error);
	if (verdict === 'returned' && !parsed.data.comment) throw new ApiError(400, 'invalid', 'comment: say what to change when returning a plan.', { field: 'comment' });
	return move(plan, parsed.data.version, { state: verdict, reviewerId: user.id, reviewComment: parsed.data.comment ?? null });
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
		inputs: p.inputs,
		...(withResults ? { results: p.results } : {}),
		version: p.version,
		createdAt: p.createdAt,
		updatedAt: p.updatedAt
	};
}
