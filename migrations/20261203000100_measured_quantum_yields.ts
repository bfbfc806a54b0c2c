import type { Knex } from 'knex';

/** Quantum yields measured from an irradiation series, stored on the reactant's spectrum. */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('measured_quantum_yields', (t) => {
		t.increments('id').primary();
		t.integer('spectrum_id').unsigned().notNullable().references('id').inTable('spectra').onDelete('CASCADE');
		t.integer('group_id').unsigned().notNullable().references('id').inTable('groups').onDelete('CASCADE');
		t.integer('lamp_id').unsigned().references('id').inTable('lamps').onDelete('SET NULL');
		t.string('lamp_name', 200);
		t.string('method', 60).notNullable();
		t.string('reaction_type', 20).notNullable();
		t.double('quantum_yield').notNullable();
		t.double('standard_error').notNullable();
		t.double('quantum_yield_back');
		t.double('standard_error_back');
		t.double('initial_rate_quantum_yield');
		t.double('from_nm');
		t.double('to_nm');
		t.string('photon_flux_basis', 40);
		t.json('inputs');
		t.string('created_by', 40).references('id').inTable('users').onDelete('SET NULL');
		t.timestamp('measured_at').notNullable().defaultTo(knex.fn.now());
		t.index(['spectrum_id']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('measured_quantum_yields');
}
