import type { Knex } from 'knex';

/** Revision history of a spectrum's metadata: one row per create / edit / delete / restore, with the values before and after. */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('spectrum_revisions', (t) => {
		t.bigIncrements('id').primary();
		t.integer('spectrum_id').unsigned().notNullable().references('id').inTable('spectra').onDelete('CASCADE');
		t.integer('version').unsigned().notNullable();
		t.enu('action', ['create', 'edit', 'delete', 'restore']).notNullable();
		t.string('user_id', 40).nullable().references('id').inTable('users').onDelete('SET NULL');
		t.text('changes').nullable(); // JSON { field: { from, to } }
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.index(['spectrum_id', 'version']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('spectrum_revisions');
}
