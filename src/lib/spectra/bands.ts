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
