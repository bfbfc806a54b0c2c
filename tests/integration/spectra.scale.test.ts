/**
 * The Library at scale, in the small: side tables and chunking, storage caps, the change counter
 * that keeps per-process indexes right, the one-pass top-k similarity (same answers as the spectra
 * core's rankSimilar within 1e-6), the vector filters from precomputed facts, paging errors.
 * Spectra are invented test data (Gaussian bands); the reference for similarity is the core's
 * cosineSimilarity/rankSimilar, the reference for A = ε·c·l is Beer–Lambert (IUPAC Gold Book, "absorbance").
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '../../src/lib/server/db/index';
import { findSpectrumById, listSpectrumSummaries, withFileBytes } from '../../src/lib/server/db/spectra';
import { callerOf } from '../../src/lib/server/services/spectraAccess';
import { bufferToFloat64, POINT_CHUNK_VALUES, FILE_CHUNK_BYTES, statementBudget } from '../../src/lib/server/db/spectraBlobs';
import { spectrumListQuerySchema } from '../../src/lib/schemas/spectra';
import { zodToApiError } from '../../src/lib/server/http';
import { searchSpectra } from '../../src/lib/server/services/spectraSearch';
import { similarSpectra } from '../../src/lib/server/services/spectraSimilar';
import { resetVectorCache, VectorCache } from '../../src/lib/server/services/spectraVectorCache';
import { absorbsAt, absorbsAtValue, transparentAbove, transparentAboveFromFacts, vectorAt, vectorFacts } from '../../src/lib/server/services/spectraVectorFilters';
import { stopSimilarityWorker, topKInProcess, topKInWorker } from '../../src/lib/server/services/similarityKernel';
import { cosineSimilarity, rankSimilar } from '../../src/lib/spectra/similarity';
import { bufferToVector, SEARCH_LENGTH, vectorToBuffer } from '../../src/lib/spectra/grid';
import { spectrumTermTexts, trigramsOf } from '../../src/lib/spectra/trigrams';
import type { VectorCacheRow } from '../../src/lib/server/db/spectra';
import { apiFailure, csvOf, gauss, localsOf, resetSpectraWorld, rowCounts, upload } from './spectraTestKit';
import { prng } from '../../src/lib/prng';

const ids: Record<string, number> = {};
const resetGroupIds = async () => ({ groupA: Number((await db()('groups').where({ slug: 'spx-a' }).first('id')).id) });
beforeAll(async () => {
	await resetSpectraWorld();
	const add = async (key: string, name: string, f: (x: number) => number, meta: Record<string, unknown> = {}) =>
		(ids[key] = (await upload('member', `scale-${key}.csv`, csvOf('wavelength (nm),epsilon (M-1 cm-1)', f), { name, ...meta })).items[0].id);
	await add('a', 'Lanternfish violet dye', (x) => gauss(x, 420, 20, 15000), { part: 'photocatalyst', synonyms: ['LV-3'] });
	await add('b', 'Quayside amber dye', (x) => gauss(x, 470, 25, 11000), { part: 'photocatalyst' });
	await add('c', 'Saltmarsh enone', (x) => gauss(x, 330, 15, 9000), { part: 'substrate', cas: '50-00-0' });
	await add('d', 'Shingle ester', (x) => gauss(x, 280, 12, 5000) + gauss(x, 430, 30, 800), { part: 'substrate' });
	await add('e', 'Dune blue catalyst', (x) => gauss(x, 425, 22, 14000) + gauss(x, 300, 15, 20000), { part: 'photocatalyst', tags: ['seaside'] });
});
afterAll(async () => {
	await stopSimilarityWorker();
	await closeDb();
});

const member2 = (params: Record<string, string>) => searchSpectra(localsOf('member2'), spectrumListQuerySchema.parse({ group: 'spx-a', limit: '100', ...params }));

/** Deterministic pseudo-random numbers (mulberry32, src/lib/prng.ts). */
const rng = prng;

/** A Library index row for a bare vector (invented test data). */
const cacheRow = (id: number, v: Float32Array): VectorCacheRow => ({
	id, group_id: 1, owner_id: null, name: `vector ${id}`, synonyms: '[]', cas: null, part: 'substrate', kind: 'absorption', solvent: null, visibility: 'group',
	y_unit: 'absorbance', concentration_m: null, path_cm: null, lambda_max_nm: null, deleted_at: null, created_at: new Date(0), updated_at: new Date(0), change_seq: 1,
	vector: Buffer.from(vectorToBuffer(v))
});

/** An index holding the vectors as slots 0…n−1 (ids 100,000 + slot), packed as the app packs them. */
function packedIndex(vs: Float32Array[]): VectorCache {
	const c = new VectorCache();
	vs.forEach((v, s) => c.put(cacheRow(100_000 + s, v)));
	return c;
}

function randomVectors(n: number, seed: number): Float32Array[] {
	const r = rng(seed);
	return Array.from({ length: n }, (_, k) => {
		const v = new Float32Array(SEARCH_LENGTH);
		const c = 200 + r() * 600;
		const w = 5 + r() * 60;
		const h = k % 7 === 0 ? 0 : 0.01 + r() * 3e4; // every 7th all zeros (outside the grid)
		for (let i = 0; i < v.length; i++) v[i] = h * Math.exp(-0.5 * ((190 + i - c) / w) ** 2) + (r() < 0.3 ? 0 : r() * h * 0.01);
		return v;
	});
}

describe('storage: side tables, chunks, one file per upload', () => {
	it('a 70,000-point CSV of 3 columns (> 1 MiB): one file row in chunks, points in 64 k chunks, exact round trip', async () => {
		const lines = ['wavelength (nm),A one,A two,A three'];
		for (let i = 0; i < 70_000; i++) {
			const x = 250 + i * 0.005;
			lines.push(`${x.toFixed(3)},${gauss(x, 400, 30, 1).toPrecision(9)},${gauss(x, 450, 20, 0.8).toPrecision(9)},${gauss(x, 500, 25, 0.6).toPrecision(9)}`);
		}
		const text = lines.join('\n') + '\n';
		const bytes = new TextEncoder().encode(text);
		expect(bytes.byteLength).toBeGreaterThan(FILE_CHUNK_BYTES);
		const r = await upload('member', 'scale-long.csv', bytes, { part: 'substrate' });
		expect(r.items).toHaveLength(3);
		const k = db();
		const rows = await k('spectra').whereIn('id', r.items.map((i) => i.id)).select('file_id');
		expect(new Set(rows.map((x: { file_id: number }) => x.file_id)).size).toBe(1); // stored once, referenced by all three
		const fileId = rows[0].file_id;
		const [{ n: chunks }] = await k('spectrum_file_chunks').where({ file_id: fileId }).count({ n: '*' });
		expect(Number(chunks)).toBe(Math.ceil(bytes.byteLength / FILE_CHUNK_BYTES));
		const row = (await findSpectrumById(r.items[1].id))!;
		expect(Buffer.compare((await withFileBytes(row)).file_bytes, Buffer.from(bytes))).toBe(0);
		// the file is in nm, ascending, absorbance: its own series are the normalised ones, stored once (series 2, 3)
		const [{ n: pointRows }] = await k('spectrum_points').where({ spectrum_id: row.id, series: 3 }).count({ n: '*' });
		expect(Number(pointRows)).toBe(Math.ceil(70_000 / POINT_CHUNK_VALUES));
		expect(Number((await k('spectrum_points').where({ spectrum_id: row.id }).whereIn('series', [0, 1]).count({ n: '*' }))[0].n)).toBe(0);
		const y = bufferToFloat64(row.y_original);
		expect(y.length).toBe(70_000);
		// the second column as written in the file, exactly (toPrecision(9) text → the same double)
		for (const i of [0, 12_345, 65_535, 65_536, 69_999]) expect(y[i]).toBe(Number(gauss(250 + i * 0.005, 450, 20, 0.8).toPrecision(9)));
	});

	it('every insert statement stays below max_allowed_packet (hex BLOBs counted twice)', async () => {
		const k = db();
		const [[{ p }]] = await k.raw('SELECT @@max_allowed_packet AS p');
		const budget = await statementBudget(k);
		expect(budget).toBeLessThanOrEqual(Number(p) / 4);
		let largest = 0;
		const onQuery = (q: { sql: string; bindings?: unknown[] }) => {
			let n = q.sql.length;
			for (const b of q.bindings ?? []) n += b instanceof Uint8Array ? 2 * b.byteLength + 3 : String(b).length + 2;
			largest = Math.max(largest, n);
		};
		k.on('query', onQuery);
		try {
			const lines = ['wavelength (nm),absorbance'];
			for (let i = 0; i < 140_000; i++) lines.push(`${(200 + i * 0.004).toFixed(3)},${gauss(200 + i * 0.004, 420, 40, 1).toPrecision(7)}`);
			await upload('member', 'scale-140k.csv', lines.join('\n'), { part: 'substrate' });
		} finally {
			k.off('query', onQuery);
		}
		expect(largest).toBeGreaterThan(4 * 140_000); // the points went in as a few multi-row statements…
		expect(largest).toBeLessThan(Number(p)); // …each below the server's packet limit
	}, 180_000);

	it('caps: too many spectra per file → 422, too many bytes per upload → 413, nothing written', async () => {
		const k = db();
		const count = async () => Number((await k('spectra').count({ n: '*' }))[0].n) + Number((await k('spectrum_files').count({ n: '*' }))[0].n);
		const before = await count();
		const lines = ['wavelength (nm),A1,A2,A3,A4'];
		// four invented bands (constant columns are not spectra and would be left out by the reader)
		for (let x = 300; x <= 500; x++) lines.push([x, ...[1, 2, 3, 4].map((j) => (0.1 * j * Math.exp(-(((x - 400) / 30) ** 2)) + 0.01).toFixed(4))].join(','));
		process.env.WINDOWSILL_MAX_SPECTRA_PER_FILE = '3';
		try {
			const e = await apiFailure(upload('member', 'scale-4col.csv', lines.join('\n')));
			expect(e.status).toBe(422);
			expect(e.extra.field).toBe('file');
			expect(e.message).toMatch(/4 spectra/);
		} finally {
			delete process.env.WINDOWSILL_MAX_SPECTRA_PER_FILE;
		}
		process.env.WINDOWSILL_MAX_WRITE_BYTES = '10000';
		try {
			const e = await apiFailure(upload('member', 'scale-4col.csv', lines.join('\n')));
			expect(e.status).toBe(413);
			expect(e.extra.field).toBe('file');
		} finally {
			delete process.env.WINDOWSILL_MAX_WRITE_BYTES;
		}
		expect(await count()).toBe(before);
	});
});

describe('storing an upload: one round trip, or step by step — the same rows', () => {
	const file = (f: (x: number) => number) => csvOf('wavelength (nm),epsilon (M-1 cm-1),absorbance', f).replace(/^(\d+),([^\n]+)$/gm, (_, x, y) => `${x},${y},${(Number(y) / 20000).toPrecision(8)}`);
	const strip = (i: Record<string, unknown>) => {
		const { id: _, createdAt: _c, updatedAt: _u, fileName: _f, fileSha256: _h, ...rest } = i;
		return rest;
	};
	it('a two-column file with tags stores the same spectra, points, vector, revisions and tags either way', async () => {
		const { storeSpectra } = await import('../../src/lib/server/services/spectraStore');
		const { prepareSpectra } = await import('../../src/lib/server/services/spectraPrepare');
		const { groupA } = await resetGroupIds();
		const answers = [];
		for (const oneTrip of [true, false]) {
			// one trailing newline more the second time: the same spectra, another file (hash)
			const bytes = new TextEncoder().encode(file((x) => gauss(x, 380, 20, 12000)) + (oneTrip ? '' : '\n'));
			const name = `scale-store-${oneTrip}.csv`;
			const p = prepareSpectra(bytes, name, { concentrationM: 1e-4, pathCm: 1 });
			const r = await storeSpectra(db(), { groupId: groupA, ownerId: localsOf('member').user!.id, bytes, filename: name, meta: { part: 'substrate', tags: ['harbour-store', 'second tag'], names: ['ε column', 'A column'] }, ...p }, { oneTrip });
			expect(r.items).toHaveLength(2);
			// the answer is what a read gives afterwards, to the last digit and second
			const { findSpectrumSummariesByIds } = await import('../../src/lib/server/db/spectra');
			const { spectrumToApi } = await import('../../src/lib/server/services/spectraView');
			const reread = (await findSpectrumSummariesByIds(r.items.map((i) => i.id))).map((row) => spectrumToApi(row, ['harbour-store', 'second tag']));
			expect(r.items).toEqual(reread);
			const got = [];
			for (const it of r.items) {
				const row = (await findSpectrumById(it.id))!;
				const revs = await db()('spectrum_revisions').where({ spectrum_id: it.id }).select('version', 'action', 'user_id');
				const tags = (await db()('spectrum_tags as st').join('tags as t', 't.id', 'st.tag_id').where('st.spectrum_id', it.id).orderBy('t.name').select('t.name')).map((t: { name: string }) => t.name);
				got.push({ api: strip(it as unknown as Record<string, unknown>), x: row.x_original.toString('hex'), y: row.y_original.toString('hex'), xn: row.x_nm.toString('hex'), yn: row.y_normalised.toString('hex'), v: row.search_vector.toString('hex'), revs, tags, seq: Number((await db()('spectra').where({ id: it.id }).first('change_seq')).change_seq) });
			}
			answers.push(got);
		}
		const [one, steps] = answers;
		for (let i = 0; i < 2; i++) {
			const { seq: s1, ...a } = one[i];
			const { seq: s2, ...b } = steps[i];
			expect(a).toEqual(b);
			expect(s1).toBeGreaterThan(0);
			expect(s2).toBeGreaterThan(s1);
		}
		expect(one[0].tags).toEqual(['harbour-store', 'second tag']);
		expect(one[0].revs).toEqual([{ version: 1, action: 'create', user_id: localsOf('member').user!.id }]);
		// both spectra of one file share one change number (one transaction)
		expect(one[0].seq).toBe(one[1].seq);
	});
	it('a duplicate in the one-trip store is refused by the unique key: 409 naming the spectrum, nothing written', async () => {
		const bytes = file((x) => gauss(x, 455, 18, 9000));
		const first = await upload('member', 'scale-dup.csv', bytes, { concentrationM: 1e-4, pathCm: 1 });
		const before = await rowCounts();
		const files = Number((await db()('spectrum_files').count({ n: '*' }))[0].n);
		const seq = Number((await db()('library_state').where({ id: 1 }).first('change_seq')).change_seq);
		const e = await apiFailure(upload('member', 'scale-dup-again.csv', bytes, { concentrationM: 1e-4, pathCm: 1, tags: ['never-stored'] }));
		expect(e.status).toBe(409);
		expect(e.extra.existingId).toBe(first.items[0].id);
		expect(await rowCounts()).toEqual(before);
		expect(Number((await db()('spectrum_files').count({ n: '*' }))[0].n)).toBe(files);
		expect(await db()('tags').where({ name: 'never-stored' }).first()).toBeUndefined();
		expect(Number((await db()('library_state').where({ id: 1 }).first('change_seq')).change_seq)).toBe(seq);
	});
	it("an edit that renormalises writes the implied originals out first: the file's own numbers never change", async () => {
		const { patchSpectrum } = await import('../../src/lib/server/services/spectraEdit');
		const r = await upload('member', 'scale-implied.csv', csvOf('wavelength (nm),absorbance', (x) => gauss(x, 512, 25, 0.8)), {});
		const id = r.items[0].id;
		const k = db();
		expect((await k('spectrum_points').where({ spectrum_id: id }).orderBy('series').pluck('series'))).toEqual([2, 3]);
		const before = (await findSpectrumById(id))!;
		expect(Buffer.compare(before.x_original, before.x_nm)).toBe(0);
		expect(Buffer.compare(before.y_original, before.y_normalised)).toBe(0);
		const yFile = before.y_original.toString('hex');
		// absorbance → with c and l known the stored curve becomes ε (a renormalising edit)
		await patchSpectrum(localsOf('member'), String(id), { concentrationM: 2e-5, pathCm: 1, version: before.version });
		const after = (await findSpectrumById(id))!;
		expect((await k('spectrum_points').where({ spectrum_id: id }).orderBy('series').pluck('series'))).toEqual([0, 1, 2, 3]);
		expect(after.y_original.toString('hex')).toBe(yFile);
		expect(after.y_unit).not.toBe(before.y_unit);
		expect(Buffer.compare(after.y_normalised, before.y_normalised)).not.toBe(0);
	});
});

describe('the change counter keeps every process index right', () => {
	it('two independent indexes (two app servers) both see an upload and an edit at once', async () => {
		const one = new VectorCache();
		const two = new VectorCache();
		await one.refresh();
		await two.refresh();
		const r = await upload('member', 'scale-new.csv', csvOf('wavelength (nm),absorbance', (x) => gauss(x, 610, 15, 0.9)), { part: 'product', name: 'Tidepool red' });
		const id = r.items[0].id;
		expect(one.slotOf.has(id)).toBe(false);
		await one.refresh();
		await two.refresh();
		for (const c of [one, two]) {
			const s = c.slotOf.get(id)!;
			expect(c.ids[s]).toBe(id);
			expect(c.names[s]).toBe('Tidepool red');
			expect(c.max[s]).toBeCloseTo(0.9, 3);
		}
		// soft delete through the repository: both indexes mark it deleted after their next refresh
		const { setSpectrumDeleted } = await import('../../src/lib/server/services/spectraEdit');
		await setSpectrumDeleted(localsOf('member'), String(id), true);
		await one.refresh();
		await two.refresh();
		expect(one.deleted[one.slotOf.get(id)!]).toBe(1);
		expect(two.deleted[two.slotOf.get(id)!]).toBe(1);
	});
});

describe('search', () => {
	it('misspelt name first, synonym, tag; CAS-shaped queries match CAS exactly and never fuzzily', async () => {
		expect((await member2({ q: 'lanternfsh violett' })).items[0].id).toBe(ids.a);
		expect((await member2({ q: 'lv3' })).items[0].id).toBe(ids.a);
		expect((await member2({ q: 'seaside' })).items.map((i) => i.id)).toContain(ids.e);
		expect((await member2({ q: '50-00-0' })).items.map((i) => i.id)).toEqual([ids.c]);
		// 50-00-1 has a wrong check digit (CAS check-digit rule: formaldehyde is 50-00-0): a 400 naming q, never a fuzzy match.
		await expect(member2({ q: '50-00-1' })).rejects.toMatchObject({ status: 400, extra: { field: 'q' } });
	});
	it('as the picker asks: q + part + limit, ranked, with an exact total', async () => {
		const r = await member2({ q: 'dye', part: 'photocatalyst', limit: '20' });
		expect(r.items.map((i) => i.id).sort()).toEqual([ids.a, ids.b].sort());
		expect(r.total).toBe(2);
	});
	it('absorbs at 425 nm with ε ≥ 10,000: the index path agrees with the vector rule and pages like the full list', async () => {
		const all = await member2({ absorbsAt: '425', minEpsilon: '10000', sort: 'name' });
		expect(all.items.map((i) => i.id)).toEqual([ids.e, ids.a]); // "Dune …" before "Lanternfish …"
		expect(all.total).toBe(2);
		const p2 = await member2({ absorbsAt: '425', minEpsilon: '10000', sort: 'name', limit: '1', offset: '1' });
		expect(p2.items.map((i) => i.id)).toEqual([ids.a]);
		expect(p2.total).toBe(2);
		// ε at 425 nm of the invented band 15000·exp(−(5/20)²/2) (Gaussian, test data)
		expect(p2.items[0].epsilonAt!).toBeCloseTo(15000 * Math.exp(-0.5 * (5 / 20) ** 2), 0);
	});
	it('a plain listing counts the same with the index loaded (memory) as without (COUNT(*) in SQL)', async () => {
		const cases: Record<string, string>[] = [{}, { part: 'photocatalyst' }, { deleted: 'only' }, { deleted: 'include' }, { owner: 'me' }, { solvent: 'nitr' }];
		resetVectorCache();
		const sql: number[] = [];
		for (const c of cases) sql.push((await member2(c)).total);
		await member2({ absorbsAt: '400' }); // loads the index
		for (const [i, c] of cases.entries()) expect((await member2(c)).total).toBe(sql[i]);
	});
	it('paging out of range → 400 naming the field', () => {
		for (const [field, value] of [['limit', '0'], ['limit', '501'], ['limit', 'ten'], ['offset', '-1'], ['offset', '1e300'], ['offset', '2.5']] as const) {
			const r = spectrumListQuerySchema.safeParse({ [field]: value });
			expect(r.success).toBe(false);
			if (r.success) continue;
			const e = zodToApiError(r.error);
			expect(e.status).toBe(400);
			expect(e.extra.field).toBe(field);
		}
	});
});

describe('vector filters from precomputed facts give the same answers as the full rules', () => {
	it('absorbsAt and transparentAbove on 300 random vectors × 12 wavelengths × 4 rules', { timeout: 60_000 }, () => {
		const vs = randomVectors(300, 5);
		let checked = 0;
		for (const [k, v] of vs.entries()) {
			const row = { kind: k % 5 === 0 ? 'transmission' : 'absorption', y_unit: k % 2 ? 'epsilon' : 'absorbance', concentration_m: k % 3 ? 1e-5 : null, path_cm: 1 };
			const facts = vectorFacts(v);
			for (const wl of [190, 250, 300.5, 350, 420, 450.25, 500, 600, 700, 900, 1099.5, 1100]) {
				for (const rule of [{}, { minAbsorbance: 0.1 }, { minEpsilon: 5000 }, { minAbsorbance: 0.05, minEpsilon: 20000 }]) {
					expect(absorbsAtValue(row, vectorAt(v, wl), facts.max, { wavelengthNm: wl, ...rule })).toBe(absorbsAt(row, v, { wavelengthNm: wl, ...rule }));
					checked++;
				}
				expect(transparentAboveFromFacts(row.kind, facts, wl)).toBe(transparentAbove(row, v, wl));
			}
		}
		expect(checked).toBe(300 * 12 * 4);
	});
	it('the packed index keeps each vector exactly: whole vector, value at λ, facts; rewrites in place or at the end', () => {
		const vs = randomVectors(300, 6);
		const c = packedIndex(vs);
		let floats = 0;
		for (const [s, v] of vs.entries()) {
			expect(Array.from(c.vector(s))).toEqual(Array.from(v));
			for (const wl of [189, 190, 250, 300.5, 450.25, 799.75, 1099.5, 1100, 1101]) expect(c.valueAt(s, wl)).toBe(vectorAt(v, wl));
			expect(c.max[s]).toBe(vectorFacts(v).max);
			let first = v.findIndex((x) => x !== 0);
			let last = v.length - 1;
			while (last >= 0 && v[last] === 0) last--;
			if (first < 0) first = last + 1;
			expect(c.vecLen[s]).toBe(last - first + 1);
			floats += last - first + 1;
		}
		// only the measured stretches are held (randomVectors: every 7th vector all zeros)
		expect(c.used).toBe(floats);
		// a shorter vector is rewritten in place, a longer one at the end; both read back exactly
		const short = new Float32Array(SEARCH_LENGTH);
		short.fill(0.5, 300, 310);
		const off = c.vecOff[3];
		c.put(cacheRow(100_003, short));
		expect(c.vecOff[3]).toBe(off);
		expect(Array.from(c.vector(3))).toEqual(Array.from(short));
		const long = new Float32Array(SEARCH_LENGTH).fill(0.25);
		expect(c.vecLen[7]).toBe(0); // every 7th vector is all zeros
		c.put(cacheRow(100_007, long));
		expect(c.vecOff[7]).toBe(floats);
		expect(Array.from(c.vector(7))).toEqual(Array.from(long));
		expect(c.wasted).toBeGreaterThan(0);
	});
});

describe('the n-gram index ranks like the plain count-and-sort it replaces', () => {
	it('2,000 invented names, 6 queries, with filters, tag slots and renamed slots', () => {
		const r = rng(21);
		const words = ['amber', 'violet', 'harbour', 'quay', 'tide', 'lantern', 'shingle', 'dune', 'ester', 'enone', 'dye', 'salt', 'marsh', 'pool'];
		const name = () => Array.from({ length: 2 + Math.floor(r() * 3) }, () => words[Math.floor(r() * words.length)]).join(' ') + ' ' + Math.floor(r() * 1000);
		const c = new VectorCache();
		const names: string[] = [];
		for (let s = 0; s < 2000; s++) {
			names.push(name());
			c.put({ ...cacheRow(100_000 + s, new Float32Array(SEARCH_LENGTH)), name: names[s] });
		}
		// rename some: their postings go stale and are counted from their new grams
		for (const s of [5, 77, 1500]) {
			names[s] = name() + ' renamed';
			c.put({ ...cacheRow(100_000 + s, new Float32Array(SEARCH_LENGTH)), name: names[s] });
		}
		const accept = (s: number) => s % 5 !== 0;
		for (const q of ['ambr violett', 'harbor', 'lantrn dye', 'shingle ester', 'renamed', 'tidepool']) {
			const grams = trigramsOf(q);
			const need = Math.ceil(grams.length / 2);
			// 77 is renamed and tagged at once: it must be counted once, at least `need`
			const tagged = [3, 4, 10, 77, 1999, 3];
			const got = c.rankedGramHits(grams, need, accept, tagged);
			const want = names
				.map((n, s) => {
					const own = new Set(trigramsOf(...spectrumTermTexts({ name: n, synonyms: '[]', cas: null })));
					let h = grams.filter((g) => own.has(g)).length;
					if (tagged.includes(s) && h < need) h = need;
					return { s, h };
				})
				.filter((x) => x.h >= need && accept(x.s))
				.sort((a, b) => b.h - a.h || b.s - a.s);
			expect(Array.from(got.slots.subarray(0, got.n))).toEqual(want.map((x) => x.s));
			expect(Array.from(got.hits.subarray(0, got.n))).toEqual(want.map((x) => x.h));
		}
	});
});

describe('similarity: one pass, top-k by a heap, same answers as rankSimilar within 1e-6', () => {
	it('2,000 random vectors, 5 targets, k = 1, 10, 50: in-process and worker agree with the core', { timeout: 120_000 }, async () => {
		const vs = randomVectors(2000, 9);
		const n = vs.length;
		const c = packedIndex(vs);
		const idArr = c.ids;
		for (const t of [1, 2, 7, 500, 1999]) {
			const slots = Int32Array.from({ length: n }, (_, s) => s).filter((s) => s !== t);
			// the core's answer, candidates newest (highest id) first as the Library lists them
			const cands = Array.from(slots, (s) => ({ id: idArr[s], vector: vs[s] })).reverse();
			let ss = 0;
			for (const x of vs[t]) ss += x * x;
			for (const k of [1, 10, 50]) {
				// "today's" answer: plain cosine over whole vectors (cosineSimilarity), ties by higher id first
				const want = cands.map((c) => ({ id: c.id, score: cosineSimilarity(vs[t], c.vector) })).sort((p, q) => q.score - p.score || q.id - p.id).slice(0, k);
				const job = { vectors: c.vectors, offs: c.vecOff, froms: c.vecFrom, lens: c.vecLen, target: vs[t], targetInv: ss > 0 ? 1 / Math.sqrt(ss) : 0, slots, invNorm: c.invNorm, ids: idArr, k };
				for (const got of [topKInProcess(job), await topKInWorker(job)]) {
					expect(got).toHaveLength(want.length);
					for (let i = 0; i < want.length; i++) {
						expect(Math.abs(got[i].score - want[i].score)).toBeLessThanOrEqual(1e-6);
					}
					expect(got.map((g) => g.id)).toEqual(want.map((w) => w.id));
				}
			}
		}
	});
	it('GET /api/spectra/similar answers as the core ranks the stored vectors', async () => {
		const r = await similarSpectra(localsOf('member'), String(ids.a), '4');
		// the answer as it was computed before the index: every visible row of the kind, newest first, ranked by the core
		const caller = await callerOf(localsOf('member'));
		const rows = (await listSpectrumSummaries(caller.reader, { kind: 'absorption', withVector: true })).filter((x) => Number(x.id) !== ids.a);
		const target = bufferToVector((await findSpectrumById(ids.a))!.search_vector);
		const want = rankSimilar(target, rows.map((x) => ({ id: Number(x.id), vector: bufferToVector(x.search_vector) })), 4);
		expect(r.items.map((i) => i.id)).toEqual(want.map((w) => w.id));
		for (let i = 0; i < want.length; i++) expect(Math.abs(r.items[i].similarity - want[i].score)).toBeLessThanOrEqual(1e-6);
	});
});
