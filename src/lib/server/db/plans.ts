/** Repository: `plans` — irradiation plans (inputs, decision, frozen results) and their review state. */
import type { Knex } from 'knex';
import { db } from './index';

export type PlanState = 'draft' | 'submitted' | 'approved' | 'returned';
export const PLAN_STATES: PlanState[] = ['draft', 'submitted', 'approved', 'returned'];

export interface PlanRow {
	id: number;
	groupId: number;
	ownerId: string | null;
	ownerName: string | null;
	title: string;
	state: PlanState;
	inputs: Record<string, unknown>;
	decision: Record<string, unknown> | null;
	results: Record<string, unknown>;
	lampId: number | null;
	lampName: string | null;
	absorberSpectrumId: number | null;
	absorberName: string | null;
	reviewerId: string | null;
	reviewerName: string | null;
	reviewComment: string | null;
	idempotencyKey: string | null;
	version: number;
	submittedAt: Date | null;
	reviewedAt: Date | null;
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
		decision: r.decision == null ? null : (json(r.decision) as Record<string, unknown>),
		results: r.results === undefined ? {} : (json(r.results) as Record<string, unknown>),
		lampId: r.lamp_id == null ? null : Number(r.lamp_id),
		lampName: (r.lamp_name as string) ?? null,
		absorberSpectrumId: r.absorber_spectrum_id == null ? null : Number(r.absorber_spectrum_id),
		absorberName: (r.absorber_name as string) ?? null,
		reviewerId: (r.reviewer_id as string) ?? null,
		reviewerName: (r.reviewer_name as string) ?? null,
		reviewComment: (r.review_comment as string) ?? null,
		idempotencyKey: (r.idempotency_key as string) ?? null,
		version: Number(r.version),
		submittedAt: (r.submitted_at as Date) ?? null,
		reviewedAt: (r.reviewed_at as Date) ?? null,
		createdAt: r.created_at as Date,
		updatedAt: r.updated_at as Date
	};
}

const base = (k: Knex = db()) =>
	k('plans as p')
		.leftJoin('users as o', 'o.id', 'p.owner_id')
		.leftJoin('users as r', 'r.id', 'p.reviewer_id')
		.leftJoin('lamps as l', 'l.id', 'p.lamp_id')
		.leftJoin('spectra as s', 's.id', 'p.absorber_spectrum_id');

const JOINED = ['o.name as owner_name', 'r.name as reviewer_name', 'l.name as lamp_name', 's.name as absorber_name'];
const LIGHT = ['p.id', 'p.group_id', 'p.owner_id', 'p.title', 'p.state', 'p.inputs', 'p.decision', 'p.lamp_id', 'p.absorber_spectrum_id', 'p.reviewer_id', 'p.review_comment', 'p.idempotency_key', 'p.version', 'p.submitted_at', 'p.reviewed_at', 'p.created_at', 'p.updated_at'];

export interface PlanFilter {
	state?: PlanState;
	lampId?: number;
	absorberSpectrumId?: number;
}

/** Plans of the given groups without their (large) results: submitted ones first (oldest waiting first), then newest. */
export async function listPlans(groupIds: number[], f: PlanFilter = {}): Promise<PlanRow[]> {
	if (!groupIds.length) return [];
	const q = base().whereIn('p.group_id', groupIds).select([...LIGHT, ...JOINED]);
	if (f.state) q.where('p.state', f.state);
	if (f.lampId) q.where('p.lamp_id', f.lampId);
	if (f.absorberSpectrumId) q.where('p.absorber_spectrum_id', f.absorberSpectrumId);
	q.orderByRaw("CASE WHEN p.state = 'submitted' THEN 0 ELSE 1 END")
		.orderByRaw("CASE WHEN p.state = 'submitted' THEN p.submitted_at END ASC")
		.orderBy('p.updated_at', 'desc')
		.orderBy('p.id', 'desc');
	return (await q).map(toPlan);
}

/** The plans of one group for the matrix: id, state, lamp and absorber only. */
export async function listPlanPairs(groupId: number): Promise<{ id: number; state: PlanState; lampId: number; absorberSpectrumId: number; title: string }[]> {
	const rows = await db()('plans').where({ group_id: groupId }).whereNotNull('lamp_id').whereNotNull('absorber_spectrum_id').orderBy('id').select('id', 'state', 'lamp_id', 'absorber_spectrum_id', 'title');
	return rows.map((r: Record<string, unknown>) => ({ id: Number(r.id), state: r.state as PlanState, lampId: Number(r.lamp_id), absorberSpectrumId: Number(r.absorber_spectrum_id), title: String(r.title) }));
}

/** The inputs of a group's plans (newest first, at most `limit`), for the matrix defaults. */
export async function listPlanInputs(groupId: number, limit = 200): Promise<Record<string, unknown>[]> {
	const rows = await db()('plans').where({ group_id: groupId }).orderBy('id', 'desc').limit(limit).select('inputs');
	return rows.map((r: { inputs: unknown }) => json(r.inputs) as Record<string, unknown>);
}

/** One plan with results, or null. */
export async function findPlan(id: number, k: Knex = db()): Promise<PlanRow | null> {
	const r = await base(k).where('p.id', id).first('p.*', ...JOINED);
	return r ? toPlan(r) : null;
}

/** The plan this author already saved under this idempotency key, or null. */
export async function findPlanByIdempotencyKey(ownerId: string, key: string, k: Knex = db()): Promise<PlanRow | null> {
	const r = await base(k).where({ 'p.owner_id': ownerId, 'p.idempotency_key': key }).first('p.*', ...JOINED);
	return r ? toPlan(r) : null;
}

export interface NewPlan {
	groupId: number;
	ownerId: string;
	title: string;
	inputs: unknown;
	decision: unknown;
	results: unknown;
	lampId: number | null;
	absorberSpectrumId: number | null;
	idempotencyKey: string | null;
}

/** Inserts a draft plan; returns its id. A repeated (owner, idempotency key) throws ER_DUP_ENTRY. */
export async function insertPlan(row: NewPlan, k: Knex = db()): Promise<number> {
	const [id] = await k('plans').insert({
		group_id: row.groupId,
		owner_id: row.ownerId,
		title: row.title,
		state: 'draft',
		inputs: JSON.stringify(row.inputs),
		decision: row.decision == null ? null : JSON.stringify(row.decision),
		results: JSON.stringify(row.results),
		lamp_id: row.lampId,
		absorber_spectrum_id: row.absorberSpectrumId,
		idempotency_key: row.idempotencyKey
	});
	return Number(id);
}

export interface PlanPatch {
	state?: PlanState;
	title?: string;
	reviewerId?: string | null;
	reviewComment?: string | null;
	inputs?: unknown;
	decision?: unknown;
	results?: unknown;
	lampId?: number | null;
	absorberSpectrumId?: number | null;
	submittedAt?: Date | null;
	reviewedAt?: Date | null;
}

/** Changes a plan when its version (and, when given, its state) still match; bumps the version. Returns rows changed (0 = stale). */
export async function updatePlanIfVersion(id: number, version: number, patch: PlanPatch, k: Knex = db(), expectState?: PlanState[]): Promise<number> {
	const row: Record<string, unknown> = { version: version + 1, updated_at: k.fn.now() };
	if (patch.state) row.state = patch.state;
	if (patch.title !== undefined) row.title = patch.title;
	if (patch.reviewerId !== undefined) row.reviewer_id = patch.reviewerId;
	if (patch.reviewComment !== undefined) row.review_comment = patch.reviewComment;
	if (patch.inputs !== undefined) row.inputs = JSON.stringify(patch.inputs);
	if (patch.decision !== undefined) row.decision = patch.decision === null ? null : JSON.stringify(patch.decision);
	if (patch.results !== undefined) row.results = JSON.stringify(patch.results);
	if (patch.lampId !== undefined) row.lamp_id = patch.lampId;
	if (patch.absorberSpectrumId !== undefined) row.absorber_spectrum_id = patch.absorberSpectrumId;
	if (patch.submittedAt !== undefined) row.submitted_at = patch.submittedAt;
	if (patch.reviewedAt !== undefined) row.reviewed_at = patch.reviewedAt;
	const q = k('plans').where({ id, version });
	if (expectState) q.whereIn('state', expectState);
	return q.update(row);
}
