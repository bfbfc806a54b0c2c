import type { Knex } from 'knex';

/**
 * Derived values added to the Library: the longest-wavelength band maximum above noise (nm, indexed for sorting and
 * filtering) and a JSON column with the saturated / noise stretches left out of every derived value, the noise level,
 * notes on cut-offs outside the data and the stretch of the 1 nm grid that shape similarity may use. Existing rows
 * are filled by the re-derive seed (seeds/05_rederive.ts), which recomputes them from the stored points.
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.alterTable('spectra', (t) => {
		t.double('longest_band_nm').nullable();
		t.text('derived_extra').nullable();
		t.index(['longest_band_nm'], 'spectra_longest_band_idx');
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('spectra', (t) => {
		t.dropIndex(['longest_band_nm'], 'spectra_longest_band_idx');
		t.dropColumn('longest_band_nm');
		t.dropColumn('derived_extra');
	});
}
