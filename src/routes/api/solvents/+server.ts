import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { listSolvents } from '$lib/server/db/solvents';
import { searchSolvents } from '$lib/server/services/solventSearch';
import type { RequestHandler } from './$types';

/** GET /api/solvents?q= — anyone: `[{ id, name, cutoffNm, source, status, spectrumId, ... }]`; a CAS-shaped q is an exact CAS look-up. */
export const GET: RequestHandler = apiHandler(async ({ url }) => {
	const all = await listSolvents();
	// a CAS-shaped q matches the CAS number exactly (400 naming q when its check digit is wrong); names stay fuzzy
	const hits = searchSolvents(all, url.searchParams.get('q') ?? '');
	return json(hits);
});
