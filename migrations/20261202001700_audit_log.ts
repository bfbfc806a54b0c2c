import type { Knex } from 'knex';

/** Who did what to accounts and groups (sign-ins, invitations, role changes, tokens). */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('audit_log', (t) => {
		t.bigIncrements('id').primary();
		t.string('actor_id', 40).nullable();
		t.string('action', 60).notNullable();
		t.string('target', 120).nullable();
		t.integer('group_id').unsigned().nullable();
		t.text('details').nullable();
		t.string('ip', 64).nullable();
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.index(['actor_id']);
		t.index(['group_id']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('audit_log');
}
