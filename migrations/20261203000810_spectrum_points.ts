import type { Knex } from 'knex';

/**
 * Points leave the metadata row: `spectrum_points` holds the original (file units) and normalised
 * (nm, ascending) x/y series as Float64 little-endian chunks of at most 65,536 values (512 KiB), so a
 * 2-million-point spectrum is 32 rows per series and no statement nears max_allowed_packet.
 * series: 0 x_original, 1 y_original, 2 x_nm, 3 y_normalised. Data are moved; `down` moves them back.
 */
const CHUNK_VALUES = 65536;
const SERIES = ['x_original', 'y_original', 'x_nm', 'y_normalised'] as const;
const BATCH = 200;

export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('spectrum_points', (t) => {
		t.integer('spectrum_id').unsigned().notNullable().references('id').inTable('spectra').onDelete('CASCADE');
		t.tinyint('series').unsigned().notNullable();
		t.integer('chunk_no').unsigned().notNullable();
		t.specificType('data', 'MEDIUMBLOB').notNullable();
		t.primary(['spectrum_id', 'series', 'chunk_no']);
	});
	for (let after = 0; ; ) {
		const rows = await knex('spectra').where('id', '>', after).orderBy('id').limit(BATCH).select('id', ...SERIES);
		if (!rows.length) break;
		for (const r of rows) {
			const out: { spectrum_id: number; series: number; chunk_no: number; data: Buffer }[] = [];
			SERIES.forEach((col, series) => {
				const b: Buffer = r[col];
				const n = Math.max(1, Math.ceil(b.byteLength / (CHUNK_VALUES * 8)));
				for (let c = 0; c < n; c++) out.push({ spectrum_id: r.id, series, chunk_no: c, data: b.subarray(c * CHUNK_VALUES * 8, (c + 1) * CHUNK_VALUES * 8) });
			});
			await knex('spectrum_points').insert(out);
		}
		after = rows[rows.length - 1].id;
	}
	await knex.schema.alterTable('spectra', (t) => {
		for (const c of SERIES) t.dropColumn(c);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('spectra', (t) => {
		for (const c of SERIES) t.specificType(c, 'MEDIUMBLOB').nullable();
	});
	for (let after = 0; ; ) {
		const ids: number[] = (await knex('spectra').where('id', '>', after).orderBy('id').limit(BATCH).select('id')).map((r: { id: number }) => r.id);
		if (!ids.length) break;
		const chunks: { spectrum_id: number; series: number; data: Buffer }[] = await knex('spectrum_points').whereIn('spectrum_id', ids).orderBy(['spectrum_id', 'series', 'chunk_no']).select('spectrum_id', 'series', 'data');
		for (const id of ids) {
			const patch: Record<string, Buffer> = {};
			SERIES.forEach((col, series) => (patch[col] = Buffer.concat(chunks.filter((c) => c.spectrum_id === id && c.series === series).map((c) => c.data))));
			await knex('spectra').where({ id }).update(patch);
		}
		after = ids[ids.length - 1];
	}
	for (const c of SERIES) await knex.raw(`ALTER TABLE spectra MODIFY ${c} MEDIUMBLOB NOT NULL`);
	await knex.schema.dropTable('spectrum_points');
}
