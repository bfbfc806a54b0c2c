import type { Knex } from 'knex';

/** Free-text tags shared across the Library (lower-case, unique). */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('tags', (t) => {
		t.increments('id').primary();
		t.string('name', 60).notNullable().unique();
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('tags');
}
