/**
 * Export → import round trips through three readers: this product's importer, jcampconverter (a general-purpose
 * JCAMP-DX reader) and a minimal reader written below from the JCAMP-DX 4.24 text (McDonald & Wilks, Appl.
 * Spectrosc. 42, 151, 1988: x_i = FIRSTX + i·(LASTX − FIRSTX)/(NPOINTS − 1), y = integer × YFACTOR; FIRSTY/LASTY
 * are the first and last ordinates). Tolerance: CSV 1e-9 relative; JCAMP-DX y written as 14-digit integers, so
 * 1e-12 of the largest |y| plus 1e-9 relative (common practice for fixed-point exports). Inputs: the shared
 * third-party files (../shared/external, origins in MANIFEST.md) and an invented emission curve.
 */
import { convert } from 'jcampconverter';
import { describe, expect, it } from 'vitest';
import { norm, parseExternal } from '../__fixtures__/external';
import { normaliseSpectrum } from '../normalise';
import { parseSpectrumFile } from '../parse/index';
import type { NormalisedSpectrum, SpectrumFileMetadata } from '../types';
import { exportCsv } from './csv';
import { exportJcamp, exportJcampLink, isUniform } from './jcamp';

const enc = new TextEncoder();

function reimport(text: string, name: string): NormalisedSpectrum {
	const r = parseSpectrumFile(enc.encode(text), name);
	if (!r.ok) throw new Error(JSON.stringify(r.issues));
	expect(r.value).toHaveLength(1);
	const n = normaliseSpectrum(r.value[0]);
	if (!n.ok) throw new Error(JSON.stringify(n.issues));
	return n.value;
}

function expectSame(a: NormalisedSpectrum, b: NormalisedSpectrum, fullScale = 0) {
	expect(b.kind).toBe(a.kind);
	expect(b.yUnit).toBe(a.yUnit);
	expectPoints(a, b, fullScale);
}

function expectPoints(a: { x: ArrayLike<number>; y: ArrayLike<number> }, b: { x: ArrayLike<number>; y: ArrayLike<number> }, fullScale = 0) {
	expect(b.x.length).toBe(a.x.length);
	let max = 0;
	for (let i = 0; i < a.y.length; i++) max = Math.max(max, Math.abs(a.y[i]));
	for (let i = 0; i < a.x.length; i++) {
		expect(Math.abs(b.x[i] - a.x[i])).toBeLessThanOrEqual(1e-9 * Math.abs(a.x[i]));
		expect(Math.abs(b.y[i] - a.y[i])).toBeLessThanOrEqual(fullScale * max + 1e-9 * Math.max(Math.abs(a.y[i]), 1e-300));
	}
}

/** A reader written from the standard's text only: labelled records, then (X++(Y..Y)) AFFN lines or (XY..XY) pairs. */
function independentRead(text: string) {
	const ldr = new Map<string, string>();
	const lines = text.split('\n');
	let k = 0;
	for (; k < lines.length; k++) {
		const m = /^##([^=]+)=(.*)$/.exec(lines[k]);
		if (!m) continue;
		ldr.set(m[1], m[2]);
		if (m[1] === 'XYDATA' || m[1] === 'XYPOINTS') break;
	}
	const num = (key: string) => Number(ldr.get(key));
	const ys: number[] = [];
	const xs: number[] = [];
	const lineX: [number, number][] = [];
	for (k++; k < lines.length && !lines[k].startsWith('##'); k++) {
		const t = lines[k].split(/[\s,]+/).filter(Boolean).map(Number);
		if (ldr.get('XYPOINTS')) {
			for (let j = 0; j < t.length; j += 2) (xs.push(t[j] * num('XFACTOR')), ys.push(t[j + 1] * num('YFACTOR')));
		} else {
			lineX.push([t[0], ys.length]);
			for (const v of t.slice(1)) ys.push(v * num('YFACTOR'));
		}
	}
	const n = num('NPOINTS');
	if (!ldr.get('XYPOINTS')) for (let i = 0; i < ys.length; i++) xs.push(num('FIRSTX') + (i * (num('LASTX') - num('FIRSTX'))) / (n - 1));
	return { ldr, num, x: xs, y: ys, lineX, form: ldr.get('XYDATA') ?? ldr.get('XYPOINTS') };
}

const cases: [string, () => { spec: NormalisedSpectrum; md: SpectrumFileMetadata }][] = [
	['absorbance (THF LINK file, jcampconverter test data)', () => {
		const raw = parseExternal('jcamp/uv-vis-thf-link-absorbance-plus-variance.jdx').value[0];
		return { spec: norm(raw), md: { ...raw.metadata, solvent: 'tetrahydrofuran', cas: '0000-00-0' } };
	}],
	['ε (kinetics block 1 with invented c = 6 mM, l = 1 cm)', () => {
		const raw = parseExternal('jcamp/cobalt-aquation-kinetics-5-blocks.jdx').value[0];
		return { spec: norm(raw, { concentrationM: 6e-3, pathCm: 1 }), md: { title: 'block 1', concentrationM: 6e-3, pathCm: 1 } };
	}],
	['transmittance (PMMA sheet, photobiologyFilters)', () => ({ spec: norm(parseExternal('transmission/pmma-clear-sheet.csv').value[0]), md: { title: 'sheet, 3 mm' } })],
	['W/m2/nm (ASTM G173 global, pvlib)', () => ({ spec: norm(parseExternal('emission/solar-astm-g173-am15.csv', { columns: [2] }).value[0]), md: {} })],
	['relative emission (invented lamp curve)', () => {
		const x = Float64Array.from({ length: 200 }, (_, i) => 350 + i * 0.37);
		return { spec: { kind: 'emission', x, y: x.map((v) => Math.exp(-0.5 * ((v - 390) / 9) ** 2) * 1e-3), yUnit: 'relative' }, md: { title: 'invented 390 nm lamp, bench 2' } };
	}]
];

describe.each(cases)('%s', (_name, make) => {
	it('CSV export re-imports to the same data', () => {
		const { spec, md } = make();
		expectSame(spec, reimport(exportCsv(spec, md), 'x.csv'));
	});
	it('JCAMP-DX export re-imports to the same data', () => {
		const { spec, md } = make();
		const text = exportJcamp(spec, md);
		expect(text).toMatch(/##XUNITS=NANOMETERS/);
		expect(text).not.toMatch(/PEAK TABLE/);
		expectSame(spec, reimport(text, 'x.jdx'), 1e-12);
	});
	it('JCAMP-DX export: a second reader (written from the standard) gets the points, NPOINTS, FIRSTY/LASTY', () => {
		const { spec, md } = make();
		const r = independentRead(exportJcamp(spec, md));
		expect(r.form).toBe(isUniform(spec.x) ? '(X++(Y..Y))' : '(XY..XY)');
		expect(r.y.length).toBe(r.num('NPOINTS'));
		expectPoints(spec, r, 1e-12);
		expect(r.num('FIRSTX')).toBe(spec.x[0]);
		expect(r.num('LASTX')).toBe(spec.x[spec.x.length - 1]);
		expect(r.num('FIRSTY')).toBeCloseTo(r.y[0], 12);
		expect(r.num('LASTY')).toBeCloseTo(r.y[r.y.length - 1], 12);
		expect(r.num('MINY')).toBeCloseTo(Math.min(...r.y), 12);
		expect(r.num('MAXY')).toBeCloseTo(Math.max(...r.y), 12);
		// Each (X++(Y..Y)) line starts with the abscissa of its first ordinate.
		for (const [x0, i] of r.lineX) expect(Math.abs(x0 - r.x[i])).toBeLessThanOrEqual(1e-9 * Math.abs(x0));
	});
	it('JCAMP-DX export: jcampconverter reads the same points, FIRSTY and LASTY (uniform grids)', () => {
		const { spec, md } = make();
		if (!isUniform(spec.x)) return; // jcampconverter 12 does not read ##XYPOINTS (STACK.md)
		const sp = (convert(exportJcamp(spec, md), { keepRecordsRegExp: /.*/ }) as unknown as { flatten: { spectra: { data: { x: number[]; y: number[] }; firstY: number; lastY: number; isPeaktable?: boolean }[] }[] }).flatten[0].spectra[0];
		expect(sp.isPeaktable).toBeFalsy();
		expectPoints(spec, sp.data, 1e-12);
		expect(sp.firstY).toBeCloseTo(sp.data.y[0], 12);
		expect(sp.lastY).toBeCloseTo(sp.data.y[sp.data.y.length - 1], 12);
	});
});

it('LINK export: one block per spectrum, read back block by block by all three readers', () => {
	const raw = parseExternal('jcamp/cobalt-aquation-kinetics-5-blocks.jdx').value;
	const specs = raw.map((r) => norm(r));
	const text = exportJcampLink(specs.map((spec, i) => ({ spec, metadata: { title: `invented kinetics run (t${i + 1})` } })), 'invented kinetics run');
	expect(text).toMatch(/##DATA TYPE=LINK\n##BLOCKS=5/);
	const mine = parseSpectrumFile(enc.encode(text), 'link.jdx');
	if (!mine.ok) throw new Error(JSON.stringify(mine.issues));
	expect(mine.value.map((s) => s.label)).toEqual(['t1', 't2', 't3', 't4', 't5']);
	const cc = (convert(text, { keepRecordsRegExp: /.*/ }) as unknown as { flatten: { spectra: { data: { x: number[]; y: number[] } }[] }[] }).flatten.filter((f) => f.spectra?.length);
	expect(cc).toHaveLength(5);
	const blocks = text.split(/(?=##TITLE=invented kinetics run \()/).slice(1);
	specs.forEach((s, i) => {
		expectPoints(s, mine.value[i], 1e-12);
		expectPoints(s, cc[i].spectra[0].data, 1e-12);
		expectPoints(s, independentRead(blocks[i]), 1e-12);
	});
});

it('JCAMP-DX export keeps title, solvent, CAS, concentration and path (read back from the LDRs)', () => {
	const spec: NormalisedSpectrum = { kind: 'absorption', x: Float64Array.from([300, 310, 320, 330, 340]), y: Float64Array.from([100, 2000, 3000, 1500, 10]), yUnit: 'epsilon' };
	const r = parseSpectrumFile(enc.encode(exportJcamp(spec, { title: 'invented dye C', solvent: 'acetonitrile', cas: '0000-00-0', concentrationM: 2e-5, pathCm: 1 })), 'c.jdx');
	if (!r.ok) throw new Error('re-import failed');
	expect(r.value[0].metadata).toMatchObject({ title: 'invented dye C', solvent: 'acetonitrile', cas: '0000-00-0', concentrationM: 2e-5, pathCm: 1 });
	expect(r.value[0].yUnit).toBe('epsilon');
});
