/**
 * The intended absorber's longest-wavelength band: the band a chemist irradiates into (an n→π* band of a ketone at
 * 1 % of the π→π* maximum still counts). A band is a local maximum over ±5 nm that reaches `minRelative` of the
 * spectrum's largest ε and is a real peak: on its long-wavelength side ε falls to ≤ 70 % of the peak before it
 * rises above the peak again (or the data end) — so the shoulder of a rising edge and baseline ripple in a tail are
 * not taken. Thresholds are common practice for picking bands, chosen for this product.
 */
import type { NumberArray, WavelengthGrid } from './wavelengthGrid';

export interface Band {
	wavelengthNm: number;
	epsilon: number;
	index: number;
}

export function longestWavelengthBand(grid: WavelengthGrid, eps: NumberArray, minRelative = 0.004): Band | null {
	const n = grid.count;
	let max = 0;
	for (let i = 0; i < n; i++) if (eps[i] > max) max = eps[i];
	if (!(max > 0)) return null;
	const half = Math.max(1, Math.round(5 / grid.stepNm));
	for (let i = n - 2; i >= 1; i--) {
		const v = eps[i];
		if (!(v >= minRelative * max)) continue;
		let isMax = true;
		for (let k = Math.max(0, i - half); k <= Math.min(n - 1, i + half) && isMax; k++) if (k !== i && (k < i ? eps[k] > v : eps[k] >= v)) isMax = false;
		if (!isMax) continue;
		let falls = false;
		for (let k = i + 1; k < n; k++) {
			if (eps[k] <= 0.7 * v) { falls = true; break; }
			if (eps[k] > v) break;
		}
		if (falls) return { wavelengthNm: grid.fromNm + i * grid.stepNm, epsilon: v, index: i };
	}
	return null;
}
