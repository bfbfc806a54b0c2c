/**
 * Upload fuzz over HTTP: 300 seeded mutations of the real files in ../shared/external (origins in MANIFEST.md)
 * posted to POST /api/spectra with a member's bearer token. Every answer must be 201 or a 4xx with the error
 * envelope (API.md) — never a 5xx — the server must stay up, and the Library's row count must grow by exactly the
 * items the 201 answers report (a refused upload writes nothing).
 */
import fs from 'node:fs';
import path from 'node:path';
import { expect, test } from '@playwright/test';
import { head, mutate, prng } from '../../src/lib/spectra/__fixtures__/mutate';
import { bearerContext } from './helpers/auth';

const external = path.resolve(process.cwd(), '../shared/external');
const dirs = ['jcamp', 'jcamp-variety', 'csv', 'csv-variety', 'emission', 'transmission'];
const seeds = dirs.flatMap((d) =>
	fs.readdirSync(path.join(external, d)).filter((f) => !f.endsWith('.json')).map((f) => ({ name: f, bytes: head(new Uint8Array(fs.readFileSync(path.join(external, d, f))), 6 * 1024) }))
);

test('300 mutated uploads: 0 5xx, 0 crashes, row counts consistent', async () => {
	test.setTimeout(15 * 60_000);
	const api = await bearerContext('member');
	const total = async () => {
		const r = await api.get('/api/spectra?limit=1');
		expect(r.status()).toBe(200);
		return (await r.json()).total as number;
	};
	const before = await total();
	const rnd = prng(4205);
	const tally: Record<number, number> = {};
	let stored = 0;
	const fivexx: string[] = [];
	for (let k = 0; k < 300; k++) {
		const seed = seeds[k % seeds.length];
		const bytes = mutate(seed.bytes, rnd);
		// Two identical accepted mutations give 409 (duplicate), which writes nothing either.
		const r = await api.post('/api/spectra', { multipart: { file: { name: `fuzz-${k}-${seed.name}`, mimeType: 'application/octet-stream', buffer: Buffer.from(bytes) } } });
		const status = r.status();
		tally[status] = (tally[status] ?? 0) + 1;
		const body = await r.json().catch(() => null);
		if (status >= 500) fivexx.push(`${k} ${seed.name}: ${status} ${JSON.stringify(body).slice(0, 300)}`);
		else if (status === 201) stored += body.items.length;
		else {
			expect([400, 409, 413, 415, 422], `${k} ${seed.name}: ${status}`).toContain(status);
			expect(body?.error?.message, `${k} ${seed.name}: error envelope`).toBeTruthy();
		}
		if (k % 50 === 49) expect(await total(), `row count after ${k + 1} uploads`).toBe(before + stored);
	}
	console.log(`HTTP upload fuzz: 300 posts, statuses ${JSON.stringify(tally)}, ${stored} spectra stored, ${fivexx.length} 5xx`);
	expect(fivexx).toEqual([]);
	expect(await total()).toBe(before + stored);
	const health = await api.get('/api/health');
	expect(health.status()).toBe(200);
	await api.dispose();
});
