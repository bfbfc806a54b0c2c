import { pageUser, asPage } from '$lib/server/auth/guard';
import { membershipsOf, roleAtLeast } from '$lib/server/policy';
import { spectrumListQuerySchema, PARTS } from '$lib/schemas/spectra';
import { searchSpectra } from '$lib/server/services/spectraSearch';
import { error } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';

type Item = Awaited<ReturnType<typeof searchSpectra>>['items'][number] & { absorbanceAt?: number; epsilonAt?: number };

/** What one table row shows (the page ships nothing else: no peaks, notes, warnings or file details). */
function rowOf(s: Item) {
	return {
		id: s.id,
		name: s.name,
		cas: s.cas,
		tags: s.tags,
		part: s.part,
		kind: s.kind,
		lambdaMaxNm: s.lambdaMaxNm,
		longestWavelengthBandNm: s.longestWavelengthBandNm,
		cutoff50Nm: s.cutoff50Nm,
		valueAtMax: s.valueAtMax,
		yUnit: s.yUnit,
		solvent: s.solvent,
		ownerName: s.ownerName,
		visibility: s.visibility,
		updatedAt: s.updatedAt,
		deletedAt: s.deletedAt,
		...(s.absorbanceAt !== undefined ? { absorbanceAt: s.absorbanceAt } : {}),
		...(s.epsilonAt !== undefined ? { epsilonAt: s.epsilonAt } : {})
	};
}

/** The Library table: filters and paging from the URL, searched on the server, one page of rows sent. */
export const load: PageServerLoad = async (event) => {
	const user = pageUser(event);
	const q = spectrumListQuerySchema.safeParse({ limit: '25', ...Object.fromEntries(event.url.searchParams) });
	if (!q.success) error(400, q.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; '));
	const found = await asPage(event, () => searchSpectra(event.locals, q.data));
	const result = { total: found.total, items: found.items.map((s) => rowOf(s as Item)) };
	const canUpload = user.siteRole === 'admin' || (await membershipsOf(user.id)).some((m) => roleAtLeast(m.role, 'member'));
	return { result, query: q.data, canUpload, parts: PARTS };
};
