import { redirect } from '@sveltejs/kit';
import { DEFAULT_WINDOW_THRESHOLDS } from '$lib/irradiation/window';
import { listSpectrumSummaries } from '$lib/server/db/spectra';
import { listSolvents } from '$lib/server/db/solvents';
import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { listLamps } from '$lib/server/db/lamps';
import { callerOf } from '$lib/server/services/spectraAccess';
import { describeModel } from '$lib/server/services/lamps';
import type { PageServerLoad } from './$types';

/** Choices for the Window finder form: visible absorption spectra, solvents, walls and the group's lamps. */
export const load: PageServerLoad = async ({ locals, url }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname + url.search)}`);
	const caller = await callerOf(locals);
	const groupIds = caller.memberships.map((m) => m.groupId);
	const [spectra, solvents, materials, lamps] = await Promise.all([
		listSpectrumSummaries(caller.reader, { kind: 'absorption' }),
		listSolvents(),
		listWallMaterials(groupIds),
		listLamps(groupIds)
	]);
	return {
		spectra: spectra.map((s) => ({
			id: s.id,
			name: s.name,
			part: s.part,
			synonyms: s.synonyms ? String(s.synonyms) : '',
			cas: s.cas,
			solvent: s.solvent,
			lambdaMaxNm: s.lambda_max_nm,
			longestWavelengthBandNm: s.longest_band_nm,
			hasEpsilon: s.y_unit === 'epsilon' || (Number(s.concentration_m) > 0 && Number(s.path_cm) > 0),
			tripletEnergyKJPerMol: s.triplet_energy_kj_per_mol
		})),
		solvents: solvents.map((s) => ({ id: s.id, slug: s.slug, name: s.name, cutoffNm: s.cutoffNm, status: s.status })),
		materials: materials.map((m) => ({ id: m.id, slug: m.slug, name: m.name, typicalThicknessMm: m.typicalThicknessMm })),
		lamps: lamps.map((l) => ({ id: l.id, name: l.name, label: describeModel(l.model) })),
		defaultThresholds: { ...DEFAULT_WINDOW_THRESHOLDS },
		canSave: caller.memberships.some((m) => m.role !== 'viewer') || caller.reader.isAdmin
	};
};
