import type { Knex } from 'knex';

/**
 * The Library: one row per stored spectrum (one block of a LINK file or one y column of a CSV).
 * Keeps the original points and file bytes (+ sha256), the normalised points (nm, ascending), the
 * 1 nm search vector (190–1100 nm, Float32 little-endian) and the derived values. Points and
 * vectors are Float64/Float32 BLOBs; every measurement column is DOUBLE.
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('spectra', (t) => {
		t.increments('id').primary();
		t.integer('group_id').unsigned().notNullable().references('id').inTable('groups').onDelete('CASCADE');
		t.string('owner_id', 40).nullable().references('id').inTable('users').onDelete('SET NULL');
		t.string('name', 200).notNullable();
		t.text('synonyms').nullable(); // JSON array of strings
		t.string('cas', 16).nullable();
		t.enu('part', ['substrate', 'photocatalyst', 'product', 'additive', 'solvent', 'wall', 'filter', 'lamp']).notNullable();
		t.enu('kind', ['absorption', 'transmission', 'emission']).notNullable();
		t.string('solvent', 120).nullable();
		t.double('concentration_m').nullable();
		t.double('path_cm').nullable();
		t.double('thickness_mm').nullable();
		t.double('temperature_c').nullable();
		t.string('instrument', 200).nullable();
		t.text('notes').nullable();
		t.enu('visibility', ['private', 'group', 'public']).notNullable().defaultTo('group');
		// original points as read from the file (file units), Float64 little-endian
		t.specificType('x_original', 'MEDIUMBLOB').notNullable();
		t.specificType('y_original', 'MEDIUMBLOB').notNullable();
		t.string('x_unit_original', 40).notNullable();
		t.string('y_unit_original', 40).notNullable();
		// normalised points: nm ascending, y in `y_unit`, Float64 little-endian
		t.specificType('x_nm', 'MEDIUMBLOB').notNullable();
		t.specificType('y_normalised', 'MEDIUMBLOB').notNullable();
		t.string('y_unit', 20).notNullable();
		t.integer('point_count').unsigned().notNullable();
		t.specificType('file_bytes', 'LONGBLOB').notNullable();
		t.string('file_name', 255).notNullable();
		t.specificType('file_sha256', 'CHAR(64)').notNullable();
		t.integer('block_index').unsigned().notNullable().defaultTo(0);
		t.string('block_label', 200).nullable();
		t.specificType('search_vector', 'BLOB').notNullable();
		t.double('lambda_max_nm').nullable();
		t.double('value_at_max').nullable();
		t.double('edge_nm').nullable();
		t.double('cutoff10_nm').nullable();
		t.double('cutoff50_nm').nullable();
		t.text('peaks').nullable(); // JSON [{wavelengthNm, value}]
		t.double('triplet_energy_kj_per_mol').nullable();
		t.text('excited_state_potentials').nullable(); // JSON [{label, volts, reference}]
		t.text('warnings').nullable(); // JSON [ParseIssue]
		t.integer('version').unsigned().notNullable().defaultTo(1);
		t.timestamp('deleted_at').nullable();
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
		t.unique(['group_id', 'file_sha256', 'block_index'], { indexName: 'spectra_group_sha_block_unique' });
		t.index(['group_id', 'deleted_at']);
		t.index(['owner_id']);
		t.index(['part']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('spectra');
}
