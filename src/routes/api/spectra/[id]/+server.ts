/** GET / PATCH / DELETE /api/spectra/:id (API.md). DELETE is a soft delete; POST …/restore undoes it. */
import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { requireUser } from '$lib/server/policy';
import { canEditSpectrum, visibleSpectrum } from '$lib/server/services/spectraAccess';
import { patchSpectrum, setSpectrumDeleted } from '$lib/server/services/spectraEdit';
import { spectrumToApi } from '$lib/server/services/spectraView';
import { tagsOfSpectra } from '$lib/server/db/tags';
import { measuredQuantumYieldsOf } from '$lib/server/services/quantumYield';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiHandler(async ({ locals, params }) => {
	const { caller, row } = await visibleSpectrum(locals, params.id);
	const tags = (await tagsOfSpectra([row.id])).get(row.id) ?? [];
	// measured Φ (POST /api/quantum-yield with save), newest first — the Window finder offers them
	return json({ ...spectrumToApi(row, tags, { canEdit: canEditSpectrum(caller, row) }), measuredQuantumYields: await measuredQuantumYieldsOf(Number(row.id)) });
});

export const PATCH: RequestHandler = apiHandler(async ({ locals, params, request }) => {
	requireUser(locals);
	return json(await patchSpectrum(locals, params.id, await readJson(request)));
});

export const DELETE: RequestHandler = apiHandler(async ({ locals, params }) => json(await setSpectrumDeleted(locals, params.id, true)));
