import type { Handle, HandleServerError } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { closeDb } from '$lib/server/db';
import { authHandle } from '$lib/server/auth/handle';
import { closeAuthPool } from '$lib/server/auth/session';
import { closeMailTransport } from '$lib/server/mail/transport';
import { csrfGuard } from '$lib/server/csrf';
import { bodyLimitGuard, markOutage, outageGuard, truncateForLog } from '$lib/server/guards';
import { OUTAGE_MESSAGE } from '$lib/server/db/outage';
import { closeParsePool } from '$lib/server/parse/pool';

/** Security headers on every response; the CSP itself comes from svelte.config.js (kit.csp). */
const securityHeaders: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	response.headers.set('X-Content-Type-Options', 'nosniff');
	response.headers.set('Referrer-Policy', 'strict-origin-when-cross-origin');
	response.headers.set('X-Frame-Options', 'DENY');
	response.headers.set('Permissions-Policy', 'camera=(), microphone=(), geolocation=()');
	return response;
};

// csrfGuard replaces SvelteKit's origin check (svelte.config.js trusts '*'); it lets bearer requests
// through, which is safe because authHandle never falls back to the cookie when a bearer header is sent.
// outageGuard comes before authHandle so that a database outage during sign-in checks is a 503 too.
export const handle = sequence(securityHeaders, bodyLimitGuard, outageGuard, csrfGuard, authHandle);

export const handleError: HandleServerError = ({ error, event, status }) => {
	if (markOutage(event, error)) {
		console.error(`[db-outage] ${event.request.method} ${event.url.pathname}: ${truncateForLog(error, 300)}`);
		return { message: OUTAGE_MESSAGE, code: 'db_unavailable' };
	}
	if (status === 413) return { message: 'The request body is above the size limit.', code: 'too_large' };
	console.error(`[error] ${event.request.method} ${event.url.pathname} ${truncateForLog(error, 2000)}`);
	return { message: 'Something went wrong on the server.', code: 'internal' };
};

// adapter-node does not exit while a mysql2 pool is open: destroy both pools on shutdown.
process.on('sveltekit:shutdown', async () => {
	closeMailTransport();
	await Promise.allSettled([closeDb(), closeAuthPool(), closeParsePool()]);
});

// Crash-safe: an error that escapes a request (a stray rejected promise, a socket error) is logged,
// never allowed to end the process. A supervisor (docs/windowsill.service) restarts it if it dies anyway.
const g = globalThis as { __windowsillCrashGuards?: boolean };
if (!g.__windowsillCrashGuards) {
	g.__windowsillCrashGuards = true;
	process.on('unhandledRejection', (reason) => console.error(`[unhandled-rejection] ${truncateForLog(reason, 2000)}`));
	process.on('uncaughtException', (err) => console.error(`[uncaught-exception] ${truncateForLog(err, 2000)}`));
}
