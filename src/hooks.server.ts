import type { Handle, HandleServerError } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { closeDb } from '$lib/server/db';
import { authHandle } from '$lib/server/auth/handle';
import { closeAuthPool } from '$lib/server/auth/session';
import { closeMailTransport } from '$lib/server/mail/transport';
import { csrfGuard } from '$lib/server/csrf';
import { compressionHandle } from '$lib/server/compression';

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
// compressionHandle first: it compresses the final answer of everything after it (gzip/br for HTML and JSON).
export const handle = sequence(compressionHandle, securityHeaders, csrfGuard, authHandle);

export const handleError: HandleServerError = ({ error, event }) => {
	console.error(`[error] ${event.request.method} ${event.url.pathname}`, error);
	return { message: 'Something went wrong on the server.', code: 'internal' };
};

// adapter-node does not exit while a mysql2 pool is open: destroy both pools on shutdown.
process.on('sveltekit:shutdown', async () => {
	closeMailTransport();
	await Promise.allSettled([closeDb(), closeAuthPool()]);
});
