import { fail, redirect } from '@sveltejs/kit';
import { verifyEmail } from '$lib/server/auth/account';
import { linkIsLive } from '$lib/server/db/authLinks';
import { hashSecret } from '$lib/server/auth/tokens';
import { readForm, errorsOf } from '$lib/server/auth/forms';
import type { Actions, PageServerLoad } from './$types';

// Verification happens on an explicit POST, so mail scanners that prefetch links do not use it up.
export const load: PageServerLoad = async ({ url }) => {
	const token = url.searchParams.get('token') ?? '';
	const live = token.length >= 10 && token.length <= 100 && (await linkIsLive('email_verifications', hashSecret(token)));
	return { token: live ? token : '', live };
};

export const actions: Actions = {
	default: async ({ request, locals }) => {
		const { token = '' } = await readForm(request);
		if (token.length < 10 || token.length > 100) return fail(400, { errors: errorsOf('form', 'This link is incomplete.') });
		const userId = await verifyEmail(token);
		if (!userId) return fail(400, { errors: errorsOf('form', 'This link is unknown, used or expired. Sign in and ask for a new one on your account page.') });
		redirect(303, locals.user ? '/account?verified=1' : '/signin?verified=1');
	}
};
