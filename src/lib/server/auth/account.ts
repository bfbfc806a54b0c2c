/**
 * Account life cycle: sign-up, e-mail verification, password reset and change.
 * None of these answers reveal whether an address has an account.
 */
import { generateIdFromEntropySize } from 'lucia';
import { db } from '../db';
import { findUserByEmail, findUserById, insertUser, markEmailVerified, setPasswordHash } from '../db/users';
import { consumeLink, expireLinksOf, insertLink } from '../db/authLinks';
import { audit } from '../db/audit';
import { alreadyRegisteredMail, passwordResetMail, verifyEmailMail } from '../mail/messages';
import { sendMail } from '../mail/send';
import { hashPassword, verifyPassword } from './password';
import { LIFETIME_MS, fromNow, hashSecret, randomSecret } from './tokens';
import { LIMITS, consume } from './rate-limit';
import { invalidateUserSessions } from './session';
import { revokeAllApiTokens } from '../db/apiTokens';

/** A fresh user id (16 base32 characters). */
export const newUserId = () => generateIdFromEntropySize(10);

/**
 * Signs someone up and mails a verification link. When the address already has an account,
 * that account gets a "you already have an account" mail instead, and the caller cannot tell.
 */
export async function signUp(input: { name: string; email: string; password: string }, base: string): Promise<void> {
	const existing = await findUserByEmail(input.email);
	const passwordHash = await hashPassword(input.password);
	if (existing) {
		const { retryAfterS } = await consume(`mail:${existing.email}`, LIMITS.mailPerAddress);
		if (!retryAfterS) await sendMail(existing.email, alreadyRegisteredMail(`${base}/forgot`));
		return;
	}
	const id = newUserId();
	try {
		await insertUser({ id, email: input.email, name: input.name, passwordHash });
	} catch (e) {
		if ((e as { code?: string }).code === 'ER_DUP_ENTRY') return; // a concurrent sign-up won
		throw e;
	}
	await audit({ actorId: id, action: 'signup' });
	await sendVerification(id, input.email, input.name, base);
}

/** Mails a fresh verification link (rate-limited per address). Returns false when throttled. */
export async function sendVerification(userId: string, email: string, name: string, base: string): Promise<boolean> {
	const { retryAfterS } = await consume(`mail:${email}`, LIMITS.mailPerAddress);
	if (retryAfterS) return false;
	const token = randomSecret();
	await insertLink('email_verifications', { userId, email, tokenHash: hashSecret(token), expiresAt: fromNow(LIFETIME_MS.emailVerification) });
	await sendMail(email, verifyEmailMail(name, `${base}/verify?token=${token}`));
	return true;
}

/** Uses a verification link; returns the verified user's id or null (unknown, used or expired). */
export async function verifyEmail(token: string): Promise<string | null> {
	return db().transaction(async (trx) => {
		const userId = await consumeLink('email_verifications', hashSecret(token), trx);
		if (!userId) return null;
		await markEmailVerified(userId, trx);
		await audit({ actorId: userId, action: 'email.verified' }, trx);
		return userId;
	});
}

/**
 * Mails a single-use reset link valid for 1 hour if the address has an account. Throttled per
 * address whether or not it has an account. Returns the seconds to wait, or 0.
 */
export async function requestPasswordReset(email: string, base: string): Promise<number> {
	const { retryAfterS } = await consume(`mail:${email}`, LIMITS.mailPerAddress);
	if (retryAfterS) return retryAfterS;
	const user = await findUserByEmail(email);
	if (!user) return 0;
	const token = randomSecret();
	await insertLink('password_resets', { userId: user.id, tokenHash: hashSecret(token), expiresAt: fromNow(LIFETIME_MS.passwordReset) });
	await sendMail(user.email, passwordResetMail(`${base}/reset?token=${token}`));
	return 0;
}

/** Uses a reset link: sets the new password, verifies the address, ends all sessions. */
export async function resetPassword(token: string, password: string): Promise<string | null> {
	const passwordHash = await hashPassword(password);
	const userId = await db().transaction(async (trx) => {
		const id = await consumeLink('password_resets', hashSecret(token), trx);
		if (!id) return null;
		await setPasswordHash(id, passwordHash, trx);
		await markEmailVerified(id, trx);
		await expireLinksOf('password_resets', id, trx);
		// A reset means the password may be known to someone else: their tokens die with it.
		await revokeAllApiTokens(id, trx);
		await audit({ actorId: id, action: 'password.reset' }, trx);
		return id;
	});
	if (userId) await invalidateUserSessions(userId);
	return userId;
}

/** Changes a password after checking the current one; ends the user's other sessions. */
export async function changePassword(userId: string, current: string, next: string): Promise<boolean> {
	const user = await findUserById(userId);
	if (!user || !(await verifyPassword(user.passwordHash, current))) return false;
	await setPasswordHash(userId, await hashPassword(next));
	await revokeAllApiTokens(userId);
	await invalidateUserSessions(userId);
	await audit({ actorId: userId, action: 'password.change' });
	return true;
}
