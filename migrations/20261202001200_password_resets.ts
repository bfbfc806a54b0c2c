import type { Knex } from 'knex';

/** Password-reset links: single use, 1 hour, only the SHA-256 of the token is stored. */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('password_resets', (t) => {
		t.increments('id').primary();
		t.string('user_id', 40).notNullable().references('id').inTable('users').onDelete('CASCADE');
		t.string('token_hash', 64).notNullable().unique();
		t.datetime('expires_at').notNullable();
		t.datetime('used_at').nullable();
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.index(['user_id']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('password_resets');
}
