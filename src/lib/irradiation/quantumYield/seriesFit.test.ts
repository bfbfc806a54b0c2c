import { describe, expect, it } from 'vitest';
import { COMPUTATION_GRID, gridWavelengths } from '../wavelengthGrid';
import { rk45 } from '../reactions/testSolvers';
import { fitQuantumYieldSeries, timeFromLabel, type SeriesInput } from './seriesFit';
import { prng } from '../../prng';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const gauss = (mu: number, s: number, h: number) => wl.map((x) => h * Math.exp(-((x - mu) ** 2) / (2 * s * s)));
// Invented 365 nm LED, calibrated: 4.0e-8 einstein s⁻¹ entering the solution, Gaussian FWHM 12 nm.
const sigma = 12 / (2 * Math.sqrt(2 * Math.LN2));
const lamp = wl.map((x) => (4e-8 / (sigma * Math.sqrt(2 * Math.PI))) * Math.exp(-((x - 365) ** 2) / (2 * sigma * sigma)));
const eS = gauss(350, 30, 9000); // invented reactant
const eP = gauss(300, 25, 7000).map((v, i) => v + gauss(380, 25, 2500)[i]); // invented absorbing product
const l = 1, V = 0.003, c0 = 1.5e-4;

/** Seeded normal noise (mulberry32 + Box–Muller) so a failure replays. */
function noise(seed: number) {
	const u = prng(seed);
	return () => Math.sqrt(-2 * Math.log(u() + 1e-300)) * Math.cos(2 * Math.PI * u());
}

/**
 * Synthetic series: dc_S/dt = (−Φ·q_abs,S + Φ_b·q_abs,P)/V, q_abs,i = Σ q·w·(A_i/A)(1 − 10^−A) (Beer–Lambert inner
 * filter, IUPAC Glossary 2007) written out here and integrated with the test's own adaptive Dormand–Prince RK45.
 */
function series(phi: number, opts: { product?: boolean; phiB?: number; relNoise?: number; seed?: number } = {}) {
	const pe = opts.product ? eP : new Float64Array(grid.count);
	const phiB = opts.phiB ?? 0;
	const rhs = (cS: number) => {
		let s = 0, p = 0;
		for (let i = 0; i < grid.count; i++) {
			if (!(lamp[i] > 1e-14)) continue;
			const w = lamp[i] * grid.stepNm;
			const aS = eS[i] * cS * l, aP = pe[i] * (c0 - cS) * l;
			const a = aS + aP;
			const f = a > 0 ? (1 - 10 ** -a) / a : Math.LN10;
			s += w * aS * f;
			p += w * aP * f;
		}
		return (-phi * s + phiB * p) / V;
	};
	// about three initial-rate lifetimes
	const tEnd = 3 * Math.abs(c0 / rhs(c0));
	const times = Array.from({ length: 16 }, (_, k) => (k * tEnd) / 15);
	const cs: number[] = [];
	let y = [c0], t = 0;
	for (const tk of times) {
		if (tk > t) y = rk45((_, yy) => [rhs(yy[0])], y, t, tk, 1e-12).y;
		t = tk;
		cs.push(y[0]);
	}
	const rnd = noise(opts.seed ?? 7);
	const spectra = cs.map((c) =>
		wl.map((x, i) => {
			if (x < 250 || x > 600) return NaN; // the spectrometer's range
			const a = l * (eS[i] * c + pe[i] * (c0 - c));
			return a + (opts.relNoise ? opts.relNoise * a * rnd() : 0);
		})
	);
	return { times, cs, spectra };
}

const inputOf = (s: ReturnType<typeof series>, extra: Partial<SeriesInput> = {}): SeriesInput => ({
	grid, spectra: s.spectra, timesS: s.times, reactantEpsilon: eS, pathCm: l, volumeL: V, photonFluxInSolutionPerNm: lamp, ...extra
});

describe('Φ from an irradiation series (synthetic series from an independent RK45 integration)', () => {
	it.each([0.05, 0.3, 1.0])('recovers Φ = %f within 2 %, with a transparent product', (phi) => {
		const r = fitQuantumYieldSeries(inputOf(series(phi)));
		if (!r.ok) throw new Error(JSON.stringify(r.issues));
		console.log(`[recovered] direct, transparent product: true ${phi}, fit ${r.value.quantumYield.toPrecision(5)}, integral ${r.value.integralQuantumYield?.toPrecision(5)}, initial rate ${r.value.initialRateQuantumYield?.toPrecision(5)}`);
		expect(Math.abs(r.value.quantumYield / phi - 1)).toBeLessThan(0.02);
		expect(Math.abs(r.value.integralQuantumYield! / phi - 1)).toBeLessThan(0.02);
		expect(Math.abs(r.value.initialRateQuantumYield! / phi - 1)).toBeLessThan(0.1);
		expect(r.value.residuals).toHaveLength(16);
	});

	it.each([0.05, 0.3, 1.0])('recovers Φ = %f within 2 % with an absorbing product (inner filter by the product)', (phi) => {
		const s = series(phi, { product: true });
		const r = fitQuantumYieldSeries(inputOf(s, { productEpsilon: eP }));
		if (!r.ok) throw new Error(JSON.stringify(r.issues));
		console.log(`[recovered] direct, absorbing product: true ${phi}, fit ${r.value.quantumYield.toPrecision(5)}, initial rate ${r.value.initialRateQuantumYield?.toPrecision(5)}`);
		expect(Math.abs(r.value.quantumYield / phi - 1)).toBeLessThan(0.02);
		// photons absorbed: ∫q_abs,S dt = n converted/Φ (rate = Φ·q_abs), trapezoid over 16 moments
		expect((r.value.photonsAbsorbedEinstein * phi) / ((s.cs[0] - s.cs[15]) * V)).toBeCloseTo(1, 1);
	});

	it('with 1 % noise on A the standard error covers the true Φ', () => {
		let covered = 0;
		for (const seed of [1, 2, 3, 4, 5, 6]) {
			const r = fitQuantumYieldSeries(inputOf(series(0.3, { product: true, relNoise: 0.01, seed }), { productEpsilon: eP }));
			if (!r.ok) throw new Error(JSON.stringify(r.issues));
			console.log(`[recovered] 1 % noise seed ${seed}: ${r.value.quantumYield.toPrecision(4)} ± ${r.value.standardError.toPrecision(2)}`);
			expect(r.value.standardError).toBeGreaterThan(0);
			if (Math.abs(r.value.quantumYield - 0.3) <= 2 * r.value.standardError) covered++;
		}
		expect(covered).toBeGreaterThanOrEqual(5); // ~95 % coverage at 2 SE
	});

	it('the calibration uncertainty adds in quadrature', () => {
		const r = fitQuantumYieldSeries(inputOf(series(0.3), { calibrationRelativeUncertainty: 0.05 }));
		if (!r.ok) throw new Error('issues');
		expect(r.value.standardError).toBeCloseTo(Math.hypot(r.value.standardErrorFit, 0.05 * r.value.quantumYield), 12);
	});

	it('a reversible pair recovers both Φ', () => {
		const s = series(0.25, { product: true, phiB: 0.5 });
		const r = fitQuantumYieldSeries(inputOf(s, { productEpsilon: eP, reaction: 'reversible' }));
		if (!r.ok) throw new Error(JSON.stringify(r.issues));
		console.log(`[recovered] reversible: true 0.25/0.5, fit ${r.value.quantumYield.toPrecision(5)} / ${r.value.quantumYieldBack?.toPrecision(5)}`);
		expect(Math.abs(r.value.quantumYield / 0.25 - 1)).toBeLessThan(0.02);
		expect(Math.abs(r.value.quantumYieldBack! / 0.5 - 1)).toBeLessThan(0.02);
	});

	it('refuses bad series naming the field', () => {
		const s = series(0.3);
		const bad = (x: Partial<SeriesInput>) => {
			const r = fitQuantumYieldSeries(inputOf(s, x));
			return r.ok ? null : r.issues[0].field;
		};
		expect(bad({ timesS: [0, 10, 5, ...s.times.slice(3)] })).toBe('timesS[2]');
		expect(bad({ spectra: s.spectra.slice(0, 2), timesS: s.times.slice(0, 2) })).toBe('spectrumIds');
		const dark = lamp.map((_, i) => (wl[i] > 650 && wl[i] < 660 ? 1e-9 : 0));
		expect(bad({ photonFluxInSolutionPerNm: dark })).toBe('reactant.spectrumId');
		const apart = s.spectra.map((a, k) => (k === 1 ? a.map((v, i) => (wl[i] < 700 ? NaN : v)) : a));
		expect(bad({ spectra: apart })).toBe('spectrumIds');
	});
});

describe('times from labels', () => {
	it.each([
		['t = 30 s', 30], ['kinetics 120 s', 120], ['2 min', 120], ['t=45', 45], ['scan (1.5 h)', 5400], ['sample 3', null], ['Abs', null]
	])('%s → %s', (label, t) => expect(timeFromLabel(label as string)).toBe(t));
});
