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
	const totalArea = ohno
		? ((hwLong + hwShort) / OHNO_FWHM_PER_DELTA) * Math.sqrt(Math.PI) * (1 + 2 / Math.sqrt(5)) / 3
		: ((hwLong + hwShort) / 2) * Math.sqrt(Math.PI / Math.LN2);
	return { values, totalArea };
}
