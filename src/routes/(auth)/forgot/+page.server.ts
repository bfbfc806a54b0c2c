import { fail } from '@sveltejs/kit';
import { forgotSchema, fieldErrors } from '$lib/schemas/auth';
import { requestPasswordReset } from '$lib/server/auth/account';
import { readForm, errorsOf } from '$lib/server/auth/forms';
import { linkBase } from '$lib/server/mail/send';
import type { Actions } from './$types';

export const actions: Actions = {
	default: async ({ request, url, setHeaders }) => {
		const v = await readForm(request);
		const parsed = forgotSchema.safeParse(v);
		if (!parsed.success) return fail(400, { email: v.email ?? '', errors: fieldErrors(parsed.error) });
		const wait = await requestPasswordReset(parsed.data.email, linkBase(url));
		if (wait > 0) {
			// Counted per address whether or not it has an account, so this reveals nothing.
			setHeaders({ 'retry-after': String(wait) });
			return fail(429, { email: parsed.data.email, errors: errorsOf('form', `Several links went to this address recently. Try again in ${Math.ceil(wait / 60)} min.`) });
		}
		return { sent: true, email: parsed.data.email };
	}
};
