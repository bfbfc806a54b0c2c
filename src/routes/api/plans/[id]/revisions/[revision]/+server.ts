import { json } from '@sveltejs/kit';
import { apiHandler, notFound } from '$lib/server/http';
import { findPlanRevision } from '$lib/server/db/planRevisions';
import { visiblePlan } from '$lib/server/services/plans';
import type { RequestHandler } from './$types';

/** GET /api/plans/:id/revisions/:revision — viewer+ of the group: one frozen revision (as approved, or a saved recomputation). */
export const GET: RequestHandler = apiHandler(async ({ locals, params }) => {
	const plan = await visiblePlan(locals, params.id);
	const n = /^\d{1,6}$/.test(params.revision) ? Number(params.revision) : 0;
	const rev = n ? await findPlanRevision(plan.id, n) : null;
	if (!rev) throw notFound('No such revision of this plan.');
	return json({ planId: plan.id, revision: rev.revision, reason: rev.reason, state: rev.state, inputs: rev.inputs, decision: rev.decision, results: rev.results, changes: rev.changes, createdBy: { id: rev.createdBy, name: rev.createdByName }, createdAt: rev.createdAt });
});
