import type { Handle, HandleServerError } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { closeDb } from '$lib/server/db';

/** Security headers on every response; the CSP itself comes from svelte.config.js (kit.csp). */
const securityHeaders: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	response.headers.set('X-Content-Type-Options', 'nosniff');
	response.headers.set('Referrer-Policy', 'strict-origin-when-cross-origin');
	response.headers.set('X-Frame-Options', 'DENY');
	response.headers.set('Permissions-Policy', 'camera=(), microphone=(), geolocation=()');
	return response;
};

const auth: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.session = null;
	return resolve(event);
};

export const handle = sequence(securityHeaders, auth);

export const handleError: HandleServerError = ({ error, event }) => {
	console.error(`[error] ${event.request.method} ${event.url.pathname}`, error);
	return { message: 'Something went wrong on the server.', code: 'internal' };
};

// adapter-node does not exit while a mysql2 pool is open: destroy it on shutdown.
process.on('sveltekit:shutdown', async () => {
	await closeDb();
});
