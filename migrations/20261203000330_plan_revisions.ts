import type { Knex } from 'knex';

/**
 * Frozen snapshots of a plan: the inputs, decision and numbers as approved, and each saved recomputation.
 * The plan row holds the working copy; an approved revision stays readable after a recomputation replaces it.
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('plan_revisions', (t) => {
		t.increments('id').primary();
		t.integer('plan_id').unsigned().notNullable().references('id').inTable('plans').onDelete('CASCADE');
		t.integer('revision').notNullable();
		t.enu('reason', ['approved', 'recomputed']).notNullable();
		t.string('state', 20).notNullable();
		t.json('inputs').notNullable();
		t.json('decision').nullable();
		t.json('results').notNullable();
		t.json('changes').nullable();
		t.string('created_by', 40).nullable().references('id').inTable('users').onDelete('SET NULL');
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.unique(['plan_id', 'revision']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('plan_revisions');
}
