/**
 * The auth handle for hooks.server.ts: sets `locals.user` / `locals.session` from
 * `Authorization: Bearer <token>` or the session cookie, on every request.
 */
import type { Handle } from '@sveltejs/kit';
import { authenticateBearer } from './api-tokens';
import { SESSION_COOKIE, validateSessionId } from './session';

export const authHandle: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.session = null;
	const header = event.request.headers.get('authorization');
	if (header) {
		const m = /^Bearer\s+(\S+)$/i.exec(header);
		const found = m ? await authenticateBearer(m[1]) : null;
		if (found) {
			event.locals.user = found.user;
			event.locals.session = found.session;
		}
		// A bad Authorization header never falls back to the cookie: the caller meant the token.
		return resolve(event);
	}
	const sessionId = event.cookies.get(SESSION_COOKIE);
	if (sessionId) {
		const { session, user } = await validateSessionId(sessionId, event.cookies, event.url);
		if (session && user) {
			event.locals.user = { id: user.id, email: user.email, name: user.name, siteRole: user.siteRole, emailVerified: user.emailVerified };
			event.locals.session = { id: session.id, expiresAt: session.expiresAt, via: 'cookie' };
		}
	}
	return resolve(event);
};
