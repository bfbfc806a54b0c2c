import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { requireUser } from '$lib/server/policy';
import { computeWindowFor } from '$lib/server/services/window';
import type { RequestHandler } from './$types';

/**
 * POST /api/window — viewer+: windows, per-lamp absorbed photon flux, selectivity and times, ranking, cautions.
 * 400/422 name the field; 404 for spectra the caller cannot see.
 */
export const POST: RequestHandler = apiHandler(async ({ locals, request }) => {
	requireUser(locals);
	return json(await computeWindowFor(locals, await readJson(request)));
});
