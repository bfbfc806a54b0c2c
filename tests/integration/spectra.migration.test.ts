/**
 * The Library storage migrations (20261203000800–899) forward and back on a database that holds
 * data in the earlier layout: file bytes, points and vectors in the `spectra` row. A scratch
 * database `<DB_NAME>_mig` is migrated up to just before these migrations, filled (two spectra of
 * one two-block file, one spectrum with a 1.5 MiB file and 70,000 points), migrated forward —
 * every byte must be found in the new tables — and rolled back: the rows must be byte for byte as before.
 * The data are invented bytes (this checks storage, not science).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import knexFactory, { type Knex } from 'knex';
import { createHash } from 'node:crypto';
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { knexConfig } from '../../knexfile';

/** The project's migrations loaded through the test runner (it compiles TypeScript; knex's own loader would not). */
const DIR = path.resolve(process.cwd(), 'migrations');
const migrationSource = {
	getMigrations: async () => readdirSync(DIR).filter((f) => /^\d+_.*\.ts$/.test(f)).sort(),
	getMigrationName: (f: string) => f,
	getMigration: async (f: string) => import(/* @vite-ignore */ path.join(DIR, f))
};

const SCRATCH = `${process.env.DB_NAME ?? 'windowsill_test'}_mig`.slice(0, 64);
const MINE = /^20261203000[89]\d\d_/;
let admin: Knex;
let k: Knex;

const f64 = (n: number, f: (i: number) => number) => Buffer.from(Float64Array.from({ length: n }, (_, i) => f(i)).buffer);
const f32 = (n: number, f: (i: number) => number) => Buffer.from(Float32Array.from({ length: n }, (_, i) => f(i)).buffer);
const sha = (b: Buffer) => createHash('sha256').update(b).digest('hex');

async function pendingNames(): Promise<string[]> {
	const [, pending] = await k.migrate.list();
	return (pending as (string | { file?: string; name?: string })[]).map((p) => (typeof p === 'string' ? p : (p.file ?? p.name ?? '')));
}
async function completedNames(): Promise<string[]> {
	const [done] = await k.migrate.list();
	return (done as { name: string }[]).map((d) => d.name);
}

/** Content of the old layout, row by row. */
async function snapshot() {
	const rows = await k('spectra').orderBy('id').select('id', 'name', 'file_bytes', 'x_original', 'y_original', 'x_nm', 'y_normalised', 'search_vector', 'version', 'updated_at', 'file_sha256', 'block_index');
	return rows.map((r: Record<string, unknown>) => Object.fromEntries(Object.entries(r).map(([c, v]) => [c, Buffer.isBuffer(v) ? sha(v) : v instanceof Date ? v.toISOString() : v])));
}

const big = { file: Buffer.alloc(1_500_000, 0x41), n: 70_000 };
const oldRows: Record<string, unknown>[] = [];

beforeAll(async () => {
	const conn = knexConfig(process.env);
	admin = knexFactory({ ...conn, connection: { ...(conn.connection as object), database: undefined } });
	await admin.raw(`DROP DATABASE IF EXISTS \`${SCRATCH}\``);
	await admin.raw(`CREATE DATABASE \`${SCRATCH}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
	const cfg = knexConfig({ ...process.env, DB_NAME: SCRATCH });
	k = knexFactory({ ...cfg, pool: { min: 0, max: 2 }, migrations: { tableName: 'knex_migrations', migrationSource } });
	while ((await pendingNames()).length && !MINE.test((await pendingNames())[0])) await k.migrate.up();
	await k('users').insert({ id: 'mig-user', email: 'mig@windowsill.test', name: 'Mig user', password_hash: 'x' });
	const [groupId] = await k('groups').insert({ name: 'Mig group', slug: 'mig-group' });
	const twoBlock = Buffer.from('##TITLE=two blocks (invented)\n'.repeat(50));
	const base = { group_id: groupId, owner_id: 'mig-user', part: 'substrate', kind: 'absorption', x_unit_original: 'nm', y_unit_original: 'absorbance', y_unit: 'absorbance', file_name: 'a.jdx' };
	const mk = (name: string, n: number, file: Buffer, block: number, s: number) => ({
		...base,
		name,
		x_original: f64(n, (i) => 300 + i * 0.01),
		y_original: f64(n, (i) => Math.sin(i * s) + 1),
		x_nm: f64(n, (i) => 300 + i * 0.01),
		y_normalised: f64(n, (i) => Math.sin(i * s) + 1.5),
		point_count: n,
		file_bytes: file,
		file_sha256: sha(file),
		block_index: block,
		search_vector: f32(911, (i) => Math.cos(i * s))
	});
	oldRows.push(mk('Mig one', 500, twoBlock, 0, 0.1), mk('Mig two', 400, twoBlock, 1, 0.2), mk('Mig long', big.n, big.file, 0, 0.001));
	for (const r of oldRows) await k('spectra').insert(r);
	const [tagId] = await k('tags').insert({ name: 'mig-tag' });
	const ids = (await k('spectra').orderBy('id').select('id')).map((r: { id: number }) => r.id);
	await k('spectrum_tags').insert(ids.map((spectrum_id: number) => ({ spectrum_id, tag_id: tagId })));
	await k('spectrum_revisions').insert(ids.map((spectrum_id: number) => ({ spectrum_id, version: 1, action: 'create', user_id: 'mig-user' })));
}, 300_000);

afterAll(async () => {
	await k?.destroy();
	await admin?.raw(`DROP DATABASE IF EXISTS \`${SCRATCH}\``);
	await admin?.destroy();
});

describe('Library storage migrations', () => {
	it('forward moves every byte into the side tables; back restores the rows byte for byte', async () => {
		const before = await snapshot();
		expect(before).toHaveLength(3);
		const mine = (await pendingNames()).filter((n) => MINE.test(n));
		expect(mine.length).toBeGreaterThanOrEqual(5);
		while ((await pendingNames()).length && MINE.test((await pendingNames())[0])) await k.migrate.up();

		// forward: narrow rows, one file per (group, sha), chunks and vectors with the same bytes
		const cols = (await k.raw('SHOW COLUMNS FROM spectra'))[0].map((c: { Field: string }) => c.Field);
		for (const gone of ['file_bytes', 'x_original', 'y_original', 'x_nm', 'y_normalised', 'search_vector']) expect(cols).not.toContain(gone);
		expect(Number((await k('spectrum_files').count({ n: '*' }))[0].n)).toBe(2);
		const spectra = await k('spectra').orderBy('id').select('id', 'file_id', 'change_seq');
		expect(spectra[0].file_id).toBe(spectra[1].file_id);
		for (const [i, s] of spectra.entries()) {
			const file = Buffer.concat((await k('spectrum_file_chunks').where({ file_id: s.file_id }).orderBy('chunk_no').select('data')).map((c: { data: Buffer }) => c.data));
			expect(sha(file)).toBe(sha(oldRows[i].file_bytes as Buffer));
			for (const [series, col] of ['x_original', 'y_original', 'x_nm', 'y_normalised'].entries()) {
				const parts = await k('spectrum_points').where({ spectrum_id: s.id, series }).orderBy('chunk_no').select('data');
				expect(sha(Buffer.concat(parts.map((c: { data: Buffer }) => c.data)))).toBe(sha(oldRows[i][col] as Buffer));
				if (i === 2) expect(parts.length).toBe(2); // 70,000 values in chunks of 65,536
			}
			const v = await k('spectrum_vectors').where({ spectrum_id: s.id }).first('vector');
			expect(sha(v.vector)).toBe(sha(oldRows[i].search_vector as Buffer));
			expect(Number(s.change_seq)).toBeGreaterThan(0);
		}
		expect(Number((await k('spectrum_file_chunks').where({ file_id: spectra[2].file_id }).count({ n: '*' }))[0].n)).toBe(2); // 1.5 MB in 1 MiB chunks
		expect(Number((await k('spectrum_tags').count({ n: '*' }))[0].n)).toBe(3);

		// back: the old layout with the same bytes
		while (MINE.test((await completedNames()).at(-1) ?? '')) await k.migrate.down();
		expect(await snapshot()).toEqual(before);
		expect(Number((await k('spectrum_tags').count({ n: '*' }))[0].n)).toBe(3);
		expect(Number((await k('spectrum_revisions').count({ n: '*' }))[0].n)).toBe(3);
		const tables = (await k.raw('SHOW TABLES'))[0].map((r: Record<string, string>) => Object.values(r)[0]);
		for (const t of ['spectrum_files', 'spectrum_file_chunks', 'spectrum_points', 'spectrum_vectors', 'library_state']) expect(tables).not.toContain(t);

		// and forward again (a rollback is not a dead end)
		while ((await pendingNames()).length && MINE.test((await pendingNames())[0])) await k.migrate.up();
		expect(Number((await k('spectrum_points').count({ n: '*' }))[0].n)).toBe(4 + 4 + 8);
	}, 300_000);

	it('implied originals (only the normalised pair stored) are written out when that migration is rolled back', async () => {
		await k.migrate.latest();
		const spectra = await k('spectra').orderBy('id').select('id');
		// as the app now stores a file whose series are the normalised ones: series 2 and 3 only
		await k('spectrum_points').where({ spectrum_id: spectra[0].id }).whereIn('series', [0, 1]).delete();
		const normalised = await k('spectrum_points').where({ spectrum_id: spectra[0].id }).whereIn('series', [2, 3]).orderBy(['series', 'chunk_no']).select('series', 'data');
		expect((await completedNames()).at(-1)).toMatch(/_implied_original_points\.ts$/);
		await k.migrate.down();
		const after = await k('spectrum_points').where({ spectrum_id: spectra[0].id }).orderBy(['series', 'chunk_no']).select('series', 'data');
		expect(after.map((r: { series: number }) => r.series)).toEqual([0, 1, 2, 3]);
		expect(sha(after[0].data)).toBe(sha(normalised[0].data));
		expect(sha(after[1].data)).toBe(sha(normalised[1].data));
		// the other spectra kept their own four series, untouched
		expect(Number((await k('spectrum_points').count({ n: '*' }))[0].n)).toBe(4 + 4 + 8);
		await k.migrate.latest();
	}, 300_000);
});
