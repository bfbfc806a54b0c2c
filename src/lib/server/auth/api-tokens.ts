/**
 * Personal API tokens: `ws_<32 base32 chars>`, shown once, stored as SHA-256. A bearer
 * token acts with its owner's rights on every /api route.
 */
import { findLiveToken, insertApiToken, touchApiToken } from '../db/apiTokens';
import { audit } from '../db/audit';
import { hashSecret, randomSecret } from './tokens';
import type { SessionInfo, SessionUser } from './types';

/** Creates a token for `userId`; returns the plain token (show it once) and its id. */
export async function createApiToken(userId: string, name: string): Promise<{ id: number; token: string; name: string }> {
	const token = `ws_${randomSecret(20)}`;
	const id = await insertApiToken({ userId, name, tokenHash: hashSecret(token), prefix: token.slice(0, 9) });
	await audit({ actorId: userId, action: 'token.create', target: String(id), details: { name } });
	return { id, token, name };
}

/** Resolves a bearer token to its owner, recording the last-used time (at most once a minute). */
export async function authenticateBearer(token: string): Promise<{ user: SessionUser; session: SessionInfo } | null> {
	if (!/^ws_[a-z2-7]{20,64}$/.test(token)) return null;
	const row = await findLiveToken(hashSecret(token));
	if (!row) return null;
	if (!row.lastUsedAt || Date.now() - new Date(row.lastUsedAt).getTime() > 60_000) await touchApiToken(row.tokenId);
	return {
		user: { id: row.id, email: row.email, name: row.name, siteRole: row.siteRole, emailVerified: Boolean(row.emailVerified) },
		session: { id: `token:${row.tokenId}`, expiresAt: new Date(8640000000000000), via: 'token' }
	};
}
