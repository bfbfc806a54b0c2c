import type { Knex } from 'knex';

/** How many days a lamp calibration stays current in a group before the lamp page warns (set by a lead; null = 180). */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.alterTable('groups', (t) => {
		t.integer('calibration_interval_days').unsigned();
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('groups', (t) => {
		t.dropColumn('calibration_interval_days');
	});
}
