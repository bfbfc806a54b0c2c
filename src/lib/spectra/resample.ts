/**
 * Linear resampling onto a uniform grid (piecewise-linear interpolation between neighbouring samples).
 */

/** Number of points of the uniform grid from `fromNm` to `toNm` (inclusive) with `stepNm`. */
export function gridLength(fromNm: number, toNm: number, stepNm: number): number {
	if (!(stepNm > 0) || !(toNm >= fromNm)) throw new RangeError(`invalid grid ${fromNm}–${toNm} step ${stepNm}`);
	return Math.floor((toNm - fromNm) / stepNm + 1e-9) + 1;
}

/**
 * Resamples y(x) onto fromNm, fromNm + stepNm, …, toNm by linear interpolation.
 * @param x - strictly monotonic (ascending or descending) abscissa, nm
 * @param y - values, same length as x
 * @returns Float64Array of gridLength values; NaN outside [min x, max x]
 * @throws RangeError for a bad grid or mismatched lengths (callers in parse code catch it)
 */
export function resampleToGrid(x: ArrayLike<number>, y: ArrayLike<number>, fromNm: number, toNm: number, stepNm: number): Float64Array {
	if (x.length !== y.length) throw new RangeError(`x has ${x.length} values, y has ${y.length}`);
	const n = gridLength(fromNm, toNm, stepNm);
	const out = new Float64Array(n).fill(NaN);
	const m = x.length;
	if (m === 0) return out;
	const desc = m > 1 && x[m - 1] < x[0];
	const xi = (i: number) => (desc ? x[m - 1 - i] : x[i]);
	const yi = (i: number) => (desc ? y[m - 1 - i] : y[i]);
	let j = 0;
	for (let k = 0; k < n; k++) {
		const g = fromNm + k * stepNm;
		if (g < xi(0) || g > xi(m - 1)) continue;
		while (j < m - 2 && xi(j + 1) < g) j++;
		if (m === 1) {
			out[k] = yi(0);
			continue;
		}
		const x0 = xi(j);
		const x1 = xi(j + 1);
		const t = x1 === x0 ? 0 : (g - x0) / (x1 - x0);
		// Exact sample values where the grid hits a sample (no rounding from y0 + 1·(y1 − y0)).
		out[k] = t === 0 ? yi(j) : t === 1 ? yi(j + 1) : yi(j) + t * (yi(j + 1) - yi(j));
	}
	return out;
}
