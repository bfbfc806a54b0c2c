/** Repository: `api_tokens` (token stored as SHA-256; `prefix` lets the owner recognise it). */
import type { Knex } from 'knex';
import { db } from './index';

/** Inserts a token; returns its id. */
export async function insertApiToken(t: { userId: string; name: string; tokenHash: string; prefix: string }, k: Knex = db()): Promise<number> {
	const [id] = await k('api_tokens').insert({ user_id: t.userId, name: t.name, token_hash: t.tokenHash, prefix: t.prefix });
	return Number(id);
}

/** A user's tokens (never the hash), newest first. */
export async function listApiTokens(userId: string, k: Knex = db()): Promise<{ id: number; name: string; prefix: string; createdAt: Date; lastUsedAt: Date | null; revokedAt: Date | null }[]> {
	return k('api_tokens').where({ user_id: userId }).select('id', 'name', 'prefix', 'created_at as createdAt', 'last_used_at as lastUsedAt', 'revoked_at as revokedAt').orderBy('id', 'desc');
}

/** Revokes one of the user's tokens; false when it is not theirs or already revoked. */
export async function revokeApiToken(userId: string, id: number, k: Knex = db()): Promise<boolean> {
	return (await k('api_tokens').where({ id, user_id: userId }).whereNull('revoked_at').update({ revoked_at: new Date() })) === 1;
}

/** Revokes every live token of the user (password change or reset); returns how many. */
export async function revokeAllApiTokens(userId: string, k: Knex = db()): Promise<number> {
	return k('api_tokens').where({ user_id: userId }).whereNull('revoked_at').update({ revoked_at: new Date() });
}

/** The live token with this hash joined to its owner, or null. */
export async function findLiveToken(tokenHash: string, k: Knex = db()) {
	return (
		(await k('api_tokens as t')
			.join('users as u', 'u.id', 't.user_id')
			.where('t.token_hash', tokenHash)
			.whereNull('t.revoked_at')
			.first('t.id as tokenId', 't.last_used_at as lastUsedAt', 'u.id', 'u.email', 'u.name', 'u.site_role as siteRole', 'u.email_verified as emailVerified')) ?? null
	);
}

/** Records use of a token. */
export async function touchApiToken(id: number, k: Knex = db()): Promise<void> {
	await k('api_tokens').where({ id }).update({ last_used_at: new Date() });
}
