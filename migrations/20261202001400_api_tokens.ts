import type { Knex } from 'knex';

/** Personal API tokens (Authorization: Bearer); shown once, stored as SHA-256. */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('api_tokens', (t) => {
		t.increments('id').primary();
		t.string('user_id', 40).notNullable().references('id').inTable('users').onDelete('CASCADE');
		t.string('name', 80).notNullable();
		t.string('token_hash', 64).notNullable().unique();
		t.string('prefix', 12).notNullable();
		t.datetime('last_used_at').nullable();
		t.datetime('revoked_at').nullable();
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.index(['user_id']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('api_tokens');
}
