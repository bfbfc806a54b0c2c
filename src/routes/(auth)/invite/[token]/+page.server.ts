import { fail, redirect } from '@sveltejs/kit';
import { inviteSignUpSchema, fieldErrors } from '$lib/schemas/auth';
import { acceptInvitation, openInvitation, signUpFromInvitation } from '$lib/server/auth/membership';
import { createSession } from '$lib/server/auth/session';
import { findUserByEmail } from '$lib/server/db/users';
import { ApiError } from '$lib/server/http';
import { keep, readForm, errorsOf } from '$lib/server/auth/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params, locals }) => {
	const inv = await openInvitation(params.token);
	if (!inv) return { invitation: null };
	return {
		invitation: { groupName: inv.groupName, role: inv.role, email: inv.email },
		// Whoever holds the link was sent it at this address, so telling them it has an account is no leak.
		hasAccount: !!(await findUserByEmail(inv.email)),
		signedInAs: locals.user?.email ?? null
	};
};

export const actions: Actions = {
	accept: async ({ params, locals, url }) => {
		if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
		let slug: string;
		try {
			slug = await acceptInvitation(locals.user, params.token);
		} catch (e) {
			if (e instanceof ApiError) return fail(e.status, { errors: errorsOf('form', e.message) });
			throw e;
		}
		redirect(303, `/groups/${slug}`);
	},
	signup: async ({ params, request, cookies, url }) => {
		const v = await readForm(request);
		const parsed = inviteSignUpSchema.safeParse(v);
		if (!parsed.success) return fail(400, { ...keep(v, 'name'), errors: fieldErrors(parsed.error) });
		let r: { userId: string; slug: string };
		try {
			r = await signUpFromInvitation(params.token, parsed.data);
		} catch (e) {
			if (e instanceof ApiError) return fail(e.status, { ...keep(v, 'name'), errors: errorsOf('form', e.message) });
			throw e;
		}
		await createSession(r.userId, cookies, url);
		redirect(303, `/groups/${r.slug}`);
	}
};
