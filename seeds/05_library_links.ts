import type { Knex } from 'knex';
import { DERIVE_VERSION, derivedColumns, deriveForLibrary } from '../src/lib/server/services/spectraDerive';
import { bufferToFloat64 } from '../src/lib/server/db/spectraBlobs';
import { vectorToBuffer } from '../src/lib/spectra/grid';
import type { NormalisedSpectrum } from '../src/lib/spectra/types';

/**
 * 1. (all modes) Spectra derived with older rules (`derived_extra` null, or an older `deriveVersion`) are re-derived
 *    from their stored normalised points, so λmax, peaks, the longest band and the similarity stretch
 *    follow the same rules for every row. Rows are read in batches; idempotent (a re-derived row is skipped next time).
 * 2. (demo mode) The demo group's three measured neat-solvent spectra are linked to their solvents (acetonitrile,
 *    dichloromethane, acetone) unless a lead already linked something else.
 */
const DEMO_LINKS: [solventSlug: string, fileName: string][] = [
	['acetonitrile', 'acetonitrile-neat-1cm.csv'],
	['dichloromethane', 'dichloromethane-neat-1cm.csv'],
	['acetone', 'acetone-neat-1cm.csv']
];

const demoMode = () => process.env.NODE_ENV !== 'production' || process.env.WINDOWSILL_DEMO === '1';

async function rederiveOldRows(knex: Knex): Promise<number> {
	let done = 0;
	for (;;) {
		const rows = await knex('spectra')
			.whereRaw("derived_extra IS NULL OR COALESCE(JSON_VALUE(derived_extra, '$.deriveVersion'), 0) < ?", [DERIVE_VERSION])
			.select('id', 'kind', 'x_nm', 'y_normalised', 'y_unit', 'concentration_m', 'path_cm').limit(50);
		if (!rows.length) return done;
		for (const r of rows) {
			const spec: NormalisedSpectrum = { kind: r.kind, x: bufferToFloat64(r.x_nm), y: bufferToFloat64(r.y_normalised), yUnit: r.y_unit };
			const { derived } = deriveForLibrary(spec, { concentrationM: r.concentration_m, pathCm: r.path_cm });
			await knex('spectra')
				.where({ id: r.id })
				.update({
					search_vector: Buffer.from(vectorToBuffer(derived.searchVector)),
					lambda_max_nm: derived.lambdaMaxNm,
					value_at_max: derived.valueAtMax,
					edge_nm: derived.edgeNm,
					cutoff10_nm: derived.cutoff10Nm,
					cutoff50_nm: derived.cutoff50Nm,
					peaks: JSON.stringify(derived.peaks),
					...derivedColumns(derived)
				});
			done++;
		}
	}
}

export async function seed(knex: Knex): Promise<void> {
	const n = await rederiveOldRows(knex);
	if (n) console.log(`[seed] re-derived ${n} spectra (longest band, excluded stretches)`);
	if (!demoMode()) return;
	const group = await knex('groups').where({ slug: 'harbourlight' }).first('id');
	if (!group) return;
	let linked = 0;
	for (const [slug, file] of DEMO_LINKS) {
		const spectrum = await knex('spectra').where({ group_id: group.id, file_name: file, visibility: 'public' }).whereNull('deleted_at').first('id');
		if (!spectrum) continue;
		linked += await knex('solvents').where({ slug }).whereNull('spectrum_id').update({ spectrum_id: spectrum.id, updated_at: knex.fn.now() });
	}
	if (linked) console.log(`[seed] linked ${linked} demo solvents to their measured spectra`);
}
