import { json } from '@sveltejs/kit';
import { getSolvent } from '$lib/server/db/solvents';
import { ApiError, apiHandler, notFound, readJson } from '$lib/server/http';
import { requireUser } from '$lib/server/policy';
import { linkSolventSpectrum } from '$lib/server/services/solventLink';
import type { RequestHandler } from './$types';

/** GET /api/solvents/:id — anyone: one solvent with its cut-off, source, status and linked measured spectrum. */
export const GET: RequestHandler = apiHandler(async ({ params }) => {
	const id = Number(params.id);
	const s = Number.isInteger(id) && id > 0 ? await getSolvent(id) : null;
	if (!s) throw notFound('No such solvent.');
	return json(s);
});

/**
 * PATCH /api/solvents/:id `{ spectrumId: number | null }` — group leads and admins: links the solvent to a public
 * measured absorption spectrum of the Library (null unlinks); the Window finder then uses the measured curve.
 */
export const PATCH: RequestHandler = apiHandler(async ({ params, request, locals }) => {
	requireUser(locals);
	const id = Number(params.id);
	const s = Number.isInteger(id) && id > 0 ? await getSolvent(id) : null;
	if (!s) throw notFound('No such solvent.');
	const body = (await readJson(request)) as Record<string, unknown> | null;
	if (!body || typeof body !== 'object' || !('spectrumId' in body)) throw new ApiError(400, 'invalid', 'spectrumId: give a spectrum id, or null to unlink.', { field: 'spectrumId' });
	return json(await linkSolventSpectrum(locals, id, body.spectrumId));
});
