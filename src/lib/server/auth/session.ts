/**
 * Cookie sessions through lucia 3 and its MySQL adapter over a mysql2/promise pool.
 * This is the one file to swap when the session layer changes: everything else calls
 * `createSession`, `validateSessionId`, `invalidateSession`, `invalidateUserSessions` and the
 * cookie helpers below.
 */
import { Lucia, TimeSpan, type Cookie } from 'lucia';
import { Mysql2Adapter } from '@lucia-auth/adapter-mysql';
import mysql from 'mysql2/promise';
import { statementTimeoutSeconds } from '../db/index';
import type { Cookies } from '@sveltejs/kit';
import { connectionFromEnv } from '../../../../knexfile';
import type { SessionUser } from './types';

let pool: mysql.Pool | null = null;
let instance: Lucia<Record<never, never>, SessionUser> | null = null;

function authPool(): mysql.Pool {
	if (!pool) {
		pool = mysql.createPool({ ...connectionFromEnv(process.env), connectionLimit: 5, maxIdle: 0, idleTimeout: 30_000 });
		// The same per-statement time limit as the app's knex pool (src/lib/server/db/index.ts).
		const limit = statementTimeoutSeconds(process.env);
		if (limit) pool.pool.on('connection', (conn) => conn.query(`SET SESSION max_statement_time = ${limit}`));
	}
	return pool;
}

interface UserRow {
	email: string;
	name: string;
	site_role: 'admin' | 'user';
	email_verified: number | boolean;
}

/** The lucia instance (sliding expiry: 30 days, extended when past half-life). */
export function lucia() {
	instance ??= new Lucia(new Mysql2Adapter(authPool(), { user: 'users', session: 'sessions' }), {
		sessionExpiresIn: new TimeSpan(30, 'd'),
		sessionCookie: { name: 'windowsill_session', expires: true, attributes: { sameSite: 'lax' } },
		getUserAttributes: (a: UserRow) => ({
			email: a.email,
			name: a.name,
			siteRole: a.site_role,
			emailVerified: Boolean(a.email_verified)
		})
	}) as unknown as Lucia<Record<never, never>, SessionUser>;
	return instance;
}

declare module 'lucia' {
	interface Register {
		DatabaseUserAttributes: UserRow;
	}
}

export const SESSION_COOKIE = 'windowsill_session';

/**
 * Whether cookies get `Secure`: yes over https and in production, except on a loopback host
 * (a local `node build` without TLS); COOKIE_SECURE=1/0 overrides either way.
 */
export function secureCookies(url: URL): boolean {
	const forced = process.env.COOKIE_SECURE;
	if (forced === '1' || forced === '0') return forced === '1';
	if (['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname)) return false;
	return url.protocol === 'https:' || process.env.NODE_ENV === 'production';
}

/** Starts a session for `userId` and sets the httpOnly, SameSite=Lax cookie. */
export async function createSession(userId: string, cookies: Cookies, url: URL): Promise<void> {
	const session = await lucia().createSession(userId, {});
	writeCookie(cookies, url, lucia().createSessionCookie(session.id));
}

/** Validates a session id: the user and session (refreshing the cookie on sliding expiry), or nulls. */
export async function validateSessionId(sessionId: string, cookies: Cookies, url: URL) {
	const { session, user } = (await lucia().validateSession(sessionId)) as { session: import('lucia').Session | null; user: SessionUser | null };
	if (session?.fresh) writeCookie(cookies, url, lucia().createSessionCookie(session.id));
	if (!session) writeCookie(cookies, url, lucia().createBlankSessionCookie());
	return { session, user };
}

/** Ends one session and clears the cookie. */
export async function invalidateSession(sessionId: string, cookies?: Cookies, url?: URL): Promise<void> {
	await lucia().invalidateSession(sessionId);
	if (cookies && url) writeCookie(cookies, url, lucia().createBlankSessionCookie());
}

/** Ends every session of a user (after a password change or reset). */
export async function invalidateUserSessions(userId: string): Promise<void> {
	await lucia().invalidateUserSessions(userId);
}

function writeCookie(cookies: Cookies, url: URL, c: Cookie) {
	const a = c.attributes;
	cookies.set(c.name, c.value, { path: '/', httpOnly: true, sameSite: 'lax', secure: secureCookies(url), expires: a.expires, maxAge: a.maxAge });
}

/** Closes the auth pool (shutdown, tests). */
export async function closeAuthPool(): Promise<void> {
	const p = pool;
	pool = null;
	instance = null;
	if (p) await p.end();
}

/** Sets the long-lived "known browser" cookie after a successful sign-in (see signin.ts). */
export function setDeviceCookie(cookies: Cookies, url: URL, name: string, token: string): void {
	cookies.set(name, token, { path: '/', httpOnly: true, sameSite: 'lax', secure: secureCookies(url), maxAge: 400 * 86400 });
}
