import { json } from '@sveltejs/kit';
import { apiHandler, ApiError, readJson, zodToApiError } from '$lib/server/http';
import { signInSchema } from '$lib/schemas/auth';
import { checkCredentials, DEVICE_COOKIE, SIGNIN_FAILED } from '$lib/server/auth/signin';
import { createSession, setDeviceCookie } from '$lib/server/auth/session';
import { clientIp } from '$lib/server/auth/guard';
import type { RequestHandler } from './$types';

/** POST /api/auth/signin `{ email, password }` → session cookie and `{ user }`; 401 wrong, 429 throttled. */
export const POST: RequestHandler = apiHandler(async (event) => {
	const parsed = signInSchema.safeParse(await readJson(event.request));
	if (!parsed.success) throw zodToApiError(parsed.error);
	const r = await checkCredentials(parsed.data.email, parsed.data.password, clientIp(event), event.cookies.get(DEVICE_COOKIE));
	if (!r.ok && r.reason === 'throttled') {
		return json(
			{ error: { code: 'throttled', message: `Too many attempts. Try again in ${r.retryAfterS} s.`, retryAfterS: r.retryAfterS } },
			{ status: 429, headers: { 'retry-after': String(r.retryAfterS) } }
		);
	}
	if (!r.ok) throw new ApiError(401, 'invalid_credentials', SIGNIN_FAILED);
	await createSession(r.user.id, event.cookies, event.url);
	setDeviceCookie(event.cookies, event.url, DEVICE_COOKIE, r.deviceToken);
	return json({ user: { id: r.user.id, email: r.user.email, name: r.user.name, siteRole: r.user.siteRole, emailVerified: r.user.emailVerified } });
});
