import type { Knex } from 'knex';

/**
 * Time of a spectrum within a time series, in seconds (a delimited table with one spectrum per row, e.g. a
 * kinetics run: the row's first field in the unit its header names). NULL for spectra that are not part of a
 * series. `block_label` keeps the row's label as written; `block_index` keeps the file order.
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.alterTable('spectra', (t) => {
		t.double('block_time_s').nullable();
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('spectra', (t) => {
		t.dropColumn('block_time_s');
	});
}
