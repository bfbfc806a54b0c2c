/**
 * LED line shapes on a uniform grid.
 * Gaussian (common practice): S = exp(−4 ln2 (λ − λ₀)²/FWHM²).
 * Ohno single-LED model (Y. Ohno, Opt. Eng. 44, 111302 (2005)): S = [g + 2g⁵]/3, g = exp(−((λ − λ₀)/Δ)²),
 * with Δ = FWHM/c and c = 0.92178… (the |x|/Δ at which S = 1/2, doubled), so the curve's FWHM equals the input.
 * Skew (our choice, after the split models reviewed by Benkner et al., IEEE Access 2022): the half width at
 * half maximum is FWHM/2·(1 + skew) on the long-wavelength side and FWHM/2·(1 − skew) on the short side,
 * −1 < skew < 1; peak position and FWHM are unchanged, skew > 0 gives a red tail.
 */
import type { LedModel, SpectralGrid, ShapeOnGrid } from './types';

/** FWHM/Δ of the Ohno shape, from solving (g + 2g⁵)/3 = 1/2 by bisection (≈ 0.9218). */
export const OHNO_FWHM_PER_DELTA = (() => {
	let lo = 0;
	let hi = 1;
	for (let i = 0; i < 80; i++) {
		const g = (lo + hi) / 2;
		if ((g + 2 * g ** 5) / 3 < 0.5) lo = g;
		else hi = g;
	}
	return 2 * Math.sqrt(-Math.log((lo + hi) / 2));
})();

/** Ohno relative spectral power at offset xNm from the peak with half-width parameter deltaNm. */
export function ohnoShape(xNm: number, deltaNm: number): number {
	const g = Math.exp(-((xNm / deltaNm) ** 2));
	return (g + 2 * g ** 5) / 3;
}

/** Relative LED emission on the grid (peak 1) and its analytic area. */
export function ledShape(model: LedModel, grid: SpectralGrid): ShapeOnGrid {
	const skew = model.skew ?? 0;
	const hwLong = (model.fwhmNm / 2) * (1 + skew);
	const hwShort = (model.fwhmNm / 2) * (1 - skew);
	const values = new Float64Array(grid.count);
	const ohno = model.shape === 'ohno';
	for (let i = 0; i < grid.count; i++) {
		const x = grid.fromNm + i * grid.stepNm - model.peakNm;
		const hw = x >= 0 ? hwLong : hwShort;
		// Gaussian half: S = 2^(−(x/hw)²); Ohno half: Δ = 2·hw/c.
		values[i] = ohno ? ohnoShape(x, (2 * hw) / OHNO_FWHM_PER_DELTA) : Math.exp(-Math.LN2 * (x / hw) ** 2);
	}
	// Analytic areas: Gaussian half = (hw/2)√(π/ln2); Ohno half = (Δ/2)√π·(1 + 2/√5)/3.
	const analytic = ohno
		? ((hwLong + hwShort) / OHNO_FWHM_PER_DELTA) * Math.sqrt(Math.PI) * (1 + 2 / Math.sqrt(5)) / 3
		: ((hwLong + hwShort) / 2) * Math.sqrt(Math.PI / Math.LN2);
	// Only power beyond the grid's ends counts as off-grid; a coarse grid's sampling error of a narrow line does not.
	const toNm = grid.fromNm + (grid.count - 1) * grid.stepNm;
	const outside = halfTail(hwLong, toNm - model.peakNm, ohno) + halfTail(hwShort, model.peakNm - grid.fromNm, ohno);
	let gridArea = 0;
	for (let i = 0; i < grid.count; i++) gridArea += i === 0 || i === grid.count - 1 ? values[i] / 2 : values[i];
	gridArea *= grid.stepNm;
	const inside = Math.max(analytic - outside, 1e-300);
	return { values, totalArea: (gridArea * analytic) / inside };
}

/** Complementary error function (Abramowitz & Stegun 7.1.26, |error| < 1.5e-7), any sign of x. */
function erfc(x: number): number {
	const z = Math.abs(x);
	const t = 1 / (1 + 0.3275911 * z);
	const y = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429)))) * Math.exp(-z * z);
	return x >= 0 ? y : 2 - y;
}

/** Area of one half of the shape (half width at half maximum hw) beyond distance d from the peak. */
function halfTail(hw: number, d: number, ohno: boolean): number {
	// ∫_d^∞ exp(−x²/(2σ²)) dx = σ·√(π/2)·erfc(d/(σ√2))
	const tail = (sigma: number) => sigma * Math.sqrt(Math.PI / 2) * erfc(d / (sigma * Math.SQRT2));
	if (!ohno) return tail(hw / Math.sqrt(2 * Math.LN2));
	const delta = (2 * hw) / OHNO_FWHM_PER_DELTA; // g = exp(−(x/Δ)²): σ = Δ/√2; g⁵: σ = Δ/√10
	return (tail(delta / Math.SQRT2) + 2 * tail(delta / Math.sqrt(10))) / 3;
}
