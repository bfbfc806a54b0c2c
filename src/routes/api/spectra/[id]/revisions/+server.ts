/** GET /api/spectra/:id/revisions — the metadata history, newest first. */
import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { visibleSpectrum } from '$lib/server/services/spectraAccess';
import { revisionsOf } from '$lib/server/services/spectraRevisions';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiHandler(async ({ locals, params }) => {
	const { row } = await visibleSpectrum(locals, params.id);
	return json({ items: await revisionsOf(row.id) });
});
