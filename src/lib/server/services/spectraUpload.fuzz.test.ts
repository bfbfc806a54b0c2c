/**
 * Fuzz test of upload parsing, in process: 10 000 seeded mutations of the real files in ../shared/external (origins
 * in MANIFEST.md; JCAMP-DX files are cut to their first 4 kB and delimited text to its first 1 kB at a line end, and every 500th run mutates a whole
 * file of at most 150 kB) through the parser and normaliser; every 50th run goes through the whole upload preparation (derive and the
 * store's finiteness guard too). Every outcome must be spectra whose numbers are all finite, or a refusal of class
 * 400/413/415/422 with a message — never an exception (a crash) and never an `internal_error`.
 */
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { externalPath } from '../../spectra/__fixtures__/external';
import { head, mutate, prng } from '../../spectra/__fixtures__/mutate';
import { normaliseSpectrum } from '../../spectra/normalise';
import { parseSpectrumFile } from '../../spectra/parse/index';
import { statusForIssues } from '../../spectra/parse/issueStatus';
import { ApiError } from '../http';
import { assertFiniteSpectra } from './spectraFinite';
import { prepareSpectra } from './spectraPrepare';

const dirs = ['jcamp', 'jcamp-variety', 'csv', 'csv-variety', 'emission', 'transmission'];
const files = dirs.flatMap((d) => fs.readdirSync(externalPath(d)).filter((f) => !f.endsWith('.json')).map((f) => `${d}/${f}`));
const full = files.map((f) => ({ name: f, bytes: new Uint8Array(fs.readFileSync(externalPath(f))) }));
const wholes = full.filter((f) => f.bytes.length <= 150 * 1024);
// Delimited-text seeds are cut shorter (1 kB): the table reader costs more per byte than the JCAMP-DX decoder.
const seeds = full.map((f) => ({ name: f.name, bytes: head(f.bytes, f.name.startsWith('jcamp') ? 4 * 1024 : 1024) }));

export interface FuzzTally { runs: number; accepted: number; refused: Record<number, number>; crashes: string[] }

const finite = (a: ArrayLike<number>) => {
	for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i])) return false;
	return true;
};

/** Parser and normaliser only (the fast path of the fuzz loop). */
function parseOne(bytes: Uint8Array, name: string, t: FuzzTally) {
	t.runs++;
	try {
		const r = parseSpectrumFile(bytes, path.basename(name), { limits: { maxPointsPerFile: 200_000, maxSpectraPerFile: 500 } });
		if (!r.ok) {
			const bad = r.issues.find((i) => i.code === 'internal_error' || !i.message);
			if (bad || !r.issues.some((i) => i.severity === 'error' || i.severity === 'warning')) t.crashes.push(`${name}: ${JSON.stringify(bad ?? r.issues).slice(0, 400)}`);
			else t.refused[statusForIssues(r.issues)] = (t.refused[statusForIssues(r.issues)] ?? 0) + 1;
			return;
		}
		for (const s of r.value) {
			if (!finite(s.x) || !finite(s.y)) t.crashes.push(`${name}: a non-finite point was accepted`);
			const n = normaliseSpectrum(s);
			if (n.ok && (!finite(n.value.x) || !finite(n.value.y))) t.crashes.push(`${name}: normalising gave a non-finite point`);
			if (!n.ok && n.issues.some((i) => i.code === 'internal_error')) t.crashes.push(`${name}: ${n.issues[0].message}`);
		}
		t.accepted++;
	} catch (e) {
		t.crashes.push(`${name}: ${(e as Error)?.stack ?? e}`.slice(0, 400));
	}
}

/** Runs one input through the whole upload preparation and tallies it. */
function runOne(bytes: Uint8Array, name: string, t: FuzzTally) {
	t.runs++;
	try {
		const r = prepareSpectra(bytes, path.basename(name), {});
		assertFiniteSpectra(r.spectra, name);
		t.accepted++;
	} catch (e) {
		if (e instanceof ApiError && [400, 413, 415, 422].includes(e.status) && e.message && !/internal_error|reader failed|normalisation failed/.test(e.message)) {
			t.refused[e.status] = (t.refused[e.status] ?? 0) + 1;
			return;
		}
		t.crashes.push(`${name}: ${e instanceof ApiError ? `${e.status} ${e.message}` : (e as Error)?.stack ?? e}`.slice(0, 400));
	}
}

describe('upload fuzz (in process)', () => {
	it('10 000 seeded mutations of the real files: 0 crashes, only 400/413/415/422 refusals', () => {
		const t: FuzzTally = { runs: 0, accepted: 0, refused: {}, crashes: [] };
		const rnd = prng(20261202);
		const cpu = process.cpuUsage();
		for (let k = 0; k < 10_000; k++) {
			const src = k % 500 === 499 ? wholes[k % wholes.length] : seeds[k % seeds.length];
			const bytes = mutate(src.bytes, rnd);
			if (k % 50 === 0) runOne(bytes, src.name, t);
			else parseOne(bytes, src.name, t);
		}
		const used = process.cpuUsage(cpu);
		console.log(`upload fuzz: ${t.runs} runs, ${t.accepted} accepted, refused ${JSON.stringify(t.refused)}, ${t.crashes.length} crashes, ${((used.user + used.system) / 1e6).toFixed(1)} s CPU`);
		expect(t.crashes.slice(0, 5)).toEqual([]);
		expect(t.runs).toBe(10_000);
		// The mutations must exercise both sides (a fuzzer that only produces garbage proves little).
		expect(t.accepted).toBeGreaterThan(1000);
		expect(Object.values(t.refused).reduce((a, b) => a + b, 0)).toBeGreaterThan(1000);
	}, 300_000);
	it('the unmutated files: no crash either', () => {
		const t: FuzzTally = { runs: 0, accepted: 0, refused: {}, crashes: [] };
		for (const f of full) runOne(f.bytes, f.name, t);
		expect(t.crashes).toEqual([]);
	});
});
