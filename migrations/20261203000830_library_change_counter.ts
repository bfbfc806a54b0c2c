import type { Knex } from 'knex';

/**
 * A Library-wide change counter: every write to a spectrum takes the next value of
 * `library_state.change_seq` (in its own transaction) and stamps it on the row's `change_seq`.
 * App servers keep per-process caches of the vectors and reload exactly the rows stamped after
 * the value they last saw, so several stateless servers on one database stay right.
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('library_state', (t) => {
		t.tinyint('id').unsigned().primary();
		t.bigInteger('change_seq').unsigned().notNullable().defaultTo(0);
	});
	await knex.schema.alterTable('spectra', (t) => {
		t.bigInteger('change_seq').unsigned().notNullable().defaultTo(0);
		t.index(['change_seq'], 'spectra_change_seq_index');
	});
	await knex('spectra').update({ change_seq: 1 });
	await knex('library_state').insert({ id: 1, change_seq: 1 });
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('spectra', (t) => {
		t.dropIndex(['change_seq'], 'spectra_change_seq_index');
		t.dropColumn('change_seq');
	});
	await knex.schema.dropTable('library_state');
}
