import type { Knex } from 'knex';

/** The review thread of a plan: comments by its author and reviewers, including the comment of a return or approval. */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('plan_comments', (t) => {
		t.increments('id').primary();
		t.integer('plan_id').unsigned().notNullable().references('id').inTable('plans').onDelete('CASCADE');
		t.string('author_id', 40).nullable().references('id').inTable('users').onDelete('SET NULL');
		t.enu('kind', ['comment', 'submitted', 'approved', 'returned']).notNullable().defaultTo('comment');
		t.text('body').notNullable();
		t.integer('plan_version').notNullable();
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.index(['plan_id', 'id']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('plan_comments');
}
