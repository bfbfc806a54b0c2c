import { fail, redirect } from '@sveltejs/kit';
import { lampCreateSchema } from '$lib/schemas/lamps';
import { createLamp } from '$lib/server/services/lampsApi';
import { exposureOf, previewLamp } from '$lib/server/services/lamps';
import { failureOf, formValues, lampBodyFromForm } from '$lib/server/services/lampForm';
import { zodToApiError } from '$lib/server/http';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
	return {};
};

export const actions: Actions = {
	/** Saves the lamp; the "Preview" button (intent=preview) computes it without saving. */
	default: async ({ request, locals, url }) => {
		if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
		const form = await request.formData();
		if (form.get('intent') === 'preview') return preview(form, locals);
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

/** Computes the lamp without saving it (emission, photon flux, cautions; a measured spectrum's floor handling). */
async function preview(form: FormData, locals: App.Locals) {
	const body = lampBodyFromForm(form);
	try {
		const parsed = lampCreateSchema.safeParse({ ...body, name: (body.name as string) || 'preview' });
		if (!parsed.success) throw zodToApiError(parsed.error);
		const p = parsed.data;
		return { values: formValues(form), preview: await previewLamp(p.model, p.powerW, p.couplingFactor ?? 1, locals, exposureOf({ exposureDistanceCm: p.exposureDistanceCm ?? null, exposureIrradianceWPerM2: p.exposureIrradianceWPerM2 ?? null })) };
	} catch (e) {
		const f = failureOf(e);
		if (!f) {
			if (e instanceof RangeError) return fail(422, { values: formValues(form), message: `model.${e.message}`, field: `model.${e.message.split(':')[0]}` });
			throw e;
		}
		return fail(f.status, { values: formValues(form), message: f.message, field: f.field });
	}
}
