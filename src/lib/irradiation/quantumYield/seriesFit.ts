/**
 * Quantum yield from an irradiation series: absorbance spectra taken during irradiation (in the irradiated cell, path l),
 * the reactant's (and optionally the product's) ε spectrum, and the photon flux entering the solution.
 *
 * 1. Concentrations per spectrum by linear least squares over a wavelength range (Beer–Lambert, A = l·Σ ε_j·c_j),
 *    using only points with 0 < A ≤ 2 (photometric range; stray light bends higher absorbances — common practice).
 * 2. Photons absorbed by the reactant at each moment from the measured mixture:
 *    q_abs,S = ∫ q_in·(A_S/A_tot)·(1 − 10^(−A_tot)) dλ with A_S = ε_S·c_S·l and A_tot the measured absorbance
 *    (IUPAC Glossary of Terms Used in Photochemistry, 3rd ed., Pure Appl. Chem. 79, 293 (2007)); outside the measured
 *    range A_tot is the model mixture.
 * 3. Φ by fitting the reaction model (reactions/reversible.ts: S → P with Φ, and P → S with Φ_back when the product
 *    photoreacts; the product's absorption and the constant rest of the first spectrum filter the light) to the
 *    whole series: Levenberg–Marquardt (ml-levenberg-marquardt) on ln Φ, residuals of c_S(t). Standard error from the
 *    fit, s²·(JᵀJ)⁻¹ with s² = SSR/(n − p) (e.g. Bates & Watts, Nonlinear Regression Analysis, 1988), combined with
 *    the relative uncertainty of the flux calibration (Φ ∝ 1/q, so it adds in quadrature).
 * Beside it: the initial-rate estimate Φ₀ = −(dn_S/dt)₀/q_abs,S(0) from a straight line through the first points,
 * and the integral estimate Φ = Σ Δn·N/Σ N² with N(t) = ∫₀ᵗ q_abs,S dt (trapezoid over the measured moments).
 */
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { absorbedFractionPerAbsorbance } from '../innerFilter';
import { prepareReversible, type PreparedReversible } from '../reactions/reversible';
import type { NumberArray, WavelengthGrid } from '../wavelengthGrid';

export interface SeriesInput {
	grid: WavelengthGrid;
	/** Absorbance spectra on the grid in time order (NaN where not measured). */
	spectra: NumberArray[];
	timesS: number[];
	reactantEpsilon: NumberArray;
	productEpsilon?: NumberArray;
	/** Path of the irradiated cell, in which the spectra were read, cm. */
	pathCm: number;
	volumeL: number;
	/** Photon flux per nm entering the solution (lamp × wall, calibrated), einstein s⁻¹ nm⁻¹. */
	photonFluxInSolutionPerNm: NumberArray;
	fromNm?: number;
	toNm?: number;
	reaction?: 'direct' | 'reversible';
	/** Relative standard uncertainty of the photon flux (e.g. 0.05). */
	calibrationRelativeUncertainty?: number;
}

export interface SeriesIssue {
	field: string;
	code: 'invalid' | 'physically-invalid';
	message: string;
}

export interface SeriesPoint {
	timeS: number;
	reactantM: number;
	productM: number | null;
	modelReactantM: number;
	modelProductM: number;
	residualM: number;
	/** Photon flux absorbed by the reactant at this moment (measured mixture), einstein s⁻¹. */
	absorbedByReactantEinsteinPerS: number;
	/** rms of the absorbance residual of the concentration fit over the range. */
	absorbanceRms: number;
}

export interface SeriesResult {
	quantumYield: number;
	standardError: number;
	standardErrorFit: number;
	initialRateQuantumYield: number | null;
	integralQuantumYield: number | null;
	quantumYieldBack?: number;
	standardErrorBack?: number;
	residuals: SeriesPoint[];
	/** ∫ q_abs,S dt over the series (measured mixture), einstein. */
	photonsAbsorbedEinstein: number;
	range: { fromNm: number; toNm: number; points: number };
	conversion: number;
	warnings: string[];
}

export type SeriesOutcome = { ok: true; value: SeriesResult } | { ok: false; issues: SeriesIssue[] };

/** Checks that need no physics: the order of the times, counts, grids. */
export function seriesIssues(input: SeriesInput): SeriesIssue[] {
	const out: SeriesIssue[] = [];
	const n = input.spectra.length;
	if (n < 3) out.push({ field: 'spectrumIds', code: 'invalid', message: `spectrumIds: a series needs at least 3 spectra; got ${n}` });
	if (input.timesS.length !== n) out.push({ field: 'timesS', code: 'invalid', message: `timesS has ${input.timesS.length} entries for ${n} spectra` });
	for (let k = 0; k < input.timesS.length; k++) {
		const t = input.timesS[k];
		if (!Number.isFinite(t) || t < 0) out.push({ field: `timesS[${k}]`, code: 'invalid', message: `timesS[${k}] must be a time ≥ 0 s` });
		else if (k > 0 && !(t > input.timesS[k - 1])) out.push({ field: `timesS[${k}]`, code: 'invalid', message: `timesS must increase: timesS[${k}] = ${t} s follows ${input.timesS[k - 1]} s` });
	}
	if (!(input.pathCm > 0)) out.push({ field: 'pathCm', code: 'physically-invalid', message: 'pathCm must be above 0' });
	if (!(input.volumeL > 0)) out.push({ field: 'volumeL', code: 'physically-invalid', message: 'volumeL must be above 0' });
	if (input.fromNm !== undefined && input.toNm !== undefined && !(input.toNm > input.fromNm)) out.push({ field: 'toNm', code: 'invalid', message: 'toNm must be above fromNm' });
	const u = input.calibrationRelativeUncertainty;
	if (u !== undefined && !(u >= 0 && u < 1)) out.push({ field: 'calibrationRelativeUncertainty', code: 'invalid', message: 'calibrationRelativeUncertainty is a fraction between 0 and 1' });
	return out;
}

/** Least-squares concentrations of reactant (and product) in one spectrum over the chosen points. */
function concentrations(a: NumberArray, idx: number[], eS: NumberArray, eP: NumberArray | undefined, l: number) {
	let sss = 0, ssp = 0, spp = 0, sas = 0, sap = 0, m = 0;
	for (const i of idx) {
		const y = a[i];
		if (!(Number.isFinite(y) && y > 0 && y <= 2)) continue;
		const xs = eS[i] * l, xp = eP ? eP[i] * l : 0;
		sss += xs * xs; ssp += xs * xp; spp += xp * xp; sas += y * xs; sap += y * xp; m++;
	}
	let cS: number, cP: number | null = null;
	if (eP) {
		const det = sss * spp - ssp * ssp;
		if (!(Math.abs(det) > 1e-12 * sss * spp)) return null;
		cS = (sas * spp - sap * ssp) / det;
		cP = (sss * sap - ssp * sas) / det;
	} else {
		if (!(sss > 0)) return null;
		cS = sas / sss;
	}
	let rss = 0;
	for (const i of idx) {
		const y = a[i];
		if (!(Number.isFinite(y) && y > 0 && y <= 2)) continue;
		const r = y - l * (eS[i] * cS + (eP && cP !== null ? eP[i] * cP : 0));
		rss += r * r;
	}
	return { cS, cP, points: m, rms: m ? Math.sqrt(rss / m) : 0 };
}

export { timeFromLabel } from './timeLabel';

/** Fit Φ (and Φ_back) to the series. */
export function fitQuantumYieldSeries(input: SeriesInput): SeriesOutcome {
	const issues = seriesIssues(input);
	if (issues.length) return { ok: false, issues };
	const { grid, spectra, timesS, reactantEpsilon: eS, productEpsilon: eP, pathCm: l, volumeL: V } = input;
	const n = grid.count;
	const warnings: string[] = [];
	// common measured range of the series
	let lo = 0, hi = n - 1;
	for (const a of spectra) {
		let first = -1, last = -1;
		for (let i = 0; i < n; i++) if (Number.isFinite(a[i])) { if (first < 0) first = i; last = i; }
		if (first < 0) return { ok: false, issues: [{ field: 'spectrumIds', code: 'physically-invalid', message: 'a spectrum of the series has no points on the grid' }] };
		lo = Math.max(lo, first);
		hi = Math.min(hi, last);
	}
	if (!(hi > lo)) return { ok: false, issues: [{ field: 'spectrumIds', code: 'physically-invalid', message: 'the spectra of the series do not overlap in wavelength' }] };
	let eMax = 0;
	for (let i = lo; i <= hi; i++) eMax = Math.max(eMax, eS[i]);
	const from = input.fromNm !== undefined ? Math.max(lo, Math.ceil((input.fromNm - grid.fromNm) / grid.stepNm)) : lo;
	const to = input.toNm !== undefined ? Math.min(hi, Math.floor((input.toNm - grid.fromNm) / grid.stepNm)) : hi;
	const idx: number[] = [];
	for (let i = from; i <= to; i++) if (eS[i] >= 0.05 * eMax || (eP && eP[i] > 0 && eS[i] > 0)) idx.push(i);
	if (idx.length < 3 || !(eMax > 0)) return { ok: false, issues: [{ field: 'fromNm', code: 'physically-invalid', message: 'the reactant does not absorb in the chosen wavelength range of the series' }] };
	const conc = spectra.map((a) => concentrations(a, idx, eS, eP, l));
	const bad = conc.findIndex((c) => c === null || c.points < 2);
	if (bad >= 0) return { ok: false, issues: [{ field: `spectrumIds[${bad}]`, code: 'physically-invalid', message: `spectrumIds[${bad}]: no usable absorbance (0 < A ≤ 2) in the range, or reactant and product spectra cannot be told apart there` }] };
	const cs = conc.map((c) => c!.cS), cp = conc.map((c) => c!.cP);
	const cTot = cs[0] + (cp[0] ?? 0);
	if (!(cs[0] > 0)) return { ok: false, issues: [{ field: 'spectrumIds[0]', code: 'physically-invalid', message: 'the first spectrum shows no reactant' }] };
	// constant rest (impurities, baseline) from the first spectrum, over its measured range
	// (measured − model), averaged over ±10 nm so that noise does not count as an absorber, and kept only where it
	// stands out of the noise (3 standard errors of that average)
	const raw = new Float64Array(n);
	for (let i = lo; i <= hi; i++) {
		const a = spectra[0][i];
		raw[i] = Number.isFinite(a) ? Math.min(3, a) - l * (eS[i] * cs[0] + (eP ? eP[i] * (cp[0] ?? 0) : 0)) : 0;
	}
	const half = Math.max(1, Math.round(10 / grid.stepNm));
	const floor = (3 * conc[0]!.rms) / Math.sqrt(2 * half + 1);
	const rest = new Float64Array(n);
	for (let i = lo; i <= hi; i++) {
		let s = 0, c = 0;
		for (let j = Math.max(lo, i - half); j <= Math.min(hi, i + half); j++) { s += raw[j]; c++; }
		const v = s / c;
		rest[i] = v > floor ? v : 0;
	}
	// absorbed photon flux by the reactant at each moment from the measured mixture
	const q = input.photonFluxInSolutionPerNm;
	const qAbs = spectra.map((a, k) => {
		let s = 0;
		for (let i = 0; i < n; i++) {
			if (!(q[i] > 0) || !(eS[i] > 0)) continue;
			const w = q[i] * (i === 0 || i === n - 1 ? 0.5 : 1) * grid.stepNm;
			const aS = eS[i] * Math.max(0, cs[k]) * l;
			const model = aS + (eP ? eP[i] * Math.max(0, cp[k] ?? cTot - cs[k]) * l : 0) + rest[i];
			const aTot = Number.isFinite(a[i]) ? Math.max(aS, a[i]) : model;
			s += w * aS * absorbedFractionPerAbsorbance(aTot);
		}
		return s;
	});
	let incident = 0;
	for (let i = 0; i < n; i++) if (q[i] > 0) incident += q[i] * grid.stepNm;
	if (!(qAbs[0] > 1e-6 * incident)) return { ok: false, issues: [{ field: 'reactant.spectrumId', code: 'physically-invalid', message: 'the reactant absorbs none of the lamp’s light: Φ cannot be measured with this lamp' }] };
	let photons = 0;
	const cumulative = [0];
	for (let k = 1; k < timesS.length; k++) {
		photons += 0.5 * (qAbs[k] + qAbs[k - 1]) * (timesS[k] - timesS[k - 1]);
		cumulative.push(photons);
	}
	const conversion = 1 - cs[cs.length - 1] / cs[0];
	if (conversion < 0.02) warnings.push(`The reactant changed by only ${(conversion * 100).toFixed(1)} % over the series: Φ rests on small differences.`);
	if (!eP) warnings.push('No product spectrum: the product is taken as transparent in the model (its absorption, if any, is only seen through the measured spectra).');

	// integral estimate (direct): Δn = Φ·N(t)
	let sxy = 0, sxx = 0;
	for (let k = 1; k < timesS.length; k++) {
		const dn = (cs[0] - cs[k]) * V;
		sxy += dn * cumulative[k];
		sxx += cumulative[k] ** 2;
	}
	const integral = sxx > 0 ? sxy / sxx : null;
	// initial rate: straight line of n_S(t) through the first points (≤ 15 % conversion, at least 3 points)
	let m0 = 3;
	while (m0 < timesS.length && 1 - cs[m0] / cs[0] <= 0.15) m0++;
	const slope = lineSlope(timesS.slice(0, m0), cs.slice(0, m0).map((c) => c * V));
	const initial = slope < 0 ? -slope / qAbs[0] : null;

	// model fit
	const reversible = input.reaction === 'reversible';
	const epsP = eP ?? new Float64Array(n);
	const x0 = cTot > 0 ? Math.max(0, (cp[0] ?? 0) / cTot) : 0;
	const t0 = timesS[0];
	const simulate = (phi: number, phiB: number) => {
		const p = prepareReversible({ stepNm: grid.stepNm, photonFluxInMixturePerNm: q, pathCm: l, volumeL: V, substrateEpsilon: eS, substrateConcentrationM: cTot, productEpsilon: epsP, fixedAbsorbance: rest, quantumYield: phi, quantumYieldBack: phiB });
		return integrateTimes(p, x0, timesS.map((t) => t - t0));
	};
	const guess = Math.max(1e-4, Math.min(1e3, integral ?? initial ?? 0.1));
	const yObs = cs.map((c) => c / cTot);
	const fn = (params: number[]) => {
		const xs = simulate(Math.exp(params[0]), reversible ? Math.exp(params[1]) : 0);
		return (k: number) => 1 - xs[Math.round(k)];
	};
	const ks = timesS.map((_, k) => k);
	const p0 = reversible ? [Math.log(guess), Math.log(guess)] : [Math.log(guess)];
	const fit = levenbergMarquardt({ x: ks, y: yObs }, fn, { initialValues: p0, maxIterations: 40, errorTolerance: 1e-14, gradientDifference: 1e-5, centralDifference: true, damping: 1e-2, minValues: p0.map(() => Math.log(1e-6)), maxValues: p0.map(() => Math.log(1e4)) });
	const best = fit.parameterValues;
	const model = simulate(Math.exp(best[0]), reversible ? Math.exp(best[1]) : 0);
	// standard errors from the Jacobian at the optimum (central differences in ln Φ)
	const resid = ks.map((k) => yObs[k] - (1 - model[k]));
	const ssr = resid.reduce((s, r) => s + r * r, 0);
	const dof = Math.max(1, ks.length - best.length);
	const J = best.map((_, j) => {
		const h = 1e-4;
		const up = best.slice(), dn = best.slice();
		up[j] += h; dn[j] -= h;
		const a = simulate(Math.exp(up[0]), reversible ? Math.exp(up[1]) : 0), b = simulate(Math.exp(dn[0]), reversible ? Math.exp(dn[1]) : 0);
		return ks.map((k) => -(a[k] - b[k]) / (2 * h));
	});
	const jtj = J.map((a) => J.map((b) => a.reduce((s, v, k) => s + v * b[k], 0)));
	const cov = invertSmall(jtj).map((row) => row.map((v) => (v * ssr) / dof));
	const phi = Math.exp(best[0]);
	const seFit = phi * Math.sqrt(Math.max(0, cov[0][0]));
	const u = input.calibrationRelativeUncertainty ?? 0;
	const result: SeriesResult = {
		quantumYield: phi,
		standardErrorFit: seFit,
		standardError: Math.sqrt(seFit ** 2 + (phi * u) ** 2),
		initialRateQuantumYield: initial,
		integralQuantumYield: reversible ? null : integral,
		residuals: ks.map((k) => ({
			timeS: timesS[k],
			reactantM: cs[k],
			productM: cp[k],
			modelReactantM: cTot * (1 - model[k]),
			modelProductM: cTot * model[k],
			residualM: cs[k] - cTot * (1 - model[k]),
			absorbedByReactantEinsteinPerS: qAbs[k],
			absorbanceRms: conc[k]!.rms
		})),
		photonsAbsorbedEinstein: photons,
		range: { fromNm: grid.fromNm + idx[0] * grid.stepNm, toNm: grid.fromNm + idx[idx.length - 1] * grid.stepNm, points: idx.length },
		conversion,
		warnings
	};
	if (reversible) {
		result.quantumYieldBack = Math.exp(best[1]);
		result.standardErrorBack = Math.exp(best[1]) * Math.sqrt(Math.max(0, cov[1][1]));
		if (!eP) warnings.push('A reversible fit without the product spectrum cannot tell the back reaction from a transparent product.');
	}
	if (phi > 1) warnings.push(`Φ = ${phi.toPrecision(3)} > 1: a chain reaction, or the photon flux is too low.`);
	return { ok: true, value: result };
}

/** Product fraction X at each time (s, from the first), RK4 with 10 steps per interval from X = x0. */
function integrateTimes(p: PreparedReversible, x0: number, times: number[]): number[] {
	const out = [x0];
	let x = x0;
	const f = (v: number) => p.netRate(Math.min(1, Math.max(0, v)));
	for (let k = 1; k < times.length; k++) {
		const steps = 10;
		const h = (times[k] - times[k - 1]) / steps;
		for (let j = 0; j < steps; j++) {
			const k1 = f(x), k2 = f(x + 0.5 * h * k1), k3 = f(x + 0.5 * h * k2), k4 = f(x + h * k3);
			x = Math.min(1, Math.max(0, x + (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4)));
		}
		out.push(x);
	}
	return out;
}

function lineSlope(x: number[], y: number[]): number {
	const n = x.length;
	const mx = x.reduce((s, v) => s + v, 0) / n, my = y.reduce((s, v) => s + v, 0) / n;
	let sxy = 0, sxx = 0;
	for (let i = 0; i < n; i++) { sxy += (x[i] - mx) * (y[i] - my); sxx += (x[i] - mx) ** 2; }
	return sxx > 0 ? sxy / sxx : 0;
}

/** Inverse of a 1×1 or 2×2 matrix (Infinity on the diagonal when singular). */
function invertSmall(m: number[][]): number[][] {
	if (m.length === 1) return [[m[0][0] > 0 ? 1 / m[0][0] : Infinity]];
	const [[a, b], [c, d]] = m;
	const det = a * d - b * c;
	if (!(Math.abs(det) > 0)) return [[Infinity, 0], [0, Infinity]];
	return [[d / det, -b / det], [-c / det, a / det]];
}
