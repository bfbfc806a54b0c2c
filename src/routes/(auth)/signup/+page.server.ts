import { fail } from '@sveltejs/kit';
import { signUpSchema, fieldErrors } from '$lib/schemas/auth';
import { signUp } from '$lib/server/auth/account';
import { keep, readForm } from '$lib/server/auth/forms';
import { linkBase } from '$lib/server/mail/send';
import type { Actions } from './$types';

export const actions: Actions = {
	default: async ({ request, url }) => {
		const v = await readForm(request);
		const parsed = signUpSchema.safeParse(v);
		if (!parsed.success) return fail(400, { ...keep(v, 'name', 'email'), errors: fieldErrors(parsed.error) });
		await signUp(parsed.data, linkBase(url));
		// Same answer whether or not the address had an account.
		return { sent: true, email: parsed.data.email };
	}
};
