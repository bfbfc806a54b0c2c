import type { Knex } from 'knex';

/** Calibrations of a lamp's photon flux (actinometry runs, radiometer readings). */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('lamp_calibrations', (t) => {
		t.increments('id').primary();
		t.integer('lamp_id').unsigned().notNullable().references('id').inTable('lamps').onDelete('CASCADE');
		t.string('method', 60).notNullable();
		t.double('photon_flux_einstein_per_s').notNullable();
		t.double('wavelength_nm');
		t.json('inputs');
		t.text('notes');
		t.string('created_by', 40).references('id').inTable('users').onDelete('SET NULL');
		t.timestamp('measured_at').notNullable().defaultTo(knex.fn.now());
		t.index(['lamp_id']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('lamp_calibrations');
}
