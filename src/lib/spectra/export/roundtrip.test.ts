/**
 * Export → import round trips: the data must come back equal to 1e-9 relative (headers are not
 * compared; convert-to-jcamp writes a wrong LASTY, see STACK.md). Inputs: the shared third-party files
 * (../shared/external, origins in MANIFEST.md) and an invented emission curve.
 */
import { describe, expect, it } from 'vitest';
import { norm, parseExternal } from '../__fixtures__/external';
import { normaliseSpectrum } from '../normalise';
import { parseSpectrumFile } from '../parse/index';
import type { NormalisedSpectrum, SpectrumFileMetadata } from '../types';
import { exportCsv } from './csv';
import { exportJcamp } from './jcamp';

const enc = new TextEncoder();

function reimport(text: string, name: string): NormalisedSpectrum {
	const r = parseSpectrumFile(enc.encode(text), name);
	if (!r.ok) throw new Error(JSON.stringify(r.issues));
	expect(r.value).toHaveLength(1);
	const n = normaliseSpectrum(r.value[0]);
	if (!n.ok) throw new Error(JSON.stringify(n.issues));
	return n.value;
}

function expectSame(a: NormalisedSpectrum, b: NormalisedSpectrum) {
	expect(b.kind).toBe(a.kind);
	expect(b.yUnit).toBe(a.yUnit);
	expect(b.x.length).toBe(a.x.length);
	for (let i = 0; i < a.x.length; i++) {
		expect(Math.abs(b.x[i] - a.x[i])).toBeLessThanOrEqual(1e-9 * Math.abs(a.x[i]));
		expect(Math.abs(b.y[i] - a.y[i])).toBeLessThanOrEqual(1e-9 * Math.max(Math.abs(a.y[i]), 1e-300));
	}
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
		expectSame(spec, reimport(text, 'x.jdx'));
	});
});

it('JCAMP-DX export keeps title, solvent, CAS, concentration and path (read back from the LDRs)', () => {
	const spec: NormalisedSpectrum = { kind: 'absorption', x: Float64Array.from([300, 310, 320, 330, 340]), y: Float64Array.from([100, 2000, 3000, 1500, 10]), yUnit: 'epsilon' };
	const r = parseSpectrumFile(enc.encode(exportJcamp(spec, { title: 'invented dye C', solvent: 'acetonitrile', cas: '0000-00-0', concentrationM: 2e-5, pathCm: 1 })), 'c.jdx');
	if (!r.ok) throw new Error('re-import failed');
	expect(r.value[0].metadata).toMatchObject({ title: 'invented dye C', solvent: 'acetonitrile', cas: '0000-00-0', concentrationM: 2e-5, pathCm: 1 });
	expect(r.value[0].yUnit).toBe('epsilon');
});
