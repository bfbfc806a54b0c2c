/**
 * Benchmark of the lamp × absorber matrix (GET /api/groups/:id/matrix) at 50 lamps × 500 absorbers (not a timed test).
 * Run: npm run bench:matrix
 *
 * Builds the case in memory on the 0.5 nm computation grid (invented Gaussian LEDs and absorption bands, a logistic
 * wall edge, a solvent cut-off edge model) and times src/lib/irradiation/absorberMatrix.ts (the ranking core, one call
 * per absorber). Baseline, measured in the same run, same thread, same clock: the direct per-cell trapezoid integral
 * of q·T·(A/A_tot)(1 − 10^−A_tot) over the whole grid. Both sides are wall-clock time (performance.now), single
 * thread, median of their runs; the two must agree before the ratio is printed. Last line: the ratio.
 */
import { photonFluxEinsteinPerS } from '../../src/lib/irradiation/constants';
import { computeAbsorberMatrix } from '../../src/lib/irradiation/absorberMatrix';
import { COMPUTATION_GRID, gridWavelengths } from '../../src/lib/irradiation/wavelengthGrid';
import { prng } from '../../src/lib/prng';

const LAMPS = Number(process.env.BENCH_LAMPS ?? 50);
const ABSORBERS = Number(process.env.BENCH_ABSORBERS ?? 500);
const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const n = grid.count;
const PATH_CM = 1, CONC_M = 0.01;

// Deterministic pseudo-random numbers (mulberry32) so every run builds the same case.
const rnd = prng(20261203);
const gauss = (p: number, f: number, h: number, out = new Float64Array(n)) => {
	for (let i = 0; i < n; i++) out[i] += h * Math.exp((-4 * Math.LN2 * (wl[i] - p) ** 2) / (f * f));
	return out;
};
const lamps = Array.from({ length: LAMPS }, (_, k) => {
	const peak = 255 + (k * 400) / LAMPS, fwhm = 10 + 30 * rnd(), powerW = 0.5 + 5 * rnd();
	const norm = (2 * Math.sqrt(Math.LN2 / Math.PI)) / fwhm;
	const q = new Float64Array(n);
	for (let i = 0; i < n; i++) q[i] = photonFluxEinsteinPerS(powerW * norm * Math.exp((-4 * Math.LN2 * (wl[i] - peak) ** 2) / (fwhm * fwhm)), wl[i]);
	return { id: `L${k}`, name: `${Math.round(peak)} nm LED`, photonFluxPerNm: q };
});
const absorbers = Array.from({ length: ABSORBERS }, (_, k) => {
	const eps = gauss(220 + 60 * rnd(), 20 + 20 * rnd(), 5000 + 20000 * rnd());
	gauss(280 + 300 * rnd(), 30 + 60 * rnd(), 500 + 15000 * rnd(), eps);
	return { id: `A${k}`, epsilon: eps };
});
const wall = Float64Array.from(wl, (x) => 0.92 / (1 + Math.exp(-(x - 295) / 6)));
const solvent = Float64Array.from(wl, (x) => 10 ** ((230 - x) / 10));

function baseline(): Float64Array {
	const out = new Float64Array(ABSORBERS * LAMPS);
	for (let a = 0; a < ABSORBERS; a++) {
		const eps = absorbers[a].epsilon;
		for (let l = 0; l < LAMPS; l++) {
			const q = lamps[l].photonFluxPerNm;
			let sum = 0;
			for (let i = 0; i < n; i++) {
				const aA = eps[i] * CONC_M * PATH_CM, aTot = aA + solvent[i] * PATH_CM;
				const f = aTot > 0 ? (aA / aTot) * (1 - Math.pow(10, -aTot)) : 0;
				sum += (i === 0 || i === n - 1 ? 0.5 : 1) * grid.stepNm * q[i] * wall[i] * f;
			}
			out[a * LAMPS + l] = sum;
		}
	}
	return out;
}
const matrix = () => computeAbsorberMatrix({ stepNm: grid.stepNm, pathCm: PATH_CM, concentrationM: CONC_M, solventAbsorbancePerCm: solvent, wallTransmission: wall, lamps, absorbers }).absorbedPhotonFluxEinsteinPerS;

function time<T>(fn: () => T, runs: number): { ms: number; value: T } {
	const times: number[] = [];
	let value!: T;
	for (let r = 0; r < runs; r++) {
		const t0 = performance.now();
		value = fn();
		times.push(performance.now() - t0);
	}
	times.sort((a, b) => a - b);
	return { ms: times[Math.floor(times.length / 2)], value };
}

matrix(); // warm-up (JIT)
const fast = time(matrix, 7);
const slow = time(baseline, 3);
let worst = 0;
for (let i = 0; i < fast.value.length; i++) {
	const lampFlux = lamps[i % LAMPS].photonFluxPerNm.reduce((s, v) => s + v, 0) * grid.stepNm;
	worst = Math.max(worst, Math.abs(fast.value[i] - slow.value[i]) / lampFlux);
}
if (worst > 1e-9) {
	console.error(`matrix and baseline disagree: worst difference ${worst.toExponential(2)} of a lamp's flux`);
	process.exit(1);
}
console.log(`lamp × absorber matrix, ${LAMPS} lamps × ${ABSORBERS} absorbers × ${n} grid points (wall-clock, one thread, median)`);
console.log(`  ranking core (absorberMatrix.ts): ${fast.ms.toFixed(1)} ms   (${((fast.ms * 1000) / (LAMPS * ABSORBERS)).toFixed(2)} µs per cell)`);
console.log(`  baseline, direct per-cell integral: ${slow.ms.toFixed(1)} ms   (agree within ${worst.toExponential(1)} of a lamp's flux)`);
console.log(`ratio matrix/baseline: ${(fast.ms / slow.ms).toFixed(3)}`);
