/** Loads what a report shows: the plan as it is, or one frozen revision of it (`?revision=`). */
import { findGroupById } from '$lib/server/db/groups';
import { findPlanRevision } from '$lib/server/db/planRevisions';
import { ApiError, notFound } from '$lib/server/http';
import { buildPlanReport, type PlanReport } from './planReport';
import { visiblePlan } from './plans';

/** The report of a plan the caller may see (viewer+ of its group; 404 otherwise). */
export async function planReportFor(locals: App.Locals, idParam: string | undefined, revisionParam: string | null): Promise<{ report: PlanReport; planId: number; fileName: string }> {
	const plan = await visiblePlan(locals, idParam);
	const group = await findGroupById(plan.groupId);
	let src = { inputs: plan.inputs, decision: plan.decision, results: plan.results, state: plan.state as string, revision: null as null | { number: number; reason: string; createdAt: Date } };
	if (revisionParam !== null && revisionParam !== '') {
		if (!/^\d{1,6}$/.test(revisionParam)) throw new ApiError(400, 'invalid', 'revision: a revision number of this plan.', { field: 'revision' });
		const rev = await findPlanRevision(plan.id, Number(revisionParam));
		if (!rev) throw notFound('No such revision of this plan.');
		src = { inputs: rev.inputs, decision: rev.decision, results: rev.results, state: rev.state, revision: { number: rev.revision, reason: rev.reason, createdAt: new Date(rev.createdAt) } };
	}
	const report = buildPlanReport({
		id: plan.id,
		title: plan.title,
		state: src.state,
		groupName: group?.name ?? '',
		ownerName: plan.ownerName,
		reviewerName: plan.reviewerName,
		reviewedAt: plan.reviewedAt,
		version: plan.version,
		revision: src.revision,
		inputs: src.inputs,
		decision: src.decision,
		results: src.results,
		generatedAt: new Date()
	});
	const slug = plan.title.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60) || 'plan';
	return { report, planId: plan.id, fileName: `plan-${plan.id}${src.revision ? `-rev${src.revision.number}` : ''}-${slug}` };
}
