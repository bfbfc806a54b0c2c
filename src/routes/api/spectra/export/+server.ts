/** GET /api/spectra/export?ids=1,2,3&format=jcamp — several spectra as one JCAMP-DX LINK file. */
import { apiHandler } from '$lib/server/http';
import { requireUser } from '$lib/server/policy';
import { exportSpectraLink } from '$lib/server/services/spectraExportLink';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiHandler(async ({ locals, url }) => {
	requireUser(locals);
	const file = await exportSpectraLink(locals, url.searchParams.get('ids'), url.searchParams.get('format'));
	return new Response(file.body, {
		headers: { 'content-type': file.type, 'content-disposition': `attachment; filename="${file.filename}"`, 'cache-control': 'private, no-store' }
	});
});
