import { fail, redirect } from '@sveltejs/kit';
import { signInSchema, fieldErrors } from '$lib/schemas/auth';
import { checkCredentials, DEVICE_COOKIE, SIGNIN_FAILED } from '$lib/server/auth/signin';
import { createSession, setDeviceCookie } from '$lib/server/auth/session';
import { clientIp } from '$lib/server/auth/guard';
import { readForm, safeNext, errorsOf } from '$lib/server/auth/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	if (locals.user) redirect(303, safeNext(url.searchParams.get('next')));
	return { verified: url.searchParams.has('verified'), reset: url.searchParams.has('reset') };
};

export const actions: Actions = {
	default: async (event) => {
		const v = await readForm(event.request);
		const parsed = signInSchema.safeParse(v);
		if (!parsed.success) return fail(400, { email: v.email ?? '', errors: fieldErrors(parsed.error) });
		const r = await checkCredentials(parsed.data.email, parsed.data.password, clientIp(event), event.cookies.get(DEVICE_COOKIE));
		if (!r.ok && r.reason === 'throttled') {
			event.setHeaders({ 'retry-after': String(r.retryAfterS) });
			return fail(429, { email: v.email, errors: errorsOf('form', `Too many attempts. Try again in ${Math.ceil(r.retryAfterS / 60)} min.`) });
		}
		if (!r.ok) return fail(400, { email: v.email, errors: errorsOf('form', SIGNIN_FAILED) });
		await createSession(r.user.id, event.cookies, event.url);
		setDeviceCookie(event.cookies, event.url, DEVICE_COOKIE, r.deviceToken);
		redirect(303, safeNext(event.url.searchParams.get('next')));
	}
};
