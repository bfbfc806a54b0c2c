import type { Knex } from 'knex';

/**
 * Solvents with their UV cut-off (nm, A = 1 in 1 cm vs water), where the value comes from (`source`) and how sure it
 * is (`status`: verified / from memory / common practice / estimate). A solvent may link to a measured spectrum
 * from the library (`spectrum_id`), which then wins over the cut-off edge model.
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('solvents', (t) => {
		t.increments('id').primary();
		t.string('slug', 80).notNullable().unique();
		t.string('name', 120).notNullable();
		t.json('synonyms');
		t.string('cas', 20);
		t.double('cutoff_nm').notNullable();
		t.double('refractive_index');
		t.text('source').notNullable();
		t.string('status', 40).notNullable();
		t.text('notes');
		t.integer('spectrum_id').unsigned();
		t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('solvents');
}
