/** GET /api/spectra/:id/data?step= — `{ x, y, yUnit }` normalised, x in nm. */
import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { visibleSpectrum } from '$lib/server/services/spectraAccess';
import { spectrumData } from '$lib/server/services/spectraExport';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiHandler(async ({ locals, params, url }) => {
	const { row } = await visibleSpectrum(locals, params.id);
	return json(spectrumData(row, url.searchParams.get('step')));
});
