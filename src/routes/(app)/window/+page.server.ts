import { fail, redirect } from '@sveltejs/kit';
import { DEFAULT_WINDOW_THRESHOLDS } from '$lib/irradiation/window';
import { listSolvents } from '$lib/server/db/solvents';
import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { listLamps } from '$lib/server/db/lamps';
import { ApiError } from '$lib/server/http';
import { callerOf, visibleSpectrum } from '$lib/server/services/spectraAccess';
import { requireMemberSomewhere } from '$lib/server/services/groupChoice';
import { describeModel } from '$lib/server/services/lamps';
import { createPlan } from '$lib/server/services/plans';
import { computeWindowFor } from '$lib/server/services/window';
import type { SpectrumChoice } from '$lib/components/SpectrumCombobox.svelte';
import { checkInputs } from './windowChecks';
import { defaultInputs, inputsFromQuery, requestBody } from './windowQuery';
import type { Actions, PageServerLoad } from './$types';

/** A spectrum named in the link, as the picker shows it (null when the caller may not see it). */
async function choiceOf(locals: App.Locals, id: number | null | undefined): Promise<SpectrumChoice | null> {
	if (!id) return null;
	try {
		const { row } = await visibleSpectrum(locals, String(id));
		return {
			id: Number(row.id),
			name: row.name,
			part: row.part,
			lambdaMaxNm: row.lambda_max_nm,
			longestWavelengthBandNm: row.longest_band_nm,
			solvent: row.solvent,
			hasEpsilon: row.y_unit === 'epsilon' || (Number(row.concentration_m) > 0 && Number(row.path_cm) > 0)
		};
	} catch (e) {
		if (e instanceof ApiError) return null;
		throw e;
	}
}

/**
 * Choices for the form (solvents, walls, the group's lamps) and — for a shared link — the answer itself, computed here
 * so that the first render already shows the window. Spectra are searched as the user types (GET /api/spectra).
 */
export const load: PageServerLoad = async ({ locals, url }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname + url.search)}`);
	const caller = await callerOf(locals);
	const groupIds = caller.memberships.map((m) => m.groupId);
	const inputs = inputsFromQuery(url.searchParams, defaultInputs({ ...DEFAULT_WINDOW_THRESHOLDS }));
	const [solvents, materials, lamps, substrate, product, photocatalyst, ...others] = await Promise.all([
		listSolvents(),
		listWallMaterials(groupIds),
		listLamps(groupIds),
		choiceOf(locals, inputs.substrateId),
		choiceOf(locals, inputs.productId),
		choiceOf(locals, inputs.photocatalyst?.spectrumId),
		...inputs.others.map((o) => choiceOf(locals, o.spectrumId))
	]);

	let initial: { key: string; result: unknown; problem: { message: string; field?: string } | null } | null = null;
	const body = requestBody(inputs);
	if (body && checkInputs(inputs).length === 0) {
		const key = JSON.stringify(body);
		try {
			initial = { key, result: await computeWindowFor(locals, body), problem: null };
		} catch (e) {
			if (!(e instanceof ApiError)) throw e;
			initial = { key, result: null, problem: { message: e.message, field: e.extra.field } };
		}
	}

	return {
		solvents: solvents.map((s) => ({ id: s.id, slug: s.slug, name: s.name, cutoffNm: s.cutoffNm, status: s.status })),
		materials: materials.map((m) => ({ id: m.id, slug: m.slug, name: m.name, typicalThicknessMm: m.typicalThicknessMm })),
		lamps: lamps.map((l) => ({ id: l.id, name: l.name, label: describeModel(l.model) })),
		defaultThresholds: { ...DEFAULT_WINDOW_THRESHOLDS },
		canSave: caller.memberships.some((m) => m.role !== 'viewer') || caller.reader.isAdmin,
		chosen: { substrate, product, photocatalyst, others: others as (SpectrumChoice | null)[] },
		initial,
		/** One key per page render: the server stores one plan per key, so a double submit saves one plan. */
		idempotencyKey: crypto.randomUUID()
	};
};

export const actions: Actions = {
	/** Saves the current inputs as a draft irradiation plan (member+); results are recomputed on the server. */
	save: async ({ locals, request, url }) => {
		if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
		try {
			await requireMemberSomewhere(locals);
		} catch (e) {
			if (e instanceof ApiError) return fail(e.status, { saveError: e.message, field: 'title' });
			throw e;
		}
		const form = await request.formData();
		const title = String(form.get('title') ?? '').trim() || String(form.get('defaultTitle') ?? '').trim();
		if (!title) return fail(400, { saveError: 'Give the plan a title.', field: 'title' });
		let inputs: unknown;
		try {
			inputs = JSON.parse(String(form.get('inputs') ?? ''));
		} catch {
			return fail(400, { saveError: 'The inputs could not be read; reload the page and try again.', field: 'inputs' });
		}
		const idempotencyKey = String(form.get('idempotencyKey') ?? '') || undefined;
		try {
			// One plan per key (the plans service keeps it): a repeated submit answers the plan saved the first time.
			const { plan } = await createPlan(locals, { title, inputs, query: String(form.get('query') ?? '') || undefined, idempotencyKey });
			return { saved: { id: plan.id, title: plan.title } };
		} catch (e) {
			if (!(e instanceof ApiError)) throw e;
			return fail(e.status, { saveError: e.message, field: e.extra.field ?? 'inputs' });
		}
	}
};
