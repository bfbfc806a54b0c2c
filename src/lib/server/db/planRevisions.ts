/** Repository: `plan_revisions` — frozen snapshots of a plan (as approved; each saved recomputation). */
import type { Knex } from 'knex';
import { db } from './index';

export interface PlanRevision {
	id: number;
	planId: number;
	revision: number;
	reason: 'approved' | 'recomputed';
	state: string;
	inputs: Record<string, unknown>;
	decision: Record<string, unknown> | null;
	results: Record<string, unknown>;
	changes: { field: string; before: unknown; after: unknown }[] | null;
	createdBy: string | null;
	createdByName: string | null;
	createdAt: Date;
}

const json = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v);

function toRevision(r: Record<string, unknown>): PlanRevision {
	return {
		id: Number(r.id),
		planId: Number(r.plan_id),
		revision: Number(r.revision),
		reason: r.reason as PlanRevision['reason'],
		state: String(r.state),
		inputs: json(r.inputs) as Record<string, unknown>,
		decision: r.decision == null ? null : (json(r.decision) as Record<string, unknown>),
		results: r.results === undefined ? {} : (json(r.results) as Record<string, unknown>),
		changes: r.changes == null ? null : (json(r.changes) as PlanRevision['changes']),
		createdBy: (r.created_by as string) ?? null,
		createdByName: (r.created_by_name as string) ?? null,
		createdAt: r.created_at as Date
	};
}

/** Stores a snapshot with the next revision number of the plan (call inside the transaction that changes the plan). */
export async function insertPlanRevision(
	s: { planId: number; reason: PlanRevision['reason']; state: string; inputs: unknown; decision: unknown; results: unknown; changes?: unknown; createdBy: string },
	k: Knex = db()
): Promise<number> {
	const last = await k('plan_revisions').where({ plan_id: s.planId }).max('revision as n').first();
	const revision = Number(last?.n ?? 0) + 1;
	await k('plan_revisions').insert({
		plan_id: s.planId,
		revision,
		reason: s.reason,
		state: s.state,
		inputs: JSON.stringify(s.inputs),
		decision: s.decision == null ? null : JSON.stringify(s.decision),
		results: JSON.stringify(s.results),
		changes: s.changes == null ? null : JSON.stringify(s.changes),
		created_by: s.createdBy
	});
	return revision;
}

/** A plan's revisions without results, oldest first. */
export async function listPlanRevisions(planId: number): Promise<PlanRevision[]> {
	const rows = await db()('plan_revisions as v')
		.leftJoin('users as u', 'u.id', 'v.created_by')
		.where('v.plan_id', planId)
		.orderBy('v.revision')
		.select('v.id', 'v.plan_id', 'v.revision', 'v.reason', 'v.state', 'v.inputs', 'v.decision', 'v.changes', 'v.created_by', 'v.created_at', 'u.name as created_by_name');
	return rows.map(toRevision);
}

/** One revision with results, or null. */
export async function findPlanRevision(planId: number, revision: number): Promise<PlanRevision | null> {
	const r = await db()('plan_revisions as v').leftJoin('users as u', 'u.id', 'v.created_by').where({ 'v.plan_id': planId, 'v.revision': revision }).first('v.*', 'u.name as created_by_name');
	return r ? toRevision(r) : null;
}
