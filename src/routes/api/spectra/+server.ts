/** GET /api/spectra (search, API.md) and POST /api/spectra (multipart upload; `?preview=1` parses and stores nothing). */
import { json } from '@sveltejs/kit';
import { ApiError, apiHandler, readFormData, zodToApiError } from '$lib/server/http';
import { spectrumListQuerySchema } from '$lib/schemas/spectra';
import { searchSpectra } from '$lib/server/services/spectraSearch';
import { uploadSpectrumFile } from '$lib/server/services/spectraUpload';
import { defaultGroupFor, requireUser } from '$lib/server/policy';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiHandler(async ({ locals, url }) => {
	requireUser(locals);
	const q = spectrumListQuerySchema.safeParse(Object.fromEntries(url.searchParams));
	if (!q.success) throw zodToApiError(q.error);
	return json(await searchSpectra(locals, q.data));
});

export const POST: RequestHandler = apiHandler(async ({ locals, request, url }) => {
	requireUser(locals);
	// Role first: viewers get 403 whatever they send.
	await defaultGroupFor(locals, 'member');
	const type = request.headers.get('content-type') ?? '';
	if (!type) throw new ApiError(400, 'invalid', 'file: attach the spectrum file as multipart field "file"', { field: 'file' });
	if (!/multipart\/form-data/i.test(type))
		throw new ApiError(415, 'unsupported_media_type', 'Send the file as multipart/form-data with a "file" field (and an optional "metadata" JSON field).', { field: 'file' });
	const form = await readFormData(request);
	const preview = url.searchParams.get('preview') === '1' || form.get('preview') === '1';
	const result = await uploadSpectrumFile(locals, form.get('file'), form.get('metadata'), preview);
	return json(result, { status: preview ? 200 : 201 });
});
