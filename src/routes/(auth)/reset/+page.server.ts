import { fail, redirect } from '@sveltejs/kit';
import { resetSchema, fieldErrors } from '$lib/schemas/auth';
import { resetPassword } from '$lib/server/auth/account';
import { linkIsLive } from '$lib/server/db/authLinks';
import { hashSecret } from '$lib/server/auth/tokens';
import { readForm, errorsOf } from '$lib/server/auth/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ url }) => {
	const token = url.searchParams.get('token') ?? '';
	const live = token.length >= 10 && token.length <= 100 && (await linkIsLive('password_resets', hashSecret(token)));
	return { token: live ? token : '', live };
};

export const actions: Actions = {
	default: async ({ request }) => {
		const v = await readForm(request);
		const parsed = resetSchema.safeParse(v);
		if (!parsed.success) return fail(400, { errors: fieldErrors(parsed.error) });
		const userId = await resetPassword(parsed.data.token, parsed.data.password);
		if (!userId) return fail(400, { errors: errorsOf('form', 'This link is unknown, used or expired. Ask for a new one.') });
		redirect(303, '/signin?reset=1');
	}
};
