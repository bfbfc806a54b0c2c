import type { Knex } from 'knex';

/**
 * What a lamp calibration measured and how: the kind (actinometry or radiometer), the actinometer and its strength, the
 * vessel the flux entered (wall material, wall thickness, inner path, irradiated volume), the Φ and fraction absorbed
 * used, the operator, and the lamp's power and version at the time. `photon_flux_einstein_per_s` is the flux entering
 * the solution through that wall.
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.alterTable('lamp_calibrations', (t) => {
		t.string('actinometer', 40);
		t.double('concentration_m');
		t.integer('wall_material_id').unsigned().references('id').inTable('wall_materials').onDelete('SET NULL');
		t.double('wall_thickness_mm');
		t.double('vessel_path_cm');
		t.double('irradiated_volume_ml');
		t.double('irradiation_time_s');
		t.double('quantum_yield_used');
		t.double('fraction_absorbed');
		t.double('optical_power_w');
		t.string('operator', 160);
		t.double('lamp_power_w');
		t.integer('lamp_version');
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.index(['lamp_id', 'measured_at']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('lamp_calibrations', (t) => {
		t.dropIndex(['lamp_id', 'measured_at']);
		t.dropForeign(['wall_material_id']);
		for (const c of ['actinometer', 'concentration_m', 'wall_material_id', 'wall_thickness_mm', 'vessel_path_cm', 'irradiated_volume_ml', 'irradiation_time_s', 'quantum_yield_used', 'fraction_absorbed', 'optical_power_w', 'operator', 'lamp_power_w', 'lamp_version', 'created_at']) t.dropColumn(c);
	});
}
