import type { Knex } from 'knex';

/**
 * From here on a spectrum whose file series are byte for byte its normalised series (a file in nm,
 * ascending, in the stored unit) keeps only the normalised pair in `spectrum_points` (series 2 and
 * 3); the original pair (series 0 and 1) is implied and read back from them (db/spectra.ts
 * storedSide / sideDataOf). Nothing changes in the schema, so `up` has nothing to do; `down` writes
 * every implied original pair out, so the earlier code — and the rollback of the spectrum_points
 * migration — find all four series again.
 */
export async function up(): Promise<void> {}

export async function down(knex: Knex): Promise<void> {
	// series 2 → 0 (x), 3 → 1 (y) for every spectrum that has neither 0 nor 1
	await knex.raw(
		`INSERT INTO spectrum_points (spectrum_id, series, chunk_no, data)
		 SELECT p.spectrum_id, p.series - 2, p.chunk_no, p.data FROM spectrum_points p
		 WHERE p.series IN (2, 3) AND NOT EXISTS (SELECT 1 FROM spectrum_points o WHERE o.spectrum_id = p.spectrum_id AND o.series IN (0, 1))`
	);
}
