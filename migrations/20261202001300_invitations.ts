import type { Knex } from 'knex';

/** Group invitations sent by e-mail; single use, expiring, token stored as SHA-256. */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('invitations', (t) => {
		t.increments('id').primary();
		t.integer('group_id').unsigned().notNullable().references('id').inTable('groups').onDelete('CASCADE');
		t.string('email', 254).notNullable();
		t.enu('role', ['lead', 'member', 'viewer']).notNullable();
		t.string('token_hash', 64).notNullable().unique();
		t.string('invited_by', 40).references('id').inTable('users').onDelete('SET NULL');
		t.datetime('expires_at').notNullable();
		t.datetime('accepted_at').nullable();
		t.string('accepted_by', 40).references('id').inTable('users').onDelete('SET NULL');
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.index(['group_id', 'email']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('invitations');
}
