/**
 * λmax, absorption edge and transmission cut-offs of a normalised spectrum (x in nm, ascending).
 * Crossings use linear interpolation between the two samples on either side.
 */
import { localMaxima } from './peaks';

export interface RangeNm {
	fromNm?: number;
	toNm?: number;
}

/** Index of the largest sample with x in [fromNm, toNm] (default: everywhere); -1 if none. */
export function findMaxIndex(x: ArrayLike<number>, y: ArrayLike<number>, range: RangeNm = {}): number {
	const from = range.fromNm ?? -Infinity;
	const to = range.toNm ?? Infinity;
	let best = -1;
	for (let i = 0; i < x.length; i++) if (x[i] >= from && x[i] <= to && (best < 0 || y[i] > y[best])) best = i;
	return best;
}

const cross = (x0: number, y0: number, x1: number, y1: number, level: number) => (y1 === y0 ? x0 : x0 + ((level - y0) * (x1 - x0)) / (y1 - y0));

/**
 * Absorption edge. Bands are local maxima over ±2 nm (±max(1, round(2 nm / step)) samples) whose
 * value is ≥ 10 % of the spectrum's maximum; the long-wavelength band is the one at the longest λ.
 * Walking from that band's maximum towards longer λ, the edge is the first wavelength where the
 * value falls below 10 % of that band's maximum (linear interpolation). Null when it never does.
 */
export function findAbsorptionEdge(x: ArrayLike<number>, y: ArrayLike<number>, fraction = 0.1, range: RangeNm = {}): number | null {
	const n = x.length;
	const top = findMaxIndex(x, y, range);
	if (top < 0 || !(y[top] > 0)) return null;
	const step = (x[n - 1] - x[0]) / Math.max(1, n - 1);
	const half = Math.max(1, Math.round(2 / step));
	let band = top;
	for (const i of localMaxima(y, half)) if (x[i] > x[band] && x[i] <= (range.toNm ?? Infinity) && y[i] >= fraction * y[top]) band = i;
	const level = fraction * y[band];
	for (let i = band + 1; i < n; i++) if (y[i] < level) return cross(x[i - 1], y[i - 1], x[i], y[i], level);
	return null;
}

/**
 * Transmission cut-off: the shortest wavelength above which T stays ≥ threshold. Found from the long
 * end: the last sample with T < threshold and the next one bracket the crossing. Null when T never
 * falls below the threshold in the data (no cut-off in range) or is below it at the longest λ.
 */
export function findCutoff(x: ArrayLike<number>, t: ArrayLike<number>, threshold: number): number | null {
	const n = x.length;
	let last = -1;
	for (let i = n - 1; i >= 0; i--) {
		if (t[i] < threshold) {
			last = i;
			break;
		}
	}
	if (last < 0 || last === n - 1) return null;
	return cross(x[last], t[last], x[last + 1], t[last + 1], threshold);
}

export interface BandMaximum {
	wavelengthNm: number;
	value: number;
	/** Height above the higher of the two valleys beside it (same unit as y). */
	prominence: number;
	/** True when the band's top is saturated: the stretch's clear maximum (else its middle); the value is not reliable. */
	saturated: boolean;
}

export interface BandOptions {
	/** Per sample: 1 where the data are saturated or noise (see stretches.ts); default none. */
	excludedMask?: ArrayLike<number>;
	/** Per sample: 1 where saturated (subset of excludedMask); saturated stretches with lower data on both sides are bands. */
	saturatedMask?: ArrayLike<number>;
	/** Noise standard deviation of y (stretches.ts estimateNoiseSigma); default 0. */
	noiseSigma?: number;
	/** Least prominence in multiples of the noise σ (default 8). */
	noiseFactor?: number;
	/** Least prominence as a fraction of the largest usable value (default 0.0002: a d–d band of ε 10 beside a charge-transfer band of ε 20 000 still counts when the noise allows). */
	minRelativeProminence?: number;
	/**
	 * Least width at half prominence, nm (default 1). Besides, a band must span at least 3 samples above half its
	 * prominence: one- or two-sample spikes are instrument artefacts, such as the deuterium-lamp Balmer lines at 486.0
	 * and 656.1 nm in diode-array spectra (common practice), while resolved vibronic bands span many samples.
	 */
	minWidthNm?: number;
}

/** Measured samples around index i (from the top, contiguous) that lie above top − prominence/2. */
function samplesAboveHalf(y: ArrayLike<number>, i: number, prominence: number): number {
	let best = i;
	for (let k = Math.max(0, i - 2); k <= Math.min(y.length - 1, i + 2); k++) if (y[k] > y[best]) best = k;
	const level = y[best] - prominence / 2;
	let c = 1;
	for (let k = best - 1; k >= 0 && y[k] > level; k--) c++;
	for (let k = best + 1; k < y.length && y[k] > level; k++) c++;
	return c;
}

/** Width (nm) of the feature at index i where y falls by half its prominence, walking out on each side (linear interpolation). */
export function halfProminenceWidthNm(x: ArrayLike<number>, y: ArrayLike<number>, i: number, prominence: number): number {
	const level = y[i] - prominence / 2;
	const n = x.length;
	let l = i;
	while (l > 0 && y[l - 1] > level) l--;
	let r = i;
	while (r < n - 1 && y[r + 1] > level) r++;
	const left = l > 0 ? cross(x[l - 1], y[l - 1], x[l], y[l], level) : x[0];
	const right = r < n - 1 ? cross(x[r], y[r], x[r + 1], y[r + 1], level) : x[n - 1];
	return right - left;
}

/**
 * Band maxima above noise: local maxima of the lightly smoothed spectrum (moving mean over ±max(1, round(1 nm/step))
 * samples) whose ±2 nm neighbourhood is usable data away from both ends, with prominence ≥ max(noiseFactor·σ,
 * minRelativeProminence·max); each placed on the largest measured sample within ±2 nm. Ascending wavelength.
 */
export function findBandMaxima(x: ArrayLike<number>, y: ArrayLike<number>, options: BandOptions = {}): BandMaximum[] {
	const n = x.length;
	if (n < 5) return [];
	const ex = options.excludedMask;
	const sat = options.saturatedMask;
	const bad = (i: number) => (ex ? ex[i] === 1 : false);
	const step = (x[n - 1] - x[0]) / (n - 1);
	const m = Math.max(1, Math.round(1 / step));
	const h = Math.max(1, Math.round(2 / step));
	const ys = new Float64Array(n);
	let maxUsable = 0;
	for (let i = 0; i < n; i++) {
		let s = 0;
		let c = 0;
		for (let k = Math.max(0, i - m); k <= Math.min(n - 1, i + m); k++) if (!bad(k)) (s += y[k]), c++;
		ys[i] = c ? s / c : NaN;
		if (!bad(i) && y[i] > maxUsable) maxUsable = y[i];
	}
	if (!(maxUsable > 0)) return [];
	const least = Math.max((options.noiseFactor ?? 8) * (options.noiseSigma ?? 0), (options.minRelativeProminence ?? 0.0002) * maxUsable);
	const out: BandMaximum[] = [];
	// valley on one side: the lowest smoothed value before a higher one, an excluded sample or the end
	const valley = (i: number, dir: 1 | -1) => {
		let lo = ys[i];
		for (let k = i + dir; k >= 0 && k < n && !bad(k) && ys[k] <= ys[i]; k += dir) if (ys[k] < lo) lo = ys[k];
		return lo;
	};
	for (let i = h; i < n - h; i++) {
		let ok = !bad(i);
		for (let k = i - h; k <= i + h && ok; k++) if (bad(k) || (k < i ? ys[k] >= ys[i] : k > i ? ys[k] > ys[i] : false)) ok = false;
		if (!ok) continue;
		const prominence = ys[i] - Math.max(valley(i, -1), valley(i, 1));
		if (!(prominence >= least) || !(prominence > 0)) continue;
		if (halfProminenceWidthNm(x, ys, i, prominence) < (options.minWidthNm ?? 1) || samplesAboveHalf(y, i, prominence) < 3) continue;
		let best = i;
		for (let k = i - h; k <= i + h; k++) if (y[k] > y[best]) best = k;
		if (!out.some((p) => p.wavelengthNm === x[best])) out.push({ wavelengthNm: x[best], value: y[best], prominence, saturated: false });
	}
	if (sat) {
		// a saturated stretch with usable, lower data on both sides is a band whose top the instrument could not read
		for (let i = 0; i < n; i++) {
			if (sat[i] !== 1) continue;
			let j = i;
			while (j + 1 < n && sat[j + 1] === 1) j++;
			const usableWithin = (from: number, to: number) => {
				for (let k = Math.max(0, from); k <= Math.min(n - 1, to); k++) if (!bad(k)) return true;
				return false;
			};
			// the top inside the stretch: a clear interior maximum (≥ 2 % above both ends of the stretch), else its middle
			let top = i;
			for (let k = i; k <= j; k++) if (y[k] > y[top]) top = k;
			// (a flat instrument ceiling has no clear top: many samples sit at the same largest value)
			let nearTop = 0;
			for (let k = i; k <= j; k++) if (y[k] >= 0.995 * y[top]) nearTop++;
			const clear = top > i && top < j && y[top] >= 1.02 * Math.max(y[i], y[j]) && nearTop <= Math.max(2, 0.3 * (j - i + 1));
			if ((usableWithin(i - 5 * h, i - 1) && usableWithin(j + 1, j + 5 * h)) || clear) {
				const at = clear ? top : (i + j) >> 1;
				out.push({ wavelengthNm: x[at], value: y[at], prominence: NaN, saturated: true });
			}
			i = j;
		}
	}
	return out.sort((a, b) => a.wavelengthNm - b.wavelengthNm);
}
