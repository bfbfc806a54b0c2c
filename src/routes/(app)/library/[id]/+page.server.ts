import { fail } from '@sveltejs/kit';
import { asPage, pageUser } from '$lib/server/auth/guard';
import { ApiError } from '$lib/server/http';
import { tagsOfSpectra } from '$lib/server/db/tags';
import { listSolvents } from '$lib/server/db/solvents';
import { canEditSpectrum, visibleSpectrum } from '$lib/server/services/spectraAccess';
import { patchSpectrum, setSpectrumDeleted } from '$lib/server/services/spectraEdit';
import { spectrumData } from '$lib/server/services/spectraExport';
import { revisionsOf } from '$lib/server/services/spectraRevisions';
import { similarSpectra } from '$lib/server/services/spectraSimilar';
import { spectrumToApi } from '$lib/server/services/spectraView';
import { formToPatch } from './formToPatch';
import type { Actions, PageServerLoad } from './$types';

/** Detail page: the spectrum, its points, history and nearest shapes. */
export const load: PageServerLoad = async (event) => {
	pageUser(event);
	const { caller, row } = await asPage(event, () => visibleSpectrum(event.locals, event.params.id));
	const tags = (await tagsOfSpectra([row.id])).get(row.id) ?? [];
	const similar = await similarSpectra(event.locals, String(row.id), '5').catch(() => ({ items: [] }));
	return {
		spectrum: spectrumToApi(row, tags, { canEdit: canEditSpectrum(caller, row) }),
		points: spectrumData(row, null),
		revisions: await revisionsOf(row.id),
		similar: similar.items.map((s) => ({ id: s.id, name: s.name, part: s.part, lambdaMaxNm: s.lambdaMaxNm, longestWavelengthBandNm: s.longestWavelengthBandNm, similarity: s.similarity, overlapNm: s.overlapNm })),
		linkedSolvents: (await listSolvents()).filter((v) => v.spectrumId === row.id).map((v) => ({ id: v.id, name: v.name }))
	};
};

/** Runs a service call; ApiErrors become `fail(status, { message, field })`. */
async function asAction<T>(fn: () => Promise<T>) {
	try {
		return await fn();
	} catch (e) {
		if (e instanceof ApiError) return fail(e.status, { message: e.message, field: e.extra.field ?? null });
		throw e;
	}
}

export const actions: Actions = {
	save: async (event) => {
		pageUser(event);
		const form = await event.request.formData();
		const patch = formToPatch(form);
		if ('error' in patch) return fail(400, { message: patch.error, field: patch.field });
		return asAction(async () => ({ saved: (await patchSpectrum(event.locals, event.params.id, patch.value)).version }));
	},
	delete: async (event) => {
		pageUser(event);
		return asAction(async () => ({ deleted: (await setSpectrumDeleted(event.locals, event.params.id, true)).deleted }));
	},
	restore: async (event) => {
		pageUser(event);
		return asAction(async () => ({ restored: !(await setSpectrumDeleted(event.locals, event.params.id, false)).deleted }));
	}
};
