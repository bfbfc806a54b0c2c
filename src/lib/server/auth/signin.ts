/**
 * Credential check with throttling that does not lock the real owner out (MariaDB counters, see
 * rate-limit.ts). Answers are deliberately the same for "no such account" and "wrong password".
 *
 * Counters:
 * - an existing account, from a browser or address it has signed in from before (a long-lived random
 *   `windowsill_device` cookie, or a successful sign-in from this address in the last 60 days): its own
 *   counter per account and browser/address — strangers' failures never touch it;
 * - an existing account from an unknown browser and address: a counter per account and address with
 *   backoff, plus one for all unknown browsers together (distributed guessing);
 * - an address without an account: a counter per client address (so one proxy in front of a whole
 *   institute is only limited for attempts on accounts that do not exist).
 * The client address comes from adapter-node's `getClientAddress()`; behind a reverse proxy set
 * ADDRESS_HEADER (and XFF_DEPTH) as README says, or every user shares the proxy's address.
 */
import { createHash, randomBytes } from 'node:crypto';
import { findUserByEmail, normaliseEmail, type UserRecord } from '../db/users';
import { audit } from '../db/audit';
import { db } from '../db';
import { dummyHash, verifyPassword } from './password';
import { LIMITS, clear, hit, retryAfter } from './rate-limit';

export type SignInResult =
	| { ok: true; user: UserRecord; deviceToken: string }
	| { ok: false; reason: 'invalid' }
	| { ok: false; reason: 'throttled'; retryAfterS: number };

/** The generic message for a failed sign-in. */
export const SIGNIN_FAILED = 'That e-mail and password do not match an account.';

/** Name of the long-lived "known browser" cookie (random, httpOnly; stored hashed). */
export const DEVICE_COOKIE = 'windowsill_device';
const KNOWN_ADDRESS_DAYS = 60;

const sha = (s: string) => createHash('sha256').update(s).digest('hex');

async function isKnown(userId: string, ip: string, deviceToken: string | undefined): Promise<string | null> {
	const rows = await db()('known_signins')
		.where({ user_id: userId })
		.andWhere((q) => {
			q.where({ kind: 'address', key_hash: sha(`addr:${ip}`) }).andWhere('last_seen_at', '>', new Date(Date.now() - KNOWN_ADDRESS_DAYS * 86400_000));
			if (deviceToken && /^[A-Za-z0-9_-]{20,100}$/.test(deviceToken)) q.orWhere({ kind: 'device', key_hash: sha(`dev:${deviceToken}`) });
		})
		.select('kind', 'key_hash');
	const device = rows.find((r) => r.kind === 'device');
	return (device ?? rows[0])?.key_hash ?? null;
}

async function remember(userId: string, ip: string, deviceToken: string): Promise<void> {
	const now = new Date();
	for (const [kind, key] of [
		['device', sha(`dev:${deviceToken}`)],
		['address', sha(`addr:${ip}`)]
	] as const) {
		await db().raw(
			'INSERT INTO known_signins (user_id, kind, key_hash, first_seen_at, last_seen_at) VALUES (?, ?, ?, ?, ?) ON DUPLICATE KEY UPDATE last_seen_at = VALUES(last_seen_at)',
			[userId, kind, key, now, now]
		);
	}
}

/** Checks e-mail and password for a sign-in from `ip` (with the browser's known-device cookie, if any). */
export async function checkCredentials(email: string, password: string, ip: string, deviceToken?: string): Promise<SignInResult> {
	const addr = normaliseEmail(email);
	const user = await findUserByEmail(addr);
	let buckets: [string, (typeof LIMITS)[keyof typeof LIMITS]][];
	if (user) {
		const known = await isKnown(user.id, ip, deviceToken);
		buckets = known
			? [[`signin-known:${user.id}:${known}`, LIMITS.signinKnown]]
			: [
					[`signin-account-address:${user.id}:${sha(ip).slice(0, 32)}`, LIMITS.signinAccount],
					[`signin-account-unknown:${user.id}`, LIMITS.signinAccountAll]
				];
	} else {
		buckets = [
			[`signin-account-address:${sha(addr).slice(0, 32)}:${sha(ip).slice(0, 32)}`, LIMITS.signinAccount],
			[`signin-ip:${ip}`, LIMITS.signinIp]
		];
	}
	let wait = 0;
	for (const [b, l] of buckets) wait = Math.max(wait, await retryAfter(b, l));
	if (wait > 0) return { ok: false, reason: 'throttled', retryAfterS: wait };

	// Verify against a dummy hash when there is no account so both paths take the same time.
	const good = await verifyPassword(user?.passwordHash ?? (await dummyHash()), password);
	if (!user || !good) {
		for (const [b, l] of buckets) await hit(b, l);
		await audit({ actorId: user?.id ?? null, action: 'signin.failed', target: addr, ip });
		return { ok: false, reason: 'invalid' };
	}
	for (const [b] of buckets) if (!b.startsWith('signin-account-unknown:')) await clear(b);
	const token = deviceToken && /^[A-Za-z0-9_-]{20,100}$/.test(deviceToken) ? deviceToken : randomBytes(24).toString('base64url');
	await remember(user.id, ip, token);
	await audit({ actorId: user.id, action: 'signin', ip });
	return { ok: true, user, deviceToken: token };
}
