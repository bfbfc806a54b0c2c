import type { Knex } from 'knex';

/**
 * The 1 nm search vector (190–1100 nm, 911 Float32 little-endian) leaves the metadata row for
 * `spectrum_vectors` (one row per spectrum). Data are moved; `down` moves them back.
 */
const BATCH = 500;

export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('spectrum_vectors', (t) => {
		t.integer('spectrum_id').unsigned().primary().references('id').inTable('spectra').onDelete('CASCADE');
		t.specificType('vector', 'BLOB').notNullable();
	});
	for (let after = 0; ; ) {
		const rows: { id: number; search_vector: Buffer }[] = await knex('spectra').where('id', '>', after).orderBy('id').limit(BATCH).select('id', 'search_vector');
		if (!rows.length) break;
		await knex('spectrum_vectors').insert(rows.map((r) => ({ spectrum_id: r.id, vector: r.search_vector })));
		after = rows[rows.length - 1].id;
	}
	await knex.schema.alterTable('spectra', (t) => {
		t.dropColumn('search_vector');
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('spectra', (t) => {
		t.specificType('search_vector', 'BLOB').nullable();
	});
	await knex.raw('UPDATE spectra s JOIN spectrum_vectors v ON v.spectrum_id = s.id SET s.search_vector = v.vector');
	await knex.raw("UPDATE spectra SET search_vector = '' WHERE search_vector IS NULL");
	await knex.raw('ALTER TABLE spectra MODIFY search_vector BLOB NOT NULL');
	await knex.schema.dropTable('spectrum_vectors');
}
