import type { Knex } from 'knex';

/**
 * The original file of an upload is stored once, in its own tables, and referenced by every
 * spectrum read from it (`spectra.file_id`). The bytes are kept in chunks of at most 1 MiB so that
 * no statement comes near max_allowed_packet. Existing rows: one file per (group, sha256); the
 * bytes are moved, then `spectra.file_bytes` is dropped. `down` copies the bytes back.
 */
const CHUNK_BYTES = 1 << 20;

export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('spectrum_files', (t) => {
		t.increments('id').primary();
		t.integer('group_id').unsigned().notNullable().references('id').inTable('groups').onDelete('CASCADE');
		t.specificType('sha256', 'CHAR(64)').notNullable();
		t.string('file_name', 255).notNullable();
		t.bigInteger('byte_count').unsigned().notNullable();
		t.integer('chunk_count').unsigned().notNullable();
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.index(['group_id', 'sha256']);
	});
	await knex.schema.createTable('spectrum_file_chunks', (t) => {
		t.integer('file_id').unsigned().notNullable().references('id').inTable('spectrum_files').onDelete('CASCADE');
		t.integer('chunk_no').unsigned().notNullable();
		t.specificType('data', 'MEDIUMBLOB').notNullable();
		t.primary(['file_id', 'chunk_no']);
	});
	await knex.schema.alterTable('spectra', (t) => {
		t.integer('file_id').unsigned().nullable().references('id').inTable('spectrum_files').onDelete('SET NULL');
	});
	// Move the bytes: one file per (group, sha256), taken from the lowest id that holds it.
	const groups: { group_id: number; file_sha256: string; first_id: number }[] = await knex('spectra')
		.select('group_id', 'file_sha256')
		.min({ first_id: 'id' })
		.groupBy('group_id', 'file_sha256');
	for (const g of groups) {
		const row = await knex('spectra').where({ id: g.first_id }).first('file_bytes', 'file_name', 'created_at');
		const bytes: Buffer = row.file_bytes;
		const chunks = Math.max(1, Math.ceil(bytes.byteLength / CHUNK_BYTES));
		const [fileId] = await knex('spectrum_files').insert({ group_id: g.group_id, sha256: g.file_sha256, file_name: row.file_name, byte_count: bytes.byteLength, chunk_count: chunks, created_at: row.created_at });
		for (let c = 0; c < chunks; c++) await knex('spectrum_file_chunks').insert({ file_id: fileId, chunk_no: c, data: bytes.subarray(c * CHUNK_BYTES, (c + 1) * CHUNK_BYTES) });
		await knex('spectra').where({ group_id: g.group_id, file_sha256: g.file_sha256 }).update({ file_id: fileId });
	}
	await knex.schema.alterTable('spectra', (t) => {
		t.dropColumn('file_bytes');
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('spectra', (t) => {
		t.specificType('file_bytes', 'LONGBLOB').nullable();
	});
	const files: { id: number }[] = await knex('spectrum_files').select('id');
	for (const f of files) {
		const chunks: { data: Buffer }[] = await knex('spectrum_file_chunks').where({ file_id: f.id }).orderBy('chunk_no').select('data');
		await knex('spectra').where({ file_id: f.id }).update({ file_bytes: Buffer.concat(chunks.map((c) => c.data)) });
	}
	await knex('spectra').whereNull('file_bytes').update({ file_bytes: Buffer.alloc(0) });
	await knex.raw('ALTER TABLE spectra MODIFY file_bytes LONGBLOB NOT NULL');
	await knex.schema.alterTable('spectra', (t) => {
		t.dropForeign(['file_id']);
		t.dropColumn('file_id');
	});
	await knex.schema.dropTable('spectrum_file_chunks');
	await knex.schema.dropTable('spectrum_files');
}
