import { error, fail, redirect } from '@sveltejs/kit';
import { findLamp, setGroupCalibrationIntervalDays } from '$lib/server/db/lamps';
import { calibrationRights } from '$lib/server/services/lampCalibrations';
import { ApiError } from '$lib/server/http';
import { membershipsOf, roleAtLeast } from '$lib/server/policy';
import { describeLamp, exposureOf, resolveLampModel, vesselPowerW } from '$lib/server/services/lamps';
import { failureOf, formValues, lampBodyFromForm } from '$lib/server/services/lampForm';
import { lampToApi, patchLamp, visibleLamp } from '$lib/server/services/lampsApi';
import type { Actions, PageServerLoad } from './$types';

/** The lamp the caller may see, or the error page with the API's status and message. */
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
	const api = await lampToApi(lamp, locals);
	let plot: { x: number[]; power: number[]; flux: number[] } | null = null;
	let bands: { band: string; fromNm: number; toNm: number; fraction: number }[] = [];
	let cautions: Awaited<ReturnType<typeof describeLamp>>['cautions'] = [];
	try {
		// spectrum and flux at the vessel (power × coupling); bands and cautions from what the lamp itself emits
		const d = describeLamp(await resolveLampModel(lamp.model, locals), vesselPowerW(lamp), undefined, lamp.powerW, exposureOf(lamp));
		// Plot on a 1 nm grid (every second point of the 0.5 nm planner grid).
		const x: number[] = [], power: number[] = [], flux: number[] = [];
		for (let i = 0; i < d.spectrum.wavelengthNm.length; i += 2) {
			x.push(d.spectrum.wavelengthNm[i]);
			power.push(d.spectrum.powerWPerNm[i] * 1e3);
			flux.push(d.photonFluxPerNm[i] * 1e9);
		}
		plot = { x, power, flux };
		bands = d.bands.map((b) => ({ band: b.band, fromNm: b.fromNm, toNm: b.toNm, fraction: b.fraction }));
		cautions = d.cautions;
	} catch {
		// lampToApi already reports the problem in api.problem
	}
	const ms = await membershipsOf(locals.user.id);
	const role = ms.find((m) => m.groupId === lamp.groupId)?.role;
	return {
		lamp: api,
		plot,
		bands,
		cautions,
		canEdit: locals.user.siteRole === 'admin' || roleAtLeast(role, 'member'),
		rights: await calibrationRights(locals, lamp)
	};
};

export const actions: Actions = {
	update: async ({ request, locals, params, url }) => {
		if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
		const form = await request.formData();
		try {
			await patchLamp(locals, params.id, lampBodyFromForm(form));
		} catch (e) {
			const f = failureOf(e);
			if (!f) throw e;
			return fail(f.status, { values: formValues(form), message: f.message, field: f.field });
		}
		return { saved: true };
	},
	/** A lead sets how many days a calibration stays current in the lamp's group (1–3650). */
	interval: async ({ request, locals, params, url }) => {
		if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
		const form = await request.formData();
		const lamp = await lampOr404(locals, params.id);
		if (!(await calibrationRights(locals, lamp)).canSetInterval) return fail(403, { intervalMessage: 'Only a lead of the group sets the calibration interval.', field: 'intervalDays' });
		const days = Number(String(form.get('intervalDays') ?? '').trim());
		if (!Number.isInteger(days) || days < 1 || days > 3650) {
			return fail(400, { intervalMessage: 'intervalDays: give a whole number of days between 1 and 3650.', field: 'intervalDays', intervalValue: String(form.get('intervalDays') ?? '') });
		}
		await setGroupCalibrationIntervalDays((await findLamp(lamp.id))!.groupId, days);
		return { intervalSaved: days };
	}
};
