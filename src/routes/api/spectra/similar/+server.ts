/** GET /api/spectra/similar?to=:id&limit= — nearest spectra by shape (a static route: never read as an :id). */
import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { requireUser } from '$lib/server/policy';
import { similarSpectra } from '$lib/server/services/spectraSimilar';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiHandler(async ({ locals, url }) => {
	requireUser(locals);
	return json(await similarSpectra(locals, url.searchParams.get('to'), url.searchParams.get('limit')));
});
