/**
 * Stretches of a measured spectrum that carry no band information: saturated samples (absorbance above the
 * instrument's linear range) and noise-dominated stretches (a solvent or cell cut-off, the far end of a detector),
 * plus the noise level of the whole spectrum. x in nm, strictly ascending.
 *
 * Noise: for white noise of standard deviation σ the second difference y[i−1] − 2y[i] + y[i+1] has standard
 * deviation √6·σ, so σ ≈ 1.4826·median|Δ²y|/√6 (median absolute deviation, a robust estimator; common practice).
 * A stretch is noise-dominated where the local σ (root mean square of Δ²y/√6 over ±5 samples) is well above the
 * spectrum's own σ and the sign of Δy flips at most samples (noise flips about two samples in three; a sharp line
 * or band flips once or twice).
 */

export type ExcludedReason = 'saturated' | 'noise';

export interface ExcludedStretch {
	fromNm: number;
	toNm: number;
	reason: ExcludedReason;
}

export interface StretchOptions {
	/**
	 * Multiplier turning y into absorbance (1 for absorbance; c·l in mol L⁻¹·cm for ε); undefined when the
	 * absorbance is unknown (ε without concentration and path, transmission, emission): no saturation check.
	 */
	absorbancePerY?: number;
	/** Upper end of the instrument's linear range in absorbance units (default 2.5; common practice for double-beam UV–vis). */
	linearLimitAbsorbance?: number;
}

export interface Stretches {
	/** Per sample: true when saturated or noise-dominated. */
	excludedMask: Uint8Array;
	excluded: ExcludedStretch[];
	/** Robust noise standard deviation of y (same unit as y). */
	noiseSigma: number;
}

const HALF = 5;

/**
 * The resolution of y when the file wrote it with a fixed number of decimals (or as integers × YFACTOR): the
 * smallest step between neighbouring values when ≥ 95 % of all non-zero steps are whole multiples of it; 0 otherwise.
 */
export function quantisationStep(y: ArrayLike<number>): number {
	const steps: number[] = [];
	for (let i = 1; i < y.length; i++) {
		const d = Math.abs(y[i] - y[i - 1]);
		if (d > 0 && Number.isFinite(d)) steps.push(d);
	}
	if (steps.length < 10) return 0;
	let q = Infinity;
	for (const d of steps) if (d < q) q = d;
	let whole = 0;
	for (const d of steps) if (Math.abs(d / q - Math.round(d / q)) < 1e-3) whole++;
	return whole >= 0.95 * steps.length ? q : 0;
}

/**
 * Robust noise σ of y from its second differences (see the file comment), never below the rounding noise of the
 * file's own resolution q (σ = q/√12 for rounding to a step q, the standard deviation of a uniform error; common
 * practice): data written with three decimals cannot show a band one digit high. 0 for fewer than 5 samples.
 */
export function estimateNoiseSigma(y: ArrayLike<number>): number {
	const n = y.length;
	if (n < 5) return 0;
	const d2 = new Float64Array(n - 2);
	for (let i = 1; i < n - 1; i++) d2[i - 1] = Math.abs(y[i - 1] - 2 * y[i] + y[i + 1]);
	d2.sort();
	const med = d2.length % 2 ? d2[(d2.length - 1) / 2] : 0.5 * (d2[d2.length / 2 - 1] + d2[d2.length / 2]);
	return Math.max((1.4826 * med) / Math.sqrt(6), quantisationStep(y) / Math.sqrt(12));
}

/** Saturated and noise-dominated stretches of a spectrum. */
export function findExcludedStretches(x: ArrayLike<number>, y: ArrayLike<number>, options: StretchOptions = {}): Stretches {
	const n = x.length;
	const mask = new Uint8Array(n);
	const reason: (ExcludedReason | null)[] = new Array(n).fill(null);
	const sigma = estimateNoiseSigma(y);
	let maxAbs = 0;
	for (let i = 0; i < n; i++) if (Math.abs(y[i]) > maxAbs) maxAbs = Math.abs(y[i]);
	if (n >= 2 * HALF + 3 && maxAbs > 0) {
		const d2sq = new Float64Array(n);
		const flip = new Uint8Array(n);
		for (let i = 1; i < n - 1; i++) {
			d2sq[i] = (y[i - 1] - 2 * y[i] + y[i + 1]) ** 2 / 6;
			flip[i] = Math.sign(y[i] - y[i - 1]) * Math.sign(y[i + 1] - y[i]) < 0 ? 1 : 0;
		}
		for (let i = 1; i < n - 1; i++) {
			const lo = Math.max(1, i - HALF);
			const hi = Math.min(n - 2, i + HALF);
			let s = 0;
			let f = 0;
			for (let k = lo; k <= hi; k++) {
				s += d2sq[k];
				f += flip[k];
			}
			const local = Math.sqrt(s / (hi - lo + 1));
			if (local > 6 * sigma && local > 0.004 * maxAbs && f / (hi - lo + 1) >= 0.45) {
				mask[i] = 1;
				reason[i] = 'noise';
			}
		}
		// a noisy stretch reaching the second sample reaches the first one too
		if (mask[1]) (mask[0] = 1), (reason[0] = 'noise');
		if (mask[n - 2]) (mask[n - 1] = 1), (reason[n - 1] = 'noise');
	}
	const perY = options.absorbancePerY;
	if (perY !== undefined && perY > 0) {
		const limit = options.linearLimitAbsorbance ?? 2.5;
		for (let i = 0; i < n; i++) {
			if (y[i] * perY > limit) {
				// the sample and its neighbours: a band cannot have its maximum next to a saturated stretch
				for (let k = Math.max(0, i - 1); k <= Math.min(n - 1, i + 1); k++) {
					mask[k] = 1;
					reason[k] = 'saturated';
				}
			}
		}
	}
	return { excludedMask: mask, excluded: runsOf(x, mask, reason), noiseSigma: sigma };
}

function runsOf(x: ArrayLike<number>, mask: Uint8Array, reason: (ExcludedReason | null)[]): ExcludedStretch[] {
	const out: ExcludedStretch[] = [];
	for (let i = 0; i < mask.length; i++) {
		if (!mask[i]) continue;
		const r = reason[i]!;
		const last = out[out.length - 1];
		if (last && last.reason === r && i > 0 && mask[i - 1] && reason[i - 1] === r) last.toNm = x[i];
		else out.push({ fromNm: x[i], toNm: x[i], reason: r });
	}
	return out;
}

/** Merges stretches closer than `gapNm` with the same reason (short clean gaps inside a noisy stretch are noise too). */
export function mergeStretches(stretches: ExcludedStretch[], gapNm: number): ExcludedStretch[] {
	const out: ExcludedStretch[] = [];
	for (const s of stretches) {
		const last = out[out.length - 1];
		if (last && last.reason === s.reason && s.fromNm - last.toNm <= gapNm) last.toNm = Math.max(last.toNm, s.toNm);
		else out.push({ ...s });
	}
	return out;
}
