/** Repository: `audit_log` — append-only record of account and group changes. */
import type { Knex } from 'knex';
import { db } from './index';

/** Appends one audit entry. */
export async function audit(e: { actorId: string | null; action: string; target?: string | null; groupId?: number | null; details?: unknown; ip?: string | null }, k: Knex = db()): Promise<void> {
	await k('audit_log').insert({
		actor_id: e.actorId,
		action: e.action,
		target: e.target ?? null,
		group_id: e.groupId ?? null,
		details: e.details === undefined ? null : JSON.stringify(e.details),
		ip: e.ip ?? null
	});
}

export interface AuditEntry {
	id: number;
	actorId: string | null;
	actorName: string | null;
	action: string;
	target: string | null;
	groupId: number | null;
	groupName: string | null;
	details: unknown;
	createdAt: Date;
}

/** Audit entries, newest first: of the given groups (null = every group and the site-wide entries), at most `limit`. */
export async function listAudit(opts: { groupIds: number[] | null; limit: number; beforeId?: number }, k: Knex = db()): Promise<AuditEntry[]> {
	const q = k('audit_log as a')
		.leftJoin('users as u', 'u.id', 'a.actor_id')
		.leftJoin('groups as g', 'g.id', 'a.group_id')
		.orderBy('a.id', 'desc')
		.limit(opts.limit)
		.select('a.id', 'a.actor_id', 'a.action', 'a.target', 'a.group_id', 'a.details', 'a.created_at', 'u.name as actor_name', 'g.name as group_name');
	if (opts.groupIds) q.whereIn('a.group_id', opts.groupIds.length ? opts.groupIds : [-1]);
	if (opts.beforeId) q.where('a.id', '<', opts.beforeId);
	const rows = await q;
	return rows.map((r: Record<string, unknown>) => {
		let details: unknown = r.details ?? null;
		if (typeof details === 'string') {
			try {
				details = JSON.parse(details);
			} catch {
				// older free-text details stay as they are
			}
		}
		return {
			id: Number(r.id),
			actorId: (r.actor_id as string) ?? null,
			actorName: (r.actor_name as string) ?? null,
			action: String(r.action),
			target: (r.target as string) ?? null,
			groupId: r.group_id == null ? null : Number(r.group_id),
			groupName: (r.group_name as string) ?? null,
			details,
			createdAt: r.created_at as Date
		};
	});
}
