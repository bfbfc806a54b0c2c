import { pageUser, asPage } from '$lib/server/auth/guard';
import { membershipsOf, roleAtLeast } from '$lib/server/policy';
import { spectrumListQuerySchema, PARTS } from '$lib/schemas/spectra';
import { searchSpectra } from '$lib/server/services/spectraSearch';
import { error } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';

/** The Library table: filters and paging from the URL, searched on the server. */
export const load: PageServerLoad = async (event) => {
	const user = pageUser(event);
	const q = spectrumListQuerySchema.safeParse({ limit: '25', ...Object.fromEntries(event.url.searchParams) });
	if (!q.success) error(400, q.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; '));
	const result = await asPage(event, () => searchSpectra(event.locals, q.data));
	const canUpload = user.siteRole === 'admin' || (await membershipsOf(user.id)).some((m) => roleAtLeast(m.role, 'member'));
	return { result, query: q.data, canUpload, parts: PARTS };
};
