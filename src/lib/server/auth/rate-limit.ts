/**
 * Throttle counters in MariaDB (`auth_throttle`), shared by every app server.
 * A bucket is a string such as `signin-account-address:<user>:<address>`; each hit increments it
 * atomically and a new window starts when the old one has passed. Past its limit a bucket backs
 * off exponentially from its last hit (30 s, 60 s, 120 s … up to the window), so a typo burst costs
 * seconds, a guessing run costs the whole window.
 */
import { db } from '../db';

/** Limits, overridable from the environment so tests and deployments can tune them. */
export const LIMITS = {
	/** Failed sign-ins per account from one unknown browser and address (SIGNIN_ACCOUNT_LIMIT, default 5 per 15 min). */
	signinAccount: { max: Number(process.env.SIGNIN_ACCOUNT_LIMIT ?? 5), windowS: 15 * 60, backoffS: 30 },
	/** Failed sign-ins per account from a browser or address it signed in from before (default 10 per 15 min). */
	signinKnown: { max: Number(process.env.SIGNIN_KNOWN_LIMIT ?? 10), windowS: 15 * 60, backoffS: 15 },
	/** Failed sign-ins per account from all unknown browsers together (distributed guessing; default 50 per hour). */
	signinAccountAll: { max: Number(process.env.SIGNIN_ACCOUNT_ALL_LIMIT ?? 50), windowS: 3600, backoffS: 60 },
	/** Failed sign-ins for addresses without an account, per client address (SIGNIN_IP_LIMIT, default 100 per 15 min). */
	signinIp: { max: Number(process.env.SIGNIN_IP_LIMIT ?? 100), windowS: 15 * 60, backoffS: 60 },
	/** Reset / verification e-mails per address (MAIL_ADDRESS_LIMIT, default 3 per hour). */
	mailPerAddress: { max: Number(process.env.MAIL_ADDRESS_LIMIT ?? 3), windowS: 3600 },
	/** Invitations per invited address (default 3 per hour). */
	invitePerAddress: { max: Number(process.env.INVITE_ADDRESS_LIMIT ?? 3), windowS: 3600 }
} as const;

export interface Limit {
	max: number;
	windowS: number;
	/** When set: past `max`, wait backoffS · 2^(hits − max) seconds after the last hit (capped at the window's end). */
	backoffS?: number;
}

/** Seconds until the bucket opens again, or 0 when it is under its limit. Does not count. */
export async function retryAfter(bucket: string, limit: Limit): Promise<number> {
	const row = await db()('auth_throttle').where({ bucket }).first('hits', 'window_start', 'last_hit_at');
	if (!row) return 0;
	const now = Date.now();
	const ends = new Date(row.window_start).getTime() + limit.windowS * 1000;
	if (ends <= now || row.hits < limit.max) return 0;
	if (limit.backoffS && row.last_hit_at) {
		const wait = Math.min(limit.windowS, limit.backoffS * 2 ** Math.min(20, row.hits - limit.max));
		const opens = Math.min(ends, new Date(row.last_hit_at).getTime() + wait * 1000);
		return opens <= now ? 0 : Math.max(1, Math.ceil((opens - now) / 1000));
	}
	return Math.max(1, Math.ceil((ends - now) / 1000));
}

/** Counts one hit (atomic upsert; restarts the window when it has run out). */
export async function hit(bucket: string, limit: Limit): Promise<void> {
	await db().raw(
		`INSERT INTO auth_throttle (bucket, hits, window_start, last_hit_at) VALUES (?, 1, UTC_TIMESTAMP(), UTC_TIMESTAMP())
		 ON DUPLICATE KEY UPDATE
		   hits = IF(window_start <= UTC_TIMESTAMP() - INTERVAL ? SECOND, 1, hits + 1),
		   window_start = IF(window_start <= UTC_TIMESTAMP() - INTERVAL ? SECOND, UTC_TIMESTAMP(), window_start),
		   last_hit_at = UTC_TIMESTAMP()`,
		[bucket, limit.windowS, limit.windowS]
	);
}

/** Counts a hit and answers whether it was allowed (retryAfterS 0) or over the limit. */
export async function consume(bucket: string, limit: Limit): Promise<{ retryAfterS: number }> {
	const wait = await retryAfter(bucket, limit);
	if (wait > 0) return { retryAfterS: wait };
	await hit(bucket, limit);
	return { retryAfterS: 0 };
}

/** Forgets a bucket (e.g. the account counter after a successful sign-in). */
export async function clear(bucket: string): Promise<void> {
	await db()('auth_throttle').where({ bucket }).del();
}
