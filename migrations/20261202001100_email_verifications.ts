import type { Knex } from 'knex';

/** One-time e-mail verification links; only the SHA-256 of the token is stored. */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('email_verifications', (t) => {
		t.increments('id').primary();
		t.string('user_id', 40).notNullable().references('id').inTable('users').onDelete('CASCADE');
		t.string('email', 254).notNullable();
		t.string('token_hash', 64).notNullable().unique();
		t.datetime('expires_at').notNullable();
		t.datetime('used_at').nullable();
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.index(['user_id']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('email_verifications');
}
