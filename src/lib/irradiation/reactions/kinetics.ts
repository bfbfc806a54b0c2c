/**
 * Shared machinery of the reaction modes (direct, photocatalytic, reversible): the lamp's photons packed on the grid
 * points that matter, and the integration of t(X) for a conversion X that rises monotonically towards a limit.
 *
 * Rate law of every mode: rate = Φ × absorbed photon flux (IUPAC Glossary of Terms Used in Photochemistry, 3rd ed.,
 * Pure Appl. Chem. 79, 293 (2007)); absorbed flux of species i = ∫ q_in(λ)·A_i(λ)·g(A_tot(λ)) dλ with the vessel's
 * g(A) = F(A)/A (vessels.ts). The mixture is taken as well stirred.
 *
 * Solver: dX/dt = r(X) > 0 on [0, X_lim) with r(X_lim) = 0 (a photostationary state, a bleached catalyst) or
 * X_lim = 1. The variables are swapped, t(X) = ∫ dX/r(X), and written in u = −ln(1 − X/X_lim), where
 * dt/du = (X_lim − X)/r(X) stays finite as X → X_lim (r vanishes linearly there). When the rate does not vanish at
 * full conversion (zero order: a photocatalyst that keeps absorbing) X itself is the variable. Composite Simpson
 * (≡ RK4 for a right-hand side free of t) on segments that end exactly at the requested conversions.
 */
import type { NumberArray } from '../wavelengthGrid';

/** The lamp's photon flux inside the wall with the trapezoid weight folded in, only where `keep(i)` holds. */
export interface PackedLight {
	/** Grid indices kept. */
	index: Int32Array;
	/** q_in(λ_i)·w_i, einstein s⁻¹. */
	weight: Float64Array;
}

/** Keep the grid points where the lamp reaches the mixture (above 1e-12 of its peak, as rank.ts) and `keep(i)`. */
export function packLight(photonFluxInMixturePerNm: NumberArray, stepNm: number, keep: (i: number) => boolean): PackedLight {
	const q = photonFluxInMixturePerNm;
	const n = q.length;
	let qMax = 0;
	for (let i = 0; i < n; i++) if (q[i] > qMax) qMax = q[i];
	const cut = qMax * 1e-12;
	const idx: number[] = [];
	for (let i = 0; i < n; i++) if (q[i] > cut && keep(i)) idx.push(i);
	const weight = new Float64Array(idx.length);
	idx.forEach((i, k) => (weight[k] = q[i] * (i === 0 || i === n - 1 ? 0.5 * stepNm : stepNm)));
	return { index: Int32Array.from(idx), weight };
}

/** Values of a grid array at the packed points, times `scale`. */
export function pick(a: NumberArray | undefined, light: PackedLight, scale = 1): Float64Array {
	const out = new Float64Array(light.index.length);
	if (a) for (let k = 0; k < out.length; k++) out[k] = a[light.index[k]] * scale;
	return out;
}

export interface ConversionCourse {
	/** Time (s) to each requested conversion, in the order asked; null when it lies at or beyond the limit. */
	times: (number | null)[];
	/** Samples for a plot, ascending time from (0, 0). */
	curve: { timeS: number[]; conversion: number[] };
}

/**
 * Times to the target conversions for dX/dt = rate(X) (X per second), X rising from 0 towards `limit`
 * (Infinity: the rate stays positive up to X = 1 and X is integrated directly up to 1).
 * `stepsPerDecade` Simpson panels per decade of (X_lim − X) (default 48), at least 8 per segment.
 */
export function integrateConversion(rate: (x: number) => number, limit: number, targets: number[], stepsPerDecade = 48): ConversionCourse {
	const finite = Number.isFinite(limit);
	const toU = (x: number) => (finite ? -Math.log1p(-x / limit) : x);
	const toX = (u: number) => (finite ? -limit * Math.expm1(-u) : u);
	const dtdu = (u: number) => {
		const x = toX(u);
		const r = rate(x);
		if (!(r > 0)) return Infinity;
		return finite ? (limit - x) / r : 1 / r;
	};
	const cap = finite ? Math.min(limit, 1) : 1;
	const reachable = targets.map((x) => x >= 0 && (finite ? x < limit * (1 - 1e-9) && x <= 1 : x <= 1));
	const ends = [...new Set(targets.filter((_, k) => reachable[k]).map(toU))].sort((a, b) => a - b);
	const atU = new Map<number, number>();
	const timeS = [0];
	const conversion = [0];
	let u = 0, t = 0, f0 = dtdu(0);
	for (const end of ends) {
		const span = end - u;
		if (span <= 0) {
			atU.set(end, t);
			continue;
		}
		const steps = Math.max(8, Math.ceil(((finite ? span / Math.LN10 : span * 10) * stepsPerDecade)));
		const h = span / steps;
		for (let j = 0; j < steps; j++) {
			const fm = dtdu(u + 0.5 * h);
			const f1 = dtdu(u + h);
			t += (h / 6) * (f0 + 4 * fm + f1);
			f0 = f1;
			u += h;
			timeS.push(t);
			conversion.push(Math.min(cap, toX(u)));
		}
		u = end;
		atU.set(end, t);
	}
	const times = targets.map((x, k) => {
		if (!reachable[k]) return null;
		const v = atU.get(toU(x));
		return v !== undefined && Number.isFinite(v) ? v : null;
	});
	return { times, curve: { timeS, conversion } };
}

/** Common result of every mode's time course (API.md: null times come with `unreachableReason`). */
export interface ReactionTimes {
	/** n₀·0.9/(Φ·q_abs(0)): the estimate from the initial rate, s (null when 90 % is out of reach). */
	initialRateTimeTo90PctS: number | null;
	timeTo50PctS: number | null;
	timeTo90PctS: number | null;
	timeTo99PctS: number | null;
	/** Why a target conversion cannot be reached (null when all can). */
	unreachableReason: string | null;
	/** Highest conversion the reaction approaches under this lamp (1, the photostationary fraction, or where the photocatalyst is gone). */
	limitConversion: number;
	/** Conversion (or product fraction in reversible mode) against time. */
	curve: { timeS: number[]; conversion: number[] };
}

export const finiteOrNull = (x: number | null | undefined): number | null => (typeof x === 'number' && Number.isFinite(x) ? x : null);
export const percent = (x: number, digits = 0) => `${(x * 100).toFixed(digits)} %`;
