import type { Knex } from 'knex';

/**
 * A plan records what was decided (chosen lamp, wall, solvent, path, time, safety measures) beside its inputs;
 * the chosen lamp and the intended absorber are columns too, so the plans page filters and the lamp × absorber
 * matrix find a pair's plans with an index.
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.alterTable('plans', (t) => {
		t.json('decision').nullable();
		t.integer('lamp_id').unsigned().nullable().references('id').inTable('lamps').onDelete('SET NULL');
		t.integer('absorber_spectrum_id').unsigned().nullable();
		t.timestamp('submitted_at').nullable();
		t.timestamp('reviewed_at').nullable();
		t.index(['group_id', 'lamp_id', 'absorber_spectrum_id']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('plans', (t) => {
		t.dropIndex(['group_id', 'lamp_id', 'absorber_spectrum_id']);
		t.dropForeign(['lamp_id']);
		t.dropColumn('decision');
		t.dropColumn('lamp_id');
		t.dropColumn('absorber_spectrum_id');
		t.dropColumn('submitted_at');
		t.dropColumn('reviewed_at');
	});
}
