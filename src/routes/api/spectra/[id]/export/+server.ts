/** GET /api/spectra/:id/export?format=jcamp|csv|original — a file download. */
import { apiHandler } from '$lib/server/http';
import { visibleSpectrum } from '$lib/server/services/spectraAccess';
import { exportSpectrum } from '$lib/server/services/spectraExport';
import type { RequestHandler } from './$types';
import { attachment } from '$lib/server/contentDisposition';

export const GET: RequestHandler = apiHandler(async ({ locals, params, url }) => {
	const { row } = await visibleSpectrum(locals, params.id);
	const file = exportSpectrum(row, url.searchParams.get('format'));
	return new Response(file.body as BodyInit, {
		headers: { 'content-type': file.type, 'content-disposition': attachment(file.filename), 'cache-control': 'private, no-store' }
	});
});
