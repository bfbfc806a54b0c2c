import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cautionsForSpectrum, powerInRangeW } from '../cautions';
import { HCNA_J_NM_PER_MOL } from '../constants';
import { CAUTION_GRID, lampSpectrum, totalPhotonFluxEinsteinPerS } from '../lamps';
import { emissionQuantityOf, estimateFloor, measuredEmissionShape } from './measuredEmission';

const EXTERNAL = resolve(__dirname, '../../../../../../shared/external');

/** The array-spectrometer export: 16 header lines, a marker, then tab-separated comma-decimal pairs. */
function readLed405() {
	// ../shared/external/emission/led-405nm-spectrometer-raw-counts.txt (aphalo/photobiologyLEDs, GPL ≥ 2; MANIFEST.md)
	const text = readFileSync(resolve(EXTERNAL, 'emission/led-405nm-spectrometer-raw-counts.txt'), 'utf8');
	const body = text.split(/\r?\n/).slice(text.split(/\r?\n/).findIndex((l) => l.includes('Begin Processed Spectral Data')) + 1);
	const x: number[] = [];
	const y: number[] = [];
	for (const line of body) {
		const [a, b] = line.split('\t');
		if (!b) continue;
		x.push(Number(a.replace(',', '.')));
		y.push(Number(b.replace(',', '.')));
	}
	return { x, y };
}

describe('emission units', () => {
	it('photon units and counts are photon spectra; W and relative are power spectra (API.md yUnit list)', () => {
		for (const u of ['umol/s/nm', 'umol/m2/s/nm', 'counts']) expect(emissionQuantityOf(u)).toBe('photon');
		for (const u of ['W/nm', 'W/m2/nm', 'relative']) expect(emissionQuantityOf(u)).toBe('power');
	});

	it('a flat photon spectrum 300–800 nm gives 4.2614 µmol s⁻¹ per W and equal photons at 400 and 700 nm', () => {
		// q/P = Δλ/(hcN_A·ln(800/300)) = 500/(1.19626566e8 J nm mol⁻¹ × 0.980829) = 4.2614e-6 mol s⁻¹ W⁻¹ (CODATA 2018, by hand)
		const x = Array.from({ length: 501 }, (_, i) => 300 + i);
		const shape = measuredEmissionShape({ x, y: x.map(() => 3.2), xUnit: 'nm', yUnit: 'umol/s/nm' });
		const s = lampSpectrum({ type: 'measured', wavelengthNm: shape.wavelengthNm, power: shape.power }, 1);
		expect(Math.abs(totalPhotonFluxEinsteinPerS(s) / 4.2614e-6 - 1)).toBeLessThan(2e-4);
		const q = (nm: number) => (s.powerWPerNm[(nm - 190) * 2] * nm) / HCNA_J_NM_PER_MOL;
		expect(q(700) / q(400)).toBeCloseTo(1, 6); // not 1.75 (= 700/400, what weighting by λ again would give)
		expect(shape.warnings).toEqual([]);
	});

	it('cm⁻¹ axis: the Jacobian 10⁷/λ² makes a flat-per-cm⁻¹ power spectrum fall as λ⁻² per nm', () => {
		// per-nm density = per-cm⁻¹ density × |dν̃/dλ| = × 10⁷/λ² (change of variables, common practice)
		const nu = Array.from({ length: 201 }, (_, i) => 12500 + i * 62.5); // 12 500–25 000 cm⁻¹ = 400–800 nm
		const shape = measuredEmissionShape({ x: nu, y: nu.map(() => 1), xUnit: 'cm-1', yUnit: 'W/nm' });
		const at = (nm: number) => shape.power[shape.wavelengthNm.findIndex((w) => Math.abs(w - nm) < 1e-6)];
		expect(at(400) / at(800)).toBeCloseTo(4, 9);
	});

	it('eV axis: the Jacobian hc/λ² (hc = 1239.84 eV nm, CODATA 2018)', () => {
		const e = [1.55, 2.0, 2.5, 3.0, 3.1];
		const shape = measuredEmissionShape({ x: e, y: e.map(() => 1), xUnit: 'eV', yUnit: 'relative' });
		const first = shape.wavelengthNm[0];
		expect(shape.power[0]).toBeCloseTo(1239.841984 / first ** 2, 9);
	});
});

describe('dark floor of raw counts', () => {
	const led = readLed405();

	it('the 405 nm LED file: floor removed by default, ≥ 95 % of the power in 380–440 nm, no UV-C or ozone caution', () => {
		// MANIFEST.md: peak 61870 counts at 408.32 nm, median baseline 4525 counts; only the peak is radiometrically meaningful.
		const shape = measuredEmissionShape({ x: led.x, y: led.y, xUnit: 'nm', yUnit: 'counts' });
		expect(shape.floor.removed).toBe(true);
		expect(Math.abs(shape.floor.level / 4525 - 1)).toBeLessThan(0.03);
		const s = lampSpectrum({ type: 'measured', wavelengthNm: shape.wavelengthNm, power: shape.power }, 1.6, CAUTION_GRID);
		expect(powerInRangeW(s, 380, 440) / powerInRangeW(s, 0, Infinity)).toBeGreaterThanOrEqual(0.95);
		const codes = cautionsForSpectrum(s, { lampType: 'measured' }).map((c) => c.code);
		expect(codes).not.toContain('uv-c');
		expect(codes).not.toContain('ozone');
		expect(codes).toContain('blue-light'); // 1.6 W, almost all in 400–500 nm (IEC 62471 blue-light hazard band)
	});

	it('kept on request: the floor then counts as light (the false UV-C the removal avoids), with a warning', () => {
		const shape = measuredEmissionShape({ x: led.x, y: led.y, xUnit: 'nm', yUnit: 'counts', floor: 'keep' });
		expect(shape.floor.removed).toBe(false);
		expect(shape.warnings.join(' ')).toMatch(/floor/);
		const s = lampSpectrum({ type: 'measured', wavelengthNm: shape.wavelengthNm, power: shape.power }, 1, CAUTION_GRID);
		expect(powerInRangeW(s, 380, 440) / powerInRangeW(s, 0, Infinity)).toBeLessThan(0.8);
	});

	it('a clean curve on a zero baseline gets no floor warning', () => {
		// ../shared/external/emission/uva-blacklight-350nm-tube-digitised.csv (aphalo/photobiologyLamps, GPL ≥ 2): starts and ends at 0
		const text = readFileSync(resolve(EXTERNAL, 'emission/uva-blacklight-350nm-tube-digitised.csv'), 'utf8').split(/\r?\n/).slice(1).filter(Boolean);
		const pts = text.map((l) => l.split(';').map((v) => Number(v.replace(',', '.'))));
		const shape = measuredEmissionShape({ x: pts.map((p) => p[0]), y: pts.map((p) => p[1]), xUnit: 'nm', yUnit: 'relative' });
		expect(shape.warnings).toEqual([]);
		expect(shape.floor.removed).toBe(false);
		// and a synthetic Gaussian with exact zeros either side, as raw counts
		const x = Array.from({ length: 400 }, (_, i) => 300 + i);
		const g = measuredEmissionShape({ x, y: x.map((w) => 1000 * Math.exp(-(((w - 450) / 10) ** 2))), xUnit: 'nm', yUnit: 'counts' });
		expect(g.warnings).toEqual([]);
		expect(g.floor.level).toBe(0);
	});

	it('the floor estimate is robust: median of the points left after 3σ clipping', () => {
		const y = [...Array.from({ length: 90 }, (_, i) => 100 + (i % 5)), ...Array.from({ length: 10 }, () => 5000)];
		expect(estimateFloor(y).level).toBe(102);
	});
});
