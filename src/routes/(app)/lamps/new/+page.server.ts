import { fail, redirect } from '@sveltejs/kit';
import { createLamp } from '$lib/server/services/lampsApi';
import { failureOf, formValues, lampBodyFromForm } from '$lib/server/services/lampForm';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
	return {};
};

export const actions: Actions = {
	default: async ({ request, locals, url }) => {
		if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
		const form = await request.formData();
		let id: number;
		try {
			id = (await createLamp(locals, lampBodyFromForm(form))).id;
		} catch (e) {
			const f = failureOf(e);
			if (!f) throw e;
			return fail(f.status, { values: formValues(form), message: f.message, field: f.field });
		}
		redirect(303, `/lamps/${id}`);
	}
};
