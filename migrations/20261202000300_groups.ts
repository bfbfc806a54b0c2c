import type { Knex } from 'knex';

/** Research groups and their members; roles per group: lead, member, viewer. */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('groups', (t) => {
		t.increments('id').primary();
		t.string('name', 120).notNullable().unique();
		t.string('slug', 120).notNullable().unique();
		t.text('description');
		t.string('created_by', 40).references('id').inTable('users').onDelete('SET NULL');
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
	});
	await knex.schema.createTable('memberships', (t) => {
		t.integer('group_id').unsigned().notNullable().references('id').inTable('groups').onDelete('CASCADE');
		t.string('user_id', 40).notNullable().references('id').inTable('users').onDelete('CASCADE');
		t.enu('role', ['lead', 'member', 'viewer']).notNullable();
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.primary(['group_id', 'user_id']);
		t.index(['user_id']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('memberships');
	await knex.schema.dropTable('groups');
}
