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
