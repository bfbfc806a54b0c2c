/** Repository: `plan_comments` — the review thread of a plan. */
import type { Knex } from 'knex';
import { db } from './index';

export type PlanCommentKind = 'comment' | 'submitted' | 'approved' | 'returned';

export interface PlanComment {
	id: number;
	planId: number;
	authorId: string | null;
	authorName: string | null;
	kind: PlanCommentKind;
	body: string;
	planVersion: number;
	createdAt: Date;
}

/** Appends one entry to a plan's thread; returns its id. */
export async function insertPlanComment(c: { planId: number; authorId: string; kind: PlanCommentKind; body: string; planVersion: number }, k: Knex = db()): Promise<number> {
	const [id] = await k('plan_comments').insert({ plan_id: c.planId, author_id: c.authorId, kind: c.kind, body: c.body, plan_version: c.planVersion });
	return Number(id);
}

/** A plan's thread, oldest first. */
export async function listPlanComments(planId: number, k: Knex = db()): Promise<PlanComment[]> {
	const rows = await k('plan_comments as c').leftJoin('users as u', 'u.id', 'c.author_id').where('c.plan_id', planId).orderBy('c.id').select('c.*', 'u.name as author_name');
	return rows.map((r: Record<string, unknown>) => ({
		id: Number(r.id),
		planId: Number(r.plan_id),
		authorId: (r.author_id as string) ?? null,
		authorName: (r.author_name as string) ?? null,
		kind: r.kind as PlanCommentKind,
		body: String(r.body),
		planVersion: Number(r.plan_version),
		createdAt: r.created_at as Date
	}));
}
