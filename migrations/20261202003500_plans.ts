import type { Knex } from 'knex';

/** Irradiation plans: Window-finder inputs and computed results; states draft → submitted → approved / returned. */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('plans', (t) => {
		t.increments('id').primary();
		t.integer('group_id').unsigned().notNullable().references('id').inTable('groups').onDelete('CASCADE');
		t.string('owner_id', 40).references('id').inTable('users').onDelete('SET NULL');
		t.string('title', 200).notNullable();
		t.enu('state', ['draft', 'submitted', 'approved', 'returned']).notNullable().defaultTo('draft');
		t.json('inputs').notNullable();
		t.json('results').notNullable();
		t.string('reviewer_id', 40).references('id').inTable('users').onDelete('SET NULL');
		t.text('review_comment');
		t.integer('version').notNullable().defaultTo(1);
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
		t.index(['group_id', 'state']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('plans');
}
