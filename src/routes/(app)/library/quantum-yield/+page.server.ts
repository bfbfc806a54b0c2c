import { redirect } from '@sveltejs/kit';
import { seriesTimeS } from '$lib/irradiation/quantumYield/timeLabel';
import { listAbsorbanceSeries } from '$lib/server/db/spectra';
import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { listLamps } from '$lib/server/db/lamps';
import { callerOf } from '$lib/server/services/spectraAccess';
import type { PageServerLoad } from './$types';

/** Uploads offered as a series (the newest; others are added one by one with the Library picker). */
const SERIES_SHOWN = 200;

/**
 * Choices for the Φ measurement: the newest series (uploads with ≥ 3 absorbance spectra, grouped in SQL), lamps and
 * walls. Single spectra, the reactant and the product are picked by searching the Library as one types — the page
 * never carries the whole Library.
 */
export const load: PageServerLoad = async ({ locals, url }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname + url.search)}`);
	const caller = await callerOf(locals);
	const groupIds = caller.memberships.map((m) => m.groupId);
	const [{ series, more }, materials, lamps] = await Promise.all([listAbsorbanceSeries(caller.reader, SERIES_SHOWN), listWallMaterials(groupIds), listLamps(groupIds)]);
	return {
		series: series.map((s) => ({
			label: `${s.fileName ?? 'upload'} — ${s.spectra.length} spectra`,
			ids: s.spectra.map((x) => x.id),
			spectra: s.spectra.map((x) => ({ id: x.id, name: x.name, label: x.block_label ?? x.name, time: seriesTimeS(x.block_time_s, x.block_label ?? x.name), pathCm: x.path_cm }))
		})),
		moreSeries: more,
		lamps: lamps.map((l) => ({ id: l.id, name: l.name })),
		materials: materials.map((m) => ({ id: m.id, name: m.name, typicalThicknessMm: m.typicalThicknessMm }))
	};
};
