import { redirect } from '@sveltejs/kit';
import { timeFromLabel } from '$lib/irradiation/quantumYield/seriesFit';
import { listSpectrumSummaries } from '$lib/server/db/spectra';
import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { listLamps } from '$lib/server/db/lamps';
import { callerOf } from '$lib/server/services/spectraAccess';
import type { PageServerLoad } from './$types';

/** Choices for the Φ measurement: series (uploads with ≥ 3 absorbance spectra), molar spectra, lamps, walls. */
export const load: PageServerLoad = async ({ locals, url }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname + url.search)}`);
	const caller = await callerOf(locals);
	const groupIds = caller.memberships.map((m) => m.groupId);
	const [spectra, materials, lamps] = await Promise.all([listSpectrumSummaries(caller.reader, { kind: 'absorption' }), listWallMaterials(groupIds), listLamps(groupIds)]);
	const measured = spectra.filter((s) => s.y_unit === 'absorbance');
	// one upload = one file (same bytes) of one owner: its blocks/columns in file order
	const uploads = new Map<string, typeof measured>();
	for (const s of measured) {
		if (!s.file_sha256) continue;
		const key = `${s.owner_id}:${s.file_sha256}`;
		uploads.set(key, [...(uploads.get(key) ?? []), s]);
	}
	const series = [...uploads.values()]
		.filter((list) => list.length >= 3)
		.map((list) => {
			const sorted = [...list].sort((a, b) => (a.block_index ?? 0) - (b.block_index ?? 0) || a.id - b.id);
			return { label: `${sorted[0].file_name ?? 'upload'} — ${sorted.length} spectra`, ids: sorted.map((s) => s.id) };
		});
	return {
		spectra: measured.map((s) => ({ id: s.id, name: s.name, label: s.block_label ?? s.name, time: timeFromLabel(s.block_label ?? s.name), pathCm: s.path_cm })),
		molar: spectra
			.filter((s) => s.y_unit === 'epsilon' || (Number(s.concentration_m) > 0 && Number(s.path_cm) > 0))
			.map((s) => ({ id: s.id, name: s.name, part: s.part, lambdaMaxNm: s.lambda_max_nm, longestWavelengthBandNm: s.longest_band_nm })),
		series,
		lamps: lamps.map((l) => ({ id: l.id, name: l.name })),
		materials: materials.map((m) => ({ id: m.id, name: m.name, typicalThicknessMm: m.typicalThicknessMm }))
	};
};
