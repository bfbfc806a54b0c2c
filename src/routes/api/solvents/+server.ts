import { json } from '@sveltejs/kit';
import { listSolvents } from '$lib/server/db/solvents';
import { searchSolvents } from '$lib/server/services/solventSearch';
import type { RequestHandler } from './$types';

/** GET /api/solvents?q= — anyone: `[{ id, name, cutoffNm, source, status, ... }]`. */
export const GET: RequestHandler = async ({ url }) => {
	const all = await listSolvents();
	const hits = searchSolvents(all, url.searchParams.get('q') ?? '');
	return json(hits);
};
