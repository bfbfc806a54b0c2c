import type { Knex } from 'knex';

/** Which tags a spectrum carries. */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('spectrum_tags', (t) => {
		t.integer('spectrum_id').unsigned().notNullable().references('id').inTable('spectra').onDelete('CASCADE');
		t.integer('tag_id').unsigned().notNullable().references('id').inTable('tags').onDelete('CASCADE');
		t.primary(['spectrum_id', 'tag_id']);
		t.index(['tag_id']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('spectrum_tags');
}
