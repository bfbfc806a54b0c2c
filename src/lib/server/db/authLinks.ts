/** Repository: one-time link tables `email_verifications` and `password_resets` (tokens stored as SHA-256). */
import type { Knex } from 'knex';
import { db } from './index';

export type LinkTable = 'email_verifications' | 'password_resets';

/** Inserts a link row. `email` only applies to verifications. */
export async function insertLink(table: LinkTable, l: { userId: string; tokenHash: string; expiresAt: Date; email?: string }, k: Knex = db()): Promise<void> {
	await k(table).insert({ user_id: l.userId, token_hash: l.tokenHash, expires_at: l.expiresAt, ...(table === 'email_verifications' ? { email: l.email } : {}) });
}

/**
 * Uses a link: marks it used if it exists, is unused and unexpired, and returns its user id.
 * The conditional update makes it single-use even under concurrent requests.
 */
export async function consumeLink(table: LinkTable, tokenHash: string, k: Knex = db()): Promise<string | null> {
	const row = await k(table).where({ token_hash: tokenHash }).whereNull('used_at').where('expires_at', '>', new Date()).first('id', 'user_id');
	if (!row) return null;
	const n = await k(table).where({ id: row.id }).whereNull('used_at').update({ used_at: new Date() });
	return n === 1 ? row.user_id : null;
}

/** True when a link with this hash is unused and unexpired (for showing a form before using it). */
export async function linkIsLive(table: LinkTable, tokenHash: string, k: Knex = db()): Promise<boolean> {
	return !!(await k(table).where({ token_hash: tokenHash }).whereNull('used_at').where('expires_at', '>', new Date()).first('id'));
}

/** Expires every open link of a user in a table (e.g. all resets after a successful one). */
export async function expireLinksOf(table: LinkTable, userId: string, k: Knex = db()): Promise<void> {
	await k(table).where({ user_id: userId }).whereNull('used_at').update({ used_at: new Date() });
}
