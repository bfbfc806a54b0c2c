/**
 * Credential check with throttling: failed attempts count per account and per client IP
 * (MariaDB counters, see rate-limit.ts). Answers are deliberately the same for "no such
 * account" and "wrong password".
 */
import { findUserByEmail, normaliseEmail, type UserRecord } from '../db/users';
import { audit } from '../db/audit';
import { dummyHash, verifyPassword } from './password';
import { LIMITS, clear, hit, retryAfter } from './rate-limit';

export type SignInResult = { ok: true; user: UserRecord } | { ok: false; reason: 'invalid' } | { ok: false; reason: 'throttled'; retryAfterS: number };

/** The generic message for a failed sign-in. */
export const SIGNIN_FAILED = 'That e-mail and password do not match an account.';

/** Checks e-mail and password for a sign-in from `ip`. */
export async function checkCredentials(email: string, password: string, ip: string): Promise<SignInResult> {
	const addr = normaliseEmail(email);
	const accountBucket = `signin-account:${addr}`;
	const ipBucket = `signin-ip:${ip}`;
	const wait = Math.max(await retryAfter(accountBucket, LIMITS.signinAccount), await retryAfter(ipBucket, LIMITS.signinIp));
	if (wait > 0) return { ok: false, reason: 'throttled', retryAfterS: wait };

	const user = await findUserByEmail(addr);
	// Verify against a dummy hash when there is no account so both paths take the same time.
	const good = await verifyPassword(user?.passwordHash ?? (await dummyHash()), password);
	if (!user || !good) {
		await hit(accountBucket, LIMITS.signinAccount);
		await hit(ipBucket, LIMITS.signinIp);
		await audit({ actorId: user?.id ?? null, action: 'signin.failed', target: addr, ip });
		return { ok: false, reason: 'invalid' };
	}
	await clear(accountBucket);
	await audit({ actorId: user.id, action: 'signin', ip });
	return { ok: true, user };
}
