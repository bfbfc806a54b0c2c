/**
 * Delimited files written outside this project (../shared/external/{csv,transmission,emission}).
 * Expected values: ../shared/external/MANIFEST.md (computed there by an independent script: maxima =
 * largest sample, crossings by linear interpolation, integrals by the trapezoid rule on the file's grid).
 * Tolerances: λ ±1 sampling step; %T as quoted (2 decimals → ±0.005 %T); integrals ±0.5 %.
 */
import { xyIntegration } from 'ml-spectra-processing';
import { describe, expect, it } from 'vitest';
import { deriveSpectrum } from '../derive';
import { findPeaks } from '../peaks';
import { norm, parseExternal, yAt } from '../__fixtures__/external';
import type { NormalisedSpectrum } from '../types';

const hasPeakNear = (s: NormalisedSpectrum, nm: number, tol: number) => findPeaks(s).some((p) => Math.abs(p.wavelengthNm - nm) <= tol);

describe('nanoparticle-growth-35-spectra-descending.csv (usnistgov/NanoUV-VIS example)', () => {
	const r = parseExternal('csv/nanoparticle-growth-35-spectra-descending.csv');
	it('551 rows × 35 absorbance spectra, column names kept as labels', () => {
		expect(r.value).toHaveLength(35);
		expect(r.value.every((s) => s.x.length === 551 && s.kind === 'absorption')).toBe(true);
		expect(r.value[0].label).toBe('4');
		expect(r.value[34].label).toBe('140');
	});
	it('column "4": max 0.1832 at 388 nm; column "140": max 0.2643 at 389 nm (MANIFEST, ±1 nm)', () => {
		const a = deriveSpectrum(norm(r.value[0]));
		expect(Math.abs(a.lambdaMaxNm! - 388)).toBeLessThanOrEqual(1);
		expect(a.valueAtMax!).toBeCloseTo(0.1832, 4);
		const b = deriveSpectrum(norm(r.value[34]));
		expect(Math.abs(b.lambdaMaxNm! - 389)).toBeLessThanOrEqual(1);
		expect(b.valueAtMax!).toBeCloseTo(0.2643, 4);
	});
});

describe('transmission sheets (aphalo/photobiologyFilters data-raw, %T)', () => {
	// [file, points, { λ: %T }, T10 crossing or null, T50 crossing] — all from MANIFEST.md
	const cases: [string, number, Record<number, number>, number | null, number][] = [
		['transmission/pmma-clear-sheet.csv', 911, { 300: 0.34, 365: 4.38, 405: 91.7, 550: 92.99 }, 369.0, 379.3],
		['transmission/pmma-uv-blocking-sheet.csv', 621, { 365: 0.12, 405: 90.18 }, null, 388.6],
		['transmission/polycarbonate-sheet.csv', 911, { 365: 0.04, 405: 70.87, 550: 87.24 }, null, 399.3],
		['transmission/glass-petri-dish.csv', 911, { 300: 9.01, 365: 89.21, 550: 91.25 }, null, 318.1]
	];
	it.each(cases)('%s: %i points, %T values and cut-offs', (file, n, values, t10, t50) => {
		const r = parseExternal(file);
		expect(r.value).toHaveLength(1); // the standard-deviation column is skipped
		expect(r.warnings.some((w) => w.code === 'column_skipped')).toBe(true);
		const raw = r.value[0];
		expect(raw.kind).toBe('transmission');
		expect(raw.yUnit).toBe('transmittance-percent');
		const s = norm(raw);
		expect(s.x.length).toBe(n);
		for (const [nm, pct] of Object.entries(values)) expect(Math.abs(yAt(s, Number(nm)) * 100 - pct)).toBeLessThanOrEqual(0.005 + 1e-9);
		const d = deriveSpectrum(s);
		if (t10 !== null) expect(Math.abs(d.cutoff10Nm! - t10)).toBeLessThanOrEqual(1);
		expect(Math.abs(d.cutoff50Nm! - t50)).toBeLessThanOrEqual(1);
		expect(d.lambdaMaxNm).toBeNull();
	});
});

describe('emission files (aphalo/photobiologyLEDs, photobiologyLamps; pvlib ASTM G173; CIE)', () => {
	it('led-405nm-spectrometer-raw-counts.txt: marker line, tab + decimal comma, 2068 pixels, peak 61870 counts at 408.32 nm', () => {
		const r = parseExternal('emission/led-405nm-spectrometer-raw-counts.txt');
		const raw = r.value[0];
		expect(raw.kind).toBe('emission');
		expect(raw.yUnit).toBe('counts');
		expect(raw.x.length).toBe(2068);
		expect(raw.lines![0]).toBe(18); // 16 header lines + marker line, then data (1-based)
		const s = norm(raw);
		expect(s.yUnit).toBe('relative'); // counts kept as relative
		const d = deriveSpectrum(s);
		expect(d.lambdaMaxNm!).toBeCloseTo(408.32, 6);
		expect(Math.abs(d.valueAtMax! - 61870)).toBeLessThanOrEqual(0.5); // MANIFEST quotes whole counts
	});
	it('uva-blacklight-350nm-tube-digitised.csv: semicolon, decimal comma, E-notation; 59 points, peak 99.55 at 350.28 nm', () => {
		const r = parseExternal('emission/uva-blacklight-350nm-tube-digitised.csv', { kind: 'emission' });
		const s = norm(r.value[0]);
		expect(s.x.length).toBe(59);
		expect(s.x[0]).toBeCloseTo(293.61, 2);
		expect(s.x[58]).toBeCloseTo(445.06, 2);
		const d = deriveSpectrum(s);
		expect(d.lambdaMaxNm!).toBeCloseTo(350.28, 2);
		expect(d.valueAtMax!).toBeCloseTo(99.55, 2);
	});
	it('uva-340-fluorescent-tube-irradiance.csv: 561 points, maxima 313/344/365/435 nm, ∫280–400 = 12.78 W m⁻²', () => {
		const r = parseExternal('emission/uva-340-fluorescent-tube-irradiance.csv');
		const s = norm(r.value[0]);
		expect(s.yUnit).toBe('W/m2/nm');
		expect(s.x.length).toBe(561);
		for (const nm of [313, 344, 365, 435]) expect(hasPeakNear(s, nm, 1)).toBe(true);
		expect(yAt(s, 344)).toBeCloseTo(0.2402, 4);
		const d = deriveSpectrum(s);
		expect(d.lambdaMaxNm).toBe(435);
		expect(d.valueAtMax!).toBeCloseTo(0.4086, 4);
		expect(xyIntegration(s, { from: 280, to: 400 })).toBeCloseTo(12.78, 1);
	});
	it('uvb-313-fluorescent-tube-irradiance.csv: 561 points (trailing "--" lines ignored), 313 nm band, global max 435 nm', () => {
		const r = parseExternal('emission/uvb-313-fluorescent-tube-irradiance.csv');
		expect(r.warnings.some((w) => w.code === 'trailing_lines_ignored')).toBe(true);
		const s = norm(r.value[0]);
		expect(s.x.length).toBe(561);
		expect(hasPeakNear(s, 313, 1)).toBe(true);
		expect(yAt(s, 313)).toBeCloseTo(0.2376, 4);
		const d = deriveSpectrum(s);
		expect(d.lambdaMaxNm).toBe(435);
		expect(d.valueAtMax!).toBeCloseTo(0.3899, 4);
		expect(xyIntegration(s, { from: 280, to: 400 })).toBeCloseTo(7.02, 1);
	});
	it('solar-astm-g173-am15.csv: global (third column) ∫280–4000 = 1000.4 W m⁻² ±0.5 %, 365 nm 0.62359, max 1.6485 at 495 nm', () => {
		const r = parseExternal('emission/solar-astm-g173-am15.csv');
		expect(r.value.map((s) => s.label)).toEqual(['extraterrestrial', 'global', 'direct']);
		const g = r.value.find((s) => s.column === 2)!;
		expect(g.label).toBe('global');
		expect(g.kind).toBe('emission');
		const s = norm(g);
		expect(s.x.length).toBe(2002);
		expect(Math.abs(xyIntegration(s, { from: 280, to: 4000 }) / 1000.4 - 1)).toBeLessThanOrEqual(0.005);
		expect(Math.abs(xyIntegration(norm(r.value[2]), { from: 280, to: 4000 }) / 900.1 - 1)).toBeLessThanOrEqual(0.005);
		expect(Math.abs(xyIntegration(norm(r.value[0]), { from: 280, to: 4000 }) / 1347.9 - 1)).toBeLessThanOrEqual(0.005);
		expect(yAt(s, 365)).toBeCloseTo(0.62359, 5);
		const d = deriveSpectrum(s);
		expect(d.lambdaMaxNm).toBe(495);
		expect(d.valueAtMax!).toBeCloseTo(1.6485, 4);
	});
	it('columns option picks only the global column of the solar file', () => {
		const r = parseExternal('emission/solar-astm-g173-am15.csv', { columns: [2] });
		expect(r.value).toHaveLength(1);
		expect(r.value[0].label).toBe('global');
	});
	it('cie-illuminant-d65.csv: 531 rows, S(560) = 100, max 117.812 at 460 nm, S(300) = 0.0341', () => {
		const s = norm(parseExternal('emission/cie-illuminant-d65.csv').value[0]);
		expect(s.x.length).toBe(531);
		expect(yAt(s, 560)).toBeCloseTo(100, 6);
		expect(yAt(s, 300)).toBeCloseTo(0.0341, 6);
		const d = deriveSpectrum(s);
		expect(d.lambdaMaxNm).toBe(460);
		expect(d.valueAtMax!).toBeCloseTo(117.812, 3);
	});
	it('cie-illuminant-a.csv: 531 rows, S(560) = 100, monotonic, S(830) = 261.602', () => {
		const s = norm(parseExternal('emission/cie-illuminant-a.csv').value[0]);
		expect(s.kind).toBe('emission');
		expect(s.x.length).toBe(531);
		expect(yAt(s, 560)).toBeCloseTo(100, 6);
		expect(yAt(s, 830)).toBeCloseTo(261.602, 6);
		for (let i = 1; i < s.y.length; i++) expect(s.y[i]).toBeGreaterThan(s.y[i - 1]);
	});
	it('cie-led-illuminants.csv: 401 rows × 9 columns, maxima by column position (MANIFEST)', () => {
		const r = parseExternal('emission/cie-led-illuminants.csv');
		expect(r.value).toHaveLength(9);
		const col = (c: number) => norm(r.value.find((s) => s.column === c)!);
		expect(col(1).x.length).toBe(401);
		const d1 = deriveSpectrum(col(1));
		expect(d1.lambdaMaxNm).toBe(607);
		expect(d1.valueAtMax!).toBeCloseTo(21.015, 3);
		expect(hasPeakNear(col(1), 452, 1)).toBe(true);
		expect(yAt(col(1), 452)).toBeCloseTo(7.974, 3);
		expect(deriveSpectrum(col(3), { range: { toNm: 500 } }).lambdaMaxNm).toBe(448);
		expect(yAt(col(3), 448)).toBeCloseTo(19.183, 3);
		expect(deriveSpectrum(col(5), { range: { toNm: 500 } }).lambdaMaxNm).toBe(452);
		expect(yAt(col(5), 452)).toBeCloseTo(33.016, 3);
		expect(deriveSpectrum(col(7)).lambdaMaxNm).toBe(636);
		expect(deriveSpectrum(col(7)).valueAtMax!).toBeCloseTo(62.838, 3);
		expect(hasPeakNear(col(7), 518, 1)).toBe(true);
		for (const c of [8, 9]) expect(hasPeakNear(col(c), 413, 1)).toBe(true);
	});
});
