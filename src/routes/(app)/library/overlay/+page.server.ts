import { pageUser } from '$lib/server/auth/guard';
import { visibleSpectrum } from '$lib/server/services/spectraAccess';
import { overlayOf } from '$lib/server/services/spectraOverlay';
import type { PageServerLoad } from './$types';

/** Overlay: `?ids=1,2,3` (shareable); spectra the caller may not see are left out and counted. */
export const load: PageServerLoad = async (event) => {
	pageUser(event);
	const ids = (event.url.searchParams.getAll('ids').join(',') || '').split(',').map((s) => s.trim()).filter((s) => /^\d+$/.test(s)).slice(0, 12);
	const rows = [];
	let hidden = 0;
	for (const id of ids) {
		const got = await visibleSpectrum(event.locals, id).catch(() => null);
		if (got && !got.row.deleted_at) rows.push(got.row);
		else hidden++;
	}
	return { ...overlayOf(rows), hidden, normalise: event.url.searchParams.get('scale') === 'max' };
};
