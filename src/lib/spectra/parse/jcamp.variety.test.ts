/**
 * The real variety of JCAMP-DX files (../shared/external/jcamp-variety, origins and expected outcomes in
 * ../shared/external/MANIFEST.md, reference values from an independent reader — the Python `jcamp` package 1.3.2 —
 * or the file's own header). Each file is read right or refused for the right reason, with the right HTTP class.
 */
import { describe, expect, it } from 'vitest';
import { norm, readExternal } from '../__fixtures__/external';
import { parseSpectrumFile } from './index';
import { statusForIssues } from './issueStatus';
import { splitJcampBlocks } from './jcampBlocks';
import { readXyData, readXyHeader } from './jcampXyData';
import { splitLines } from './numbers';

const dec = new TextDecoder();
const rel = (f: string) => `jcamp-variety/${f}`;
const parse = (f: string) => parseSpectrumFile(readExternal(rel(f)), f);

/** Decodes the first block's XYDATA without the unit/range checks, to compare the numbers themselves. */
function decodeOnly(f: string) {
	const lines = splitLines(dec.decode(readExternal(rel(f))));
	const b = splitJcampBlocks(lines)[0];
	const { header } = readXyHeader(b.ldr, b.ldrLine);
	const r = readXyData(lines, b.start, b.end, b.ldrLine.get('XYDATA')!, header, { remaining: 2e6, cap: 2e6 });
	if (r.issues.some((i) => i.severity === 'error')) throw new Error(JSON.stringify(r.issues));
	return r;
}
const range = (v: number[]) => [Math.min(...v), Math.max(...v)];

function refused(f: string, status: number, code: string) {
	const r = parse(f);
	expect(r.ok).toBe(false);
	if (r.ok) throw new Error('accepted');
	expect(statusForIssues(r.issues)).toBe(status);
	const first = r.issues.find((i) => i.severity === 'error')!;
	expect(first.code).toBe(code);
	expect(first.line).toBeGreaterThan(0);
	return first;
}

describe('jcamp-variety (MANIFEST.md outcomes)', () => {
	it('uv-toluene-log-epsilon.jdx: log ε stored as ε = 10^y, max 270 M⁻¹ cm⁻¹ (10^2.43145), x 233.8–275.0 nm', () => {
		const r = parse('uv-toluene-log-epsilon.jdx');
		if (!r.ok) throw new Error(JSON.stringify(r.issues));
		const s = r.value[0];
		expect(s.yUnit).toBe('log-epsilon');
		const n = norm(s);
		expect(n.yUnit).toBe('epsilon');
		const [lo, hi] = range(Array.from(n.y));
		expect(hi).toBeCloseTo(10 ** 2.43145, 0); // MANIFEST: max 270
		expect(lo).toBeCloseTo(11.4, 1); // MANIFEST: 11.4 = 10^1.05857 (header MINY)
		expect(n.x[0]).toBeCloseTo(233.8172, 4); // header LASTX (descending file)
		expect(n.x[n.x.length - 1]).toBeCloseTo(274.9571, 4); // header FIRSTX
		// 71 repeated x values in the file (MANIFEST): identical pairs merged with a warning each.
		expect(r.warnings.filter((w) => w.code === 'duplicate_x_merged').length).toBe(335 - s.x.length);
	});
	it('ir-benzene-gas-1-per-cm.jdx: 3343 points decode; refused "infrared spectrum, 2.6–22 µm: outside 190–1100 nm" (422)', () => {
		const d = decodeOnly('ir-benzene-gas-1-per-cm.jdx');
		expect(d.x.length).toBe(3343); // MANIFEST / header NPOINTS
		expect(range(d.x)).toEqual([452, 3794]); // header MINX / MAXX
		const e = refused('ir-benzene-gas-1-per-cm.jdx', 422, 'outside_optical_range');
		expect(e.message).toMatch(/infrared spectrum, 452–3794 cm⁻¹ = 2\.6–22 µm: outside 190–1100 nm/);
	});
	it('ir-butanol-sign-delimited.jdx: sign-delimited AFFN decodes to 14106 points 574.9–3975 cm⁻¹, then refused for its range', () => {
		const d = decodeOnly('ir-butanol-sign-delimited.jdx');
		expect(d.x.length).toBe(14106); // MANIFEST
		expect(d.x[0]).toBeCloseTo(574.928, 3); // header FIRSTX
		expect(d.x[d.x.length - 1]).toBeCloseTo(3975.077, 3); // header LASTX
		// header MINY/MAXY (already × YFACTOR in the header): −3.73e-6 … 5.393e-4
		const [lo, hi] = range(d.y);
		expect(lo).toBeCloseTo(-3.73e-6, 7);
		expect(hi).toBeCloseTo(5.393e-4, 6);
		const e = refused('ir-butanol-sign-delimited.jdx', 422, 'outside_optical_range');
		expect(e.message).toMatch(/infrared spectrum/);
		expect(e.message).not.toMatch(/not a number/);
	});
	it('ir-yfactor-with-comment.jdx: YFACTOR after which a $$ comment follows is applied: y 0.34–1.02; 1844 points 447.5–4002', () => {
		const d = decodeOnly('ir-yfactor-with-comment.jdx');
		expect(d.x.length).toBe(1844);
		const [lo, hi] = range(d.y);
		expect(lo).toBeCloseTo(0.3428528714, 4); // header MINY
		expect(hi).toBeCloseTo(1.022816066, 4); // header MAXY
		expect(d.x[0]).toBeCloseTo(447.484259, 2);
		expect(d.x[d.x.length - 1]).toBeCloseTo(4002.28378, 2);
		refused('ir-yfactor-with-comment.jdx', 422, 'outside_optical_range');
	});
	it('ir-e-notation.jdx: NPOINTS 1867 and 1867 points decode (e is an exponent here), x 399.4–3999', () => {
		const d = decodeOnly('ir-e-notation.jdx');
		expect(d.x.length).toBe(1867);
		expect(d.issues.find((i) => i.code === 'point_count_mismatch')).toBeUndefined();
		expect(d.x[0]).toBeCloseTo(399.361384615384, 6);
		expect(d.x[d.x.length - 1]).toBeCloseTo(3999.40169230769, 6);
		expect(d.y[0]).toBeCloseTo(0.0697489890897993, 6); // header FIRSTY (the data print 0.069749)
		refused('ir-e-notation.jdx', 422, 'outside_optical_range');
	});
	it('ir-difdup-small.dx: no units, x 5580–5593: a clear 4xx naming why, never a NaN', () => {
		const d = decodeOnly('ir-difdup-small.dx');
		for (const v of [...d.x, ...d.y]) expect(Number.isFinite(v)).toBe(true);
		expect(d.x[0]).toBeCloseTo(5592.84116331095, 6); // header FIRSTX
		const e = refused('ir-difdup-small.dx', 422, 'outside_optical_range');
		expect(e.message).toMatch(/without an x unit/);
	});
	it('iv-curve-volts.jdx: a current–voltage curve: 415 naming what it is', () => {
		const e = refused('iv-curve-volts.jdx', 415, 'not_optical_spectrum');
		expect(e.message).toMatch(/current–voltage/);
	});
});

describe('jcamp/ (the UV–vis files) still read', () => {
	it('uv-mislabelled-as-infrared-1-per-cm.jdx stays a warning the user confirms (1/CM over 210–650)', () => {
		const r = parseSpectrumFile(readExternal('jcamp/uv-mislabelled-as-infrared-1-per-cm.jdx'), 'a.jdx');
		if (!r.ok) throw new Error(JSON.stringify(r.issues));
		expect(r.value[0].xUnit).toBe('nm');
		expect(r.warnings.some((w) => w.code === 'units_contradict_data')).toBe(true);
	});
	it('cobalt 5-block LINK: FIRSTY that does not match is a warning with the numbers, not a refusal', () => {
		const r = parseSpectrumFile(readExternal('jcamp/cobalt-aquation-kinetics-5-blocks.jdx'), 'k.jdx');
		if (!r.ok) throw new Error(JSON.stringify(r.issues));
		expect(r.value).toHaveLength(5);
		expect(r.warnings.find((w) => w.code === 'firsty_mismatch')?.message).toMatch(/FIRSTY says 0\.19; the data give -0\.006/);
		expect(r.value.map((s) => s.label)).toEqual(['t1', 't2', 't3', 't4', 't5']);
		expect(r.value[0].metadata.title).toBe('Aquation of trans-[Co(en)2Cl2]+');
	});
});

describe('the parse result crosses a worker-thread boundary unchanged', () => {
	it('structuredClone of a LINK result and of a refusal deep-equals the original (typed arrays, plain issues)', () => {
		for (const f of ['jcamp/cobalt-aquation-kinetics-5-blocks.jdx', 'jcamp-variety/iv-curve-volts.jdx']) {
			const r = parseSpectrumFile(readExternal(f), f);
			expect(structuredClone(r)).toEqual(r);
		}
	});
});

