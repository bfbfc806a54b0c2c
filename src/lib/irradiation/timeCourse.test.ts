import { describe, expect, it } from 'vitest';
import { conversionAfter, initialRateTimeS, prepareKinetics, simulateTimeCourse, timeToConversionS, type KineticsInput } from './timeCourse';
import { COMPUTATION_GRID, gridWavelengths, trapezoidUniform } from './wavelengthGrid';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const lamp = wl.map((x) => 1e-8 * Math.exp((-4 * Math.LN2 * (x - 365) ** 2) / 100)); // invented 365 nm LED, FWHM 10 nm
const flat = (v: number) => new Float64Array(grid.count).fill(v);

const base = (epsS: number, c0: number, extra: Partial<KineticsInput> = {}): KineticsInput => ({
	stepNm: grid.stepNm,
	photonFluxInMixturePerNm: lamp,
	pathCm: 1,
	volumeL: 0.01,
	substrateEpsilon: flat(epsS),
	substrateConcentrationM: c0,
	quantumYield: 0.5,
	...extra
});

/**
 * Closed form for a transparent product and flat ε: dn/dt = −Φq(1 − 10^(−A₀n/n₀)). With k = A₀ ln10/n₀,
 * ∫dn/(1 − e^(−kn)) = ln(e^(kn) − 1)/k, so t(X) = [ln(e^(kn₀) − 1) − ln(e^(kn₀(1−X)) − 1)]/(Φqk)
 * (Beer–Lambert + rate = Φ·q_abs, IUPAC Glossary 2007; elementary integration).
 */
function closedFormTime(a0: number, n0: number, phi: number, q: number, x: number) {
	const k = (a0 * Math.LN10) / n0;
	return (Math.log(Math.expm1(k * n0)) - Math.log(Math.expm1(k * n0 * (1 - x)))) / (phi * q * k);
}

describe('time course', () => {
	it('matches the closed form for a transparent product (1e-5 relative at 50/90/99 %)', () => {
		const input = base(500, 0.002); // A₀ = 1 over 1 cm
		const tc = simulateTimeCourse(prepareKinetics(input));
		const q = trapezoidUniform(lamp, grid.stepNm);
		const n0 = 0.002 * 0.01;
		for (const [x, t] of [[0.5, tc.timeTo50PctS], [0.9, tc.timeTo90PctS], [0.99, tc.timeTo99PctS]]) {
			expect(Math.abs(t / closedFormTime(1, n0, 0.5, q, x) - 1)).toBeLessThan(1e-5);
		}
		expect(tc.curve.timeS.length).toBe(tc.curve.conversion.length);
		expect(tc.curve.conversion[0]).toBe(0);
		expect(tc.curve.conversion[tc.curve.conversion.length - 1]).toBeCloseTo(0.99, 12);
	});
	it('with a transparent product, agrees with the initial-rate estimate within 1 % up to 10 % conversion', () => {
		// optically thick start (A₀ = 4): absorbed fraction stays ≥ 1 − 10^(−3.6) while X ≤ 10 % (Beer–Lambert)
		const k = prepareKinetics(base(2000, 0.002));
		for (const x of [0.01, 0.05, 0.1]) expect(Math.abs(timeToConversionS(k, x) / initialRateTimeS(k, x) - 1)).toBeLessThan(0.01);
	});
	it('with a product absorbing strongly at the lamp wavelength, is slower than the initial-rate estimate', () => {
		// inner filter by the product (PRODUCT.md): the product takes A_P/A_tot of the light as it builds up
		const transparent = simulateTimeCourse(prepareKinetics(base(2000, 0.002)));
		const absorbing = simulateTimeCourse(prepareKinetics(base(2000, 0.002, { productEpsilon: flat(20000) })));
		expect(absorbing.timeTo90PctS).toBeGreaterThan(1.5 * absorbing.initialRateTimeTo90PctS);
		expect(absorbing.timeTo90PctS).toBeGreaterThan(transparent.timeTo90PctS);
		expect(absorbing.initialRateTimeTo90PctS).toBeCloseTo(transparent.initialRateTimeTo90PctS, 6);
	});
	it('conversionAfter inverts the time course (1e-6)', () => {
		const k = prepareKinetics(base(800, 0.002, { productEpsilon: flat(300), productPerSubstrate: 2 }));
		const tc = simulateTimeCourse(k);
		expect(conversionAfter(k, tc.timeTo90PctS)).toBeCloseTo(0.9, 6);
	});
	it('never reaches conversion when the substrate does not absorb the lamp', () => {
		const tc = simulateTimeCourse(prepareKinetics(base(0, 0.002)));
		expect(tc.timeTo50PctS).toBe(Infinity);
	});
});
