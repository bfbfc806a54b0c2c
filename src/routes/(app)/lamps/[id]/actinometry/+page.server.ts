import { error, fail, redirect } from '@sveltejs/kit';
import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { ApiError } from '$lib/server/http';
import { actinometersToApi, calibrationRights, recordActinometry, recordRadiometer } from '$lib/server/services/lampCalibrations';
import { actinometryBodyFromForm, failureOf, formValues, radiometerBodyFromForm } from '$lib/server/services/lampForm';
import { describeLamp, exposureOf, resolveLampModel, vesselPowerW } from '$lib/server/services/lamps';
import { lampToApi, visibleLamp } from '$lib/server/services/lampsApi';
import type { Actions, PageServerLoad } from './$types';

async function lampOr404(locals: App.Locals, id: string) {
	try {
		return await visibleLamp(locals, id);
	} catch (e) {
		if (e instanceof ApiError) error(e.status, e.message);
		throw e;
	}
}

export const load: PageServerLoad = async ({ locals, params, url }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
	const lamp = await lampOr404(locals, params.id);
	let cautions: ReturnType<typeof describeLamp>['cautions'] = [];
	try {
		cautions = describeLamp(await resolveLampModel(lamp.model, locals), vesselPowerW(lamp), undefined, lamp.powerW, exposureOf(lamp)).cautions;
	} catch {
		// the lamp page explains a model that cannot be computed
	}
	const materials = (await listWallMaterials([lamp.groupId])).map((m) => ({ id: m.id, name: m.name, typicalThicknessMm: m.typicalThicknessMm }));
	return { lamp: await lampToApi(lamp, locals), actinometers: actinometersToApi(), materials, cautions, rights: await calibrationRights(locals, lamp) };
};

async function run(locals: App.Locals, url: URL, form: FormData, work: () => Promise<unknown>, kind: 'record' | 'radiometer') {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
	try {
		return { kind, result: await work() };
	} catch (e) {
		const f = failureOf(e);
		if (!f) throw e;
		// form inputs are named like the API fields, without the `vessel.` prefix
		return fail(f.status, { kind, values: formValues(form), message: f.message, field: f.field?.replace(/^vessel\./, '') });
	}
}

export const actions: Actions = {
	record: async ({ request, locals, params, url }) => {
		if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
		const form = await request.formData();
		const lamp = await lampOr404(locals, params.id);
		return run(locals, url, form, () => recordActinometry(locals, actinometryBodyFromForm(form, lamp.id)), 'record');
	},
	radiometer: async ({ request, locals, params, url }) => {
		const form = await request.formData();
		return run(locals, url, form, () => recordRadiometer(locals, params.id, radiometerBodyFromForm(form)), 'radiometer');
	}
};
