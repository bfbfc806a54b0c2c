import type { Knex } from 'knex';

/** Reflectance spectra are their own kind (stored as reflectance 0–1, never used as absorbance). */
export async function up(knex: Knex): Promise<void> {
	await knex.raw("ALTER TABLE spectra MODIFY kind ENUM('absorption','transmission','emission','reflectance') NOT NULL");
}

export async function down(knex: Knex): Promise<void> {
	await knex.raw("DELETE FROM spectra WHERE kind = 'reflectance'");
	await knex.raw("ALTER TABLE spectra MODIFY kind ENUM('absorption','transmission','emission') NOT NULL");
}
