import type { Knex } from 'knex';

/** Sessions in the shape lucia's MySQL adapter expects (id, user_id, expires_at DATETIME). */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('sessions', (t) => {
		t.string('id', 255).primary();
		t.string('user_id', 40).notNullable().references('id').inTable('users').onDelete('CASCADE');
		t.datetime('expires_at').notNullable();
		t.index(['user_id']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('sessions');
}
