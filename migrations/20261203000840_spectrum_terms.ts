import type { Knex } from 'knex';
import { spectrumTermTexts, trigramsOf } from '../src/lib/spectra/trigrams';

/**
 * The n-gram index of the Library's names: one row per distinct trigram of a spectrum's name,
 * synonyms and CAS number (see src/lib/spectra/trigrams.ts). Filled for the existing rows; `down`
 * drops it (it is derived data).
 */
const BATCH = 500;

export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('spectrum_terms', (t) => {
		t.specificType('gram', 'MEDIUMINT UNSIGNED').notNullable();
		t.integer('spectrum_id').unsigned().notNullable().references('id').inTable('spectra').onDelete('CASCADE');
		t.primary(['gram', 'spectrum_id']);
		t.index(['spectrum_id']);
	});
	for (let after = 0; ; ) {
		const rows: { id: number; name: string; synonyms: string | null; cas: string | null }[] = await knex('spectra').where('id', '>', after).orderBy('id').limit(BATCH).select('id', 'name', 'synonyms', 'cas');
		if (!rows.length) break;
		const terms = rows.flatMap((r) => trigramsOf(...spectrumTermTexts(r)).map((gram) => ({ gram, spectrum_id: r.id })));
		for (let i = 0; i < terms.length; i += 5000) await knex('spectrum_terms').insert(terms.slice(i, i + 5000));
		after = rows[rows.length - 1].id;
	}
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('spectrum_terms');
}
