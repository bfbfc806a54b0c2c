import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { requireUser } from '$lib/server/policy';
import { invalidateSession } from '$lib/server/auth/session';
import type { RequestHandler } from './$types';

/** POST /api/auth/signout — ends the cookie session (a bearer token stays valid until revoked). */
export const POST: RequestHandler = apiHandler(async ({ locals, cookies, url }) => {
	requireUser(locals);
	if (locals.session?.via === 'cookie') await invalidateSession(locals.session.id, cookies, url);
	return json({ ok: true });
});
