import type { Knex } from 'knex';

/**
 * A lamp's stated exposure distance (cm from the emitting surface to where a person works) and, optionally, a
 * radiometer reading there (W m⁻²): the cautions then give the irradiance at that distance and the ICNIRP limit
 * times (src/lib/irradiation/exposure.ts). Both null for existing lamps (no distance stated).
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.alterTable('lamps', (t) => {
		t.double('exposure_distance_cm').nullable();
		t.double('exposure_irradiance_w_m2').nullable();
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('lamps', (t) => {
		t.dropColumn('exposure_distance_cm');
		t.dropColumn('exposure_irradiance_w_m2');
	});
}
