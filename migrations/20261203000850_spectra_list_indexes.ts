import type { Knex } from 'knex';

/** Indexes for the Library's list orders (updated, created, name, λmax) and filters (kind, CAS, visibility). */
const INDEXES: [string, string[]][] = [
	['spectra_deleted_updated_index', ['deleted_at', 'updated_at']],
	['spectra_deleted_created_index', ['deleted_at', 'created_at']],
	['spectra_deleted_name_index', ['deleted_at', 'name']],
	['spectra_deleted_lambda_index', ['deleted_at', 'lambda_max_nm']],
	['spectra_kind_index', ['kind']],
	['spectra_cas_index', ['cas']],
	['spectra_visibility_index', ['visibility']]
];

export async function up(knex: Knex): Promise<void> {
	await knex.schema.alterTable('spectra', (t) => {
		for (const [name, cols] of INDEXES) t.index(cols, name);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('spectra', (t) => {
		for (const [name, cols] of INDEXES) t.dropIndex(cols, name);
	});
}
