/**
 * Headers believed (invented files written for these tests): x units, DATA TYPE, y units, refusals with their
 * HTTP class, and the physical limits after conversion. Conversions: λ = 10⁷/ν̃ and λ = hc/E (definitions; hc/e from
 * CODATA 2018), A = −log10 T (IUPAC Gold Book, "absorbance").
 */
import { describe, expect, it } from 'vitest';
import { normaliseSpectrum, gridInside } from '../normalise';
import { parseYUnit } from '../units';
import { parseSpectrumFile } from './index';
import { statusForIssues } from './issueStatus';
import { parseXAxisLabel } from './xUnitCheck';

const enc = new TextEncoder();
const jdx = (head: string, data: string) => `##TITLE=invented sample Q\n##JCAMP-DX=4.24\n${head}\n##XYPOINTS=(XY..XY)\n${data}\n##END=\n`;
const table = (xs: number[], ys: number[]) => xs.map((x, i) => `${x}, ${ys[i]}`).join('\n');
const parse = (text: string) => parseSpectrumFile(enc.encode(text), 'q.jdx');
const ok = (text: string) => {
	const r = parse(text);
	if (!r.ok) throw new Error(JSON.stringify(r.issues));
	return r;
};
const refusal = (text: string) => {
	const r = parse(text);
	if (r.ok) throw new Error('accepted');
	return { status: statusForIssues(r.issues), first: r.issues.find((i) => i.severity === 'error')! };
};
const xs = [300, 310, 320, 330, 340, 350];
const ys = [0.1, 0.3, 0.5, 0.4, 0.2, 0.1];

describe('x units believed', () => {
	it.each([
		['NANOMETERS', 'nm', 1], ['Wavelength (nm)', 'nm', 1], ['MICROMETERS', 'um', 1], ['µm', 'um', 1],
		['1/CM', 'cm-1', 1], ['CM-1', 'cm-1', 1], ['cm^-1', 'cm-1', 1], ['1/NM', 'cm-1', 1e7], ['ANGSTROMS', 'nm', 0.1], ['eV', 'eV', 1]
	])('%s → %s (× %d)', (label, unit, factor) => {
		expect(parseXAxisLabel(label)).toMatchObject({ unit, factor });
	});
	it.each(['S', 'SECONDS', 'ms', 'V', 'mV', 'HZ', 'PPM', 'M/Z', 'Da', 'mL', '2THETA'])('%s is not an optical axis', (label) => {
		expect(parseXAxisLabel(label)).toHaveProperty('notOptical');
	});
	it('MICROMETERS data are nm × 1000', () => {
		const r = ok(jdx('##XUNITS=MICROMETERS\n##YUNITS=ABSORBANCE', table([0.3, 0.31, 0.32, 0.33, 0.34, 0.35], ys)));
		expect(r.value[0].xUnit).toBe('um');
		expect(normaliseSpectrum(r.value[0]).ok && (normaliseSpectrum(r.value[0]) as { value: { x: Float64Array } }).value.x[0]).toBeCloseTo(300, 9);
	});
	it('eV data are converted to nm (λ = 1239.84198/E, CODATA 2018)', () => {
		const e = [4.0, 3.5, 3.0, 2.5, 2.0];
		const r = ok(jdx('##XUNITS=eV\n##YUNITS=ABSORBANCE', table(e, [0.1, 0.2, 0.3, 0.2, 0.1])));
		expect(r.value[0].xUnit).toBe('nm');
		expect(r.value[0].x[0]).toBeCloseTo(309.960496, 5); // 1239.841984 / 4
		expect(r.warnings.some((w) => w.code === 'converted_from_ev')).toBe(true);
	});
	it('1/NM data are wavenumbers × 10⁷ cm⁻¹ (0.0025 nm⁻¹ = 400 nm)', () => {
		const k = [0.0025, 0.0026, 0.0027, 0.0028, 0.0029, 0.003];
		const r = ok(jdx('##XUNITS=1/NM\n##YUNITS=ABSORBANCE', table(k, ys)));
		expect(r.value[0].xUnit).toBe('cm-1');
		expect(r.value[0].x[0]).toBeCloseTo(25000, 6);
	});
	it('a UV spectrum on a wavenumber axis (25 000–50 000 cm⁻¹) is converted and resampled, no NaN', () => {
		const nu = Array.from({ length: 26 }, (_, i) => 25000 + i * 1000);
		const r = ok(jdx('##DATA TYPE=UV/VIS SPECTRUM\n##XUNITS=1/CM\n##YUNITS=ABSORBANCE', table(nu, nu.map((v) => 0.1 + v / 1e6))));
		const n = normaliseSpectrum(r.value[0]);
		if (!n.ok) throw new Error(JSON.stringify(n.issues));
		expect(n.value.x[0]).toBeGreaterThanOrEqual(200);
		expect(n.value.x[n.value.x.length - 1]).toBeLessThanOrEqual(400);
		for (const v of n.value.y) expect(Number.isFinite(v)).toBe(true);
	});
});

describe('refusals with what the file is', () => {
	it.each([
		['##DATA TYPE=NMR SPECTRUM\n##XUNITS=PPM\n##YUNITS=ARBITRARY UNITS', /NMR spectrum/],
		['##DATA TYPE=MASS SPECTRUM\n##XUNITS=M/Z\n##YUNITS=RELATIVE ABUNDANCE', /mass spectrum/],
		['##DATA TYPE=RAMAN SPECTRUM\n##XUNITS=1/CM\n##YUNITS=ARBITRARY UNITS', /Raman spectrum/],
		['##DATA TYPE=UV/VIS SPECTRUM\n##XUNITS=SECONDS\n##YUNITS=ABSORBANCE', /time trace/],
		['##XUNITS=HZ\n##YUNITS=ARBITRARY UNITS', /NMR spectrum/],
		['##XUNITS=mL\n##YUNITS=pH', /titration/]
	])('%s → 415', (head, what) => {
		const { status, first } = refusal(jdx(head, table(xs, ys)));
		expect(status).toBe(415);
		expect(first.code).toBe('not_optical_spectrum');
		expect(first.message).toMatch(what);
		expect(first.line).toBeGreaterThan(0);
	});
	it('binary files by signature, even with a JCAMP-DX header inside → 415', () => {
		const body = enc.encode(jdx('##XUNITS=nm\n##YUNITS=ABSORBANCE', table(xs, ys)));
		const sigs = { 'a PNG image': [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a], 'a PDF document': [...enc.encode('%PDF-1.7\n')], 'a ZIP archive': [0x50, 0x4b, 0x03, 0x04], 'a gzip-compressed file': [0x1f, 0x8b, 0x08, 0x00] };
		for (const [name, sig] of Object.entries(sigs)) {
			const r = parseSpectrumFile(new Uint8Array([...sig, ...body]), 'x.jdx');
			expect(r.ok).toBe(false);
			if (!r.ok) {
				expect(statusForIssues(r.issues)).toBe(415);
				expect(r.issues[0].message).toContain(name);
			}
		}
	});
});

describe('y units', () => {
	it.each(['Logarithm epsilon', 'LOG(EPSILON)', 'log ε', 'lg eps', 'log10(epsilon)', 'Log molar absorptivity', 'LOG E'])('"%s" is log ε', (label) => {
		expect(parseYUnit(label)?.yUnit).toBe('log-epsilon');
	});
	it.each(['EPSILON', 'MOLAR ABSORPTIVITY (M-1 CM-1)', 'ε / L mol-1 cm-1'])('"%s" is ε', (label) => {
		expect(parseYUnit(label)?.yUnit).toBe('epsilon');
	});
	it('TRANSMITTANCE with fractions and one spike of 1.505 stays a fraction and the spike is refused (422, its line)', () => {
		const y = [0.5, 0.6, 1.505, 0.7, 0.8, 0.9];
		const { status, first } = refusal(jdx('##XUNITS=nm\n##YUNITS=TRANSMITTANCE', table(xs, y)));
		expect(status).toBe(422);
		expect(first).toMatchObject({ code: 'transmittance_above_one', line: 8 });
	});
	it('TRANSMITTANCE whose values run to 90 is %T (decided from the data, with a warning)', () => {
		const r = ok(jdx('##XUNITS=nm\n##YUNITS=TRANSMITTANCE', table(xs, [10, 30, 50, 70, 80, 90])));
		expect(r.value[0].yUnit).toBe('transmittance-percent');
		expect(r.warnings.some((w) => w.code === 'y_unit_inferred')).toBe(true);
	});
	it('%T read as absorbance because no y unit is stated: A > 10 is refused (422) saying it looks like %T', () => {
		const { status, first } = refusal(jdx('##XUNITS=nm', table(xs, [12, 35, 60, 80, 95, 99.6])));
		expect(status).toBe(422);
		expect(first.code).toBe('absorbance_too_high');
		expect(first.message).toMatch(/99\.6.*%T/);
		expect(first.line).toBe(10);
	});
	it('x outside 100 nm–100 µm after conversion is refused (422) naming the line', () => {
		const { status, first } = refusal(jdx('##XUNITS=nm\n##YUNITS=ABSORBANCE', table([1e-300, 300, 310, 320, 330, 340], ys)));
		expect(status).toBe(422);
		expect(first.line).toBe(6);
	});
	it('log ε of 400 would overflow ε: refused (422)', () => {
		const { status } = refusal(jdx('##XUNITS=nm\n##YUNITS=LOG EPSILON', table(xs, [1, 2, 400, 3, 2, 1])));
		expect(status).toBe(422);
	});
	it('concentration × path that underflows is refused (422 naming concentrationM), never an infinite ε', () => {
		const r = ok(jdx('##XUNITS=nm\n##YUNITS=ABSORBANCE', table(xs, ys)));
		const n = normaliseSpectrum(r.value[0], { concentrationM: 1e-300, pathCm: 1e-300 });
		expect(n.ok).toBe(false);
		if (!n.ok) expect(n.issues[0].code).toBe('invalid_concentration');
	});
});

describe('wavenumber → nm resampling', () => {
	it('the grid never starts or ends outside the data (awkward first/last values)', () => {
		for (const [first, last, step] of [[285.7142857142857, 2500, 0.1], [200.00000000001, 400.0000000001, 0.5], [0.30000000000000004, 0.9, 0.1], [1e7 / 35001, 1e7 / 9999, 0.2]]) {
			const { from, to } = gridInside(first, last, step);
			expect(from).toBeGreaterThanOrEqual(first);
			const n = Math.floor((to - from) / step + 1e-9) + 1;
			expect(from + (n - 1) * step).toBeLessThanOrEqual(last);
		}
	});
	it('emission per cm⁻¹ becomes per nm with the Jacobian 10⁷/λ² (a flat curve in ν̃ falls as 1/λ²)', () => {
		const nu = Array.from({ length: 51 }, (_, i) => 25000 + i * 500); // 200–400 nm
		const r = ok(jdx('##DATA TYPE=EMISSION SPECTRUM\n##XUNITS=1/CM\n##YUNITS=RELATIVE INTENSITY', table(nu, nu.map(() => 1))));
		const n = normaliseSpectrum(r.value[0]);
		if (!n.ok) throw new Error(JSON.stringify(n.issues));
		const at = (nm: number) => n.value.y[n.value.x.findIndex((v) => Math.abs(v - nm) < 1e-6)];
		// y_λ ∝ 1/λ² between grid samples that coincide with data points (ν̃ 25 000 and 50 000 cm⁻¹).
		expect(at(400) / at(200)).toBeCloseTo(0.25, 6);
	});
	it('absorbance on a wavenumber axis is not a density: no Jacobian', () => {
		const nu = Array.from({ length: 51 }, (_, i) => 25000 + i * 500);
		const r = ok(jdx('##XUNITS=1/CM\n##YUNITS=ABSORBANCE', table(nu, nu.map(() => 0.5))));
		const n = normaliseSpectrum(r.value[0]);
		if (!n.ok) throw new Error(JSON.stringify(n.issues));
		for (const v of n.value.y) expect(v).toBeCloseTo(0.5, 12);
	});
});
