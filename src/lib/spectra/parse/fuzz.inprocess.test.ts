/**
 * In-process fuzz of the upload parser (issue: nothing a user sends takes the server down): 10,000 seeded
 * mutations of the real third-party files in ../shared/external (origins in its MANIFEST.md) — bytes replaced,
 * inserted and deleted, compression letters and huge repeat counts, header values, truncation (__fixtures__/mutate.ts) —
 * go through parseSpectrumFile and the normaliser. Each must answer (a result or refusal issues): never throw,
 * never a non-finite point, never more points than the per-file cap. Seeded, so a failure replays.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { normaliseSpectrum } from '../normalise';
import { parseSpectrumFile } from './index';
import { DEFAULT_PARSE_LIMITS } from './parseLimits';
import { mutate, prng } from '../__fixtures__/mutate';

const ROOT = resolve(process.cwd(), '../shared/external');
const MUTATIONS = 10_000;
const SEED = 20261202;

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

describe('in-process fuzz of the parser', () => {
	it(`${MUTATIONS.toLocaleString('en')} seeded mutations of the real files: no throw, no non-finite point, no point past the cap`, { timeout: 300_000 }, () => {
		const files = sources();
		expect(files.length).toBeGreaterThan(5);
		const r = prng(SEED);
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
