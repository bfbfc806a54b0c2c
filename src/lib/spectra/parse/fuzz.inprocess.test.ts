/**
 * In-process fuzz of the upload parser (issue: nothing a user sends takes the server down): 10,000 seeded
 * mutations of the real third-party files in ../shared/external (origins in its MANIFEST.md) — bytes replaced,
 * inserted and deleted, lines duplicated and dropped, digits and DUP/SQZ/DIF characters swapped, files truncated —
 * go through parseSpectrumFile and the normaliser. Each must answer (a result or refusal issues): never throw,
 * never a non-finite point, never more points than the per-file cap. Seeded (mulberry32), so a failure replays.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { normaliseSpectrum } from '../normalise';
import { parseSpectrumFile } from './index';
import { DEFAULT_PARSE_LIMITS } from './parseLimits';

const ROOT = resolve(process.cwd(), '../shared/external');
const MUTATIONS = 10_000;
const SEED = 20261202;

/** mulberry32: a small seeded PRNG (common practice for reproducible fuzzing). */
function rng(seed: number) {
	let a = seed >>> 0;
	return () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}

function sources(): { name: string; bytes: Uint8Array }[] {
	const out: { name: string; bytes: Uint8Array }[] = [];
	for (const dir of readdirSync(ROOT)) {
		const d = join(ROOT, dir);
		if (!statSync(d).isDirectory()) continue;
		for (const f of readdirSync(d)) {
			const p = join(d, f);
			// small files keep 10,000 runs within seconds; large ones are covered by the truncation fuzz in index.test.ts
			if (statSync(p).isFile() && statSync(p).size <= 40_000 && !/\.(md|yml|yaml)$/i.test(f)) out.push({ name: `${dir}/${f}`, bytes: new Uint8Array(readFileSync(p)) });
		}
	}
	return out;
}

const SPECIAL = '0123456789+-.,;eE \t\r\n@ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrs%#$=()?/';

function mutate(src: Uint8Array, r: () => number): Uint8Array {
	const a = Array.from(src);
	const n = 1 + Math.floor(r() * 6);
	for (let k = 0; k < n && a.length; k++) {
		const at = Math.floor(r() * a.length);
		const op = Math.floor(r() * 7);
		if (op === 0) a[at] = Math.floor(r() * 256);
		else if (op === 1) a[at] = SPECIAL.charCodeAt(Math.floor(r() * SPECIAL.length));
		else if (op === 2) a.splice(at, 0, SPECIAL.charCodeAt(Math.floor(r() * SPECIAL.length)));
		else if (op === 3) a.splice(at, 1 + Math.floor(r() * 40));
		else if (op === 4) a.length = at; // truncate
		else {
			// duplicate or drop one line
			const start = a.lastIndexOf(10, at) + 1;
			let end = a.indexOf(10, at);
			if (end < 0) end = a.length;
			const line = a.slice(start, end + 1);
			if (op === 5) a.splice(start, 0, ...line);
			else a.splice(start, line.length);
		}
	}
	return new Uint8Array(a);
}

describe('in-process fuzz of the parser', () => {
	it(`${MUTATIONS.toLocaleString('en')} seeded mutations of the real files: no throw, no non-finite point, no point past the cap`, { timeout: 300_000 }, () => {
		const files = sources();
		expect(files.length).toBeGreaterThan(5);
		const r = rng(SEED);
		let accepted = 0;
		let refused = 0;
		for (let i = 0; i < MUTATIONS; i++) {
			const src = files[i % files.length];
			const bytes = mutate(src.bytes, r);
			let res: ReturnType<typeof parseSpectrumFile>;
			try {
				res = parseSpectrumFile(bytes, src.name);
			} catch (e) {
				throw new Error(`mutation ${i} of ${src.name} (seed ${SEED}) threw: ${(e as Error).message}`);
			}
			if (!res.ok) {
				expect(res.issues.length).toBeGreaterThan(0);
				refused++;
				continue;
			}
			accepted++;
			let points = 0;
			for (const s of res.value) {
				points += s.x.length;
				for (let j = 0; j < s.x.length; j++) if (!Number.isFinite(s.x[j]) || !Number.isFinite(s.y[j])) throw new Error(`mutation ${i} of ${src.name}: non-finite point ${j}`);
				const n = normaliseSpectrum(s);
				if (n.ok) for (let j = 0; j < n.value.x.length; j++) if (Number.isNaN(n.value.x[j]) || Number.isNaN(n.value.y[j])) throw new Error(`mutation ${i} of ${src.name}: NaN after normalising`);
			}
			expect(points).toBeLessThanOrEqual(DEFAULT_PARSE_LIMITS.maxPointsPerFile);
		}
		expect(accepted + refused).toBe(MUTATIONS);
		console.log(`[fuzz] ${MUTATIONS} mutations of ${files.length} files: ${accepted} read, ${refused} refused, 0 crashes`);
	});
});
