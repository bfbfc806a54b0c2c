import { db } from './index';

export type PlanState = 'draft' | 'submitted' | 'approved' | 'returned';

export interface PlanRow {
	id: number;
	groupId: number;
	ownerId: string | null;
	ownerName: string | null;
	title: string;
	state: PlanState;
	inputs: Record<string, unknown>;
	results: Record<string, unknown>;
	reviewerId: string | null;
	reviewerName: string | null;
	reviewComment: string | null;
	version: number;
	createdAt: Date;
	updatedAt: Date;
}

const json = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v);

function toPlan(r: Record<string, unknown>): PlanRow {
	return {
		id: Number(r.id),
		groupId: Number(r.group_id),
		ownerId: (r.owner_id as string) ?? null,
		ownerName: (r.owner_name as string) ?? null,
		title: String(r.title),
		state: r.state as PlanState,
		inputs: json(r.inputs) as Record<string, unknown>,
		results: r.results === undefined ? {} : (json(r.results) as Record<string, unknown>),
		reviewerId: (r.reviewer_id as string) ?? null,
		reviewerName: (r.reviewer_name as string) ?? null,
		reviewComment: (r.review_comment as string) ?? null,
		version: Number(r.version),
		createdAt: r.created_at as Date,
		updatedAt: r.updated_at as Date
	};
}

const base = () =>
	db()('plans as p')
		.leftJoin('users as o', 'o.id', 'p.owner_id')
		.leftJoin('users as r', 'r.id', 'p.reviewer_id');

/** Plans of the given groups, newest first, without their (large) results. */
export async function listPlans(groupIds: number[]): Promise<PlanRow[]> {
	if (!groupIds.length) return [];
	const rows = await base()
		.whereIn('p.group_id', groupIds)
		.orderBy('p.updated_at', 'desc')
		.select('p.id', 'p.group_id', 'p.owner_id', 'p.title', 'p.state', 'p.inputs', 'p.reviewer_id', 'p.review_comment', 'p.version', 'p.created_at', 'p.updated_at', 'o.name as owner_name', 'r.name as reviewer_name');
	return rows.map(toPlan);
}

/** One plan with results, or null. */
export async function findPlan(id: number): Promise<PlanRow | null> {
	const r = await base().where('p.id', id).first('p.*', 'o.name as owner_name', 'r.name as reviewer_name');
	return r ? toPlan(r) : null;
}

/** Inserts a draft plan; returns its id. */
export async function insertPlan(row: { groupId: number; ownerId: string; title: string; inputs: unknown; results: unknown }): Promise<number> {
	const [id] = await db()('plans').insert({
		group_id: row.groupId,
		owner_id: row.ownerId,
		title: row.title,
		state: 'draft',
		inputs: JSON.stringify(row.inputs),
		results: JSON.stringify(row.results)
	});
	return Number(id);
}

/** Moves a plan between states when its version still matches; returns rows changed (0 = stale). */
export async function updatePlanIfVersion(
	id: number,
	version: number,
	patch: { state?: PlanState; title?: string; reviewerId?: string | null; reviewComment?: string | null; inputs?: unknown; results?: unknown }
): Promise<number> {
	const row: Record<string, unknown> = { version: version + 1, updated_at: db().fn.now() };
	if (patch.state) row.state = patch.state;
	if (patch.title !== undefined) row.title = patch.title;
	if (patch.reviewerId !== undefined) row.reviewer_id = patch.reviewerId;
	if (patch.reviewComment !== undefined) row.review_comment = patch.reviewComment;
	if (patch.inputs !== undefined) row.inputs = JSON.stringify(patch.inputs);
	if (patch.results !== undefined) row.results = JSON.stringify(patch.results);
	return db()('plans').where({ id, version }).update(row);
}
