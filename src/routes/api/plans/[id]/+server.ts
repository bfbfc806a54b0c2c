import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { listPlanComments } from '$lib/server/db/planComments';
import { listPlanRevisions } from '$lib/server/db/planRevisions';
import { patchPlan, planToApi, visiblePlan } from '$lib/server/services/plans';
import type { RequestHandler } from './$types';

/** GET /api/plans/:id — viewer+ of the plan's group: the plan, its review thread and its revisions. */
export const GET: RequestHandler = apiHandler(async ({ locals, params }) => {
	const plan = await visiblePlan(locals, params.id);
	const [comments, revisions] = await Promise.all([listPlanComments(plan.id), listPlanRevisions(plan.id)]);
	return json({
		...planToApi(plan),
		comments: comments.map((c) => ({ id: c.id, kind: c.kind, body: c.body, author: { id: c.authorId, name: c.authorName }, planVersion: c.planVersion, createdAt: c.createdAt })),
		revisions: revisions.map((r) => ({ revision: r.revision, reason: r.reason, state: r.state, createdBy: { id: r.createdBy, name: r.createdByName }, createdAt: r.createdAt, changes: r.changes }))
	});
});

/** PATCH /api/plans/:id `{ title?, inputs?, decision?, version }` — the author, while draft or returned; 409 on a stale version. */
export const PATCH: RequestHandler = apiHandler(async ({ locals, params, request }) => json(planToApi(await patchPlan(locals, params.id, await readJson(request)))));
