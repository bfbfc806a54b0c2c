/** Grid helpers for the lamp models (uniform grids, trapezoid areas, broadened lines). */
import type { SpectralGrid, ShapeOnGrid } from './types';

export function gridWavelengths(grid: SpectralGrid): Float64Array {
	const out = new Float64Array(grid.count);
	for (let i = 0; i < grid.count; i++) out[i] = grid.fromNm + i * grid.stepNm;
	return out;
}

/** Trapezoid area of values on a uniform grid. */
export function trapezoidArea(values: ArrayLike<number>, stepNm: number): number {
	const n = values.length;
	if (n < 2) return 0;
	let sum = 0;
	for (let i = 0; i < n; i++) sum += values[i];
	return stepNm * (sum - (values[0] + values[n - 1]) / 2);
}

const FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.LN2);

/**
 * Adds Gaussian lines of full width `fwhmNm` (widened to ≥ 2 grid steps so each line is resolved)
 * whose analytic areas equal their relative powers; returns the summed relative power of all lines.
 */
export function addGaussianLines(
	out: Float64Array, grid: SpectralGrid, lines: readonly { wavelengthNm: number; relativePower: number }[], fwhmNm: number, scale = 1
): number {
	const sigma = Math.max(fwhmNm, 2 * grid.stepNm) / FWHM_PER_SIGMA;
	let total = 0;
	for (const line of lines) {
		const amp = (scale * line.relativePower) / (sigma * Math.sqrt(2 * Math.PI));
		total += scale * line.relativePower;
		const i0 = Math.max(0, Math.floor((line.wavelengthNm - 8 * sigma - grid.fromNm) / grid.stepNm));
		const i1 = Math.min(grid.count - 1, Math.ceil((line.wavelengthNm + 8 * sigma - grid.fromNm) / grid.stepNm));
		for (let i = i0; i <= i1; i++) {
			const x = (grid.fromNm + i * grid.stepNm - line.wavelengthNm) / sigma;
			out[i] += amp * Math.exp(-0.5 * x * x);
		}
	}
	return total;
}

/** Largest share of a model's power that may fall outside the grid before lampSpectrum refuses. */
export const MAX_OUTSIDE_GRID_FRACTION = 0.5;

/**
 * Scales a shape so that the model's whole area (on and off the grid) carries powerW: the power of lines or tails off the
 * grid is reported as `outsideGridFraction`, never handed to the rest. RangeError when nothing, or less than half of the
 * power, lies on the grid.
 */
export function normaliseToPower(shape: ShapeOnGrid, grid: SpectralGrid, powerW: number): { powerWPerNm: Float64Array; outsideGridFraction: number } {
	const area = trapezoidArea(shape.values, grid.stepNm);
	if (!(area > 0)) throw new RangeError('grid: the lamp emits nothing on this wavelength grid');
	const outside = Math.min(1, Math.max(0, shape.totalArea > 0 ? 1 - area / shape.totalArea : 0));
	if (outside > MAX_OUTSIDE_GRID_FRACTION) {
		throw new RangeError(`grid: ${(outside * 100).toFixed(0)} % of the lamp's power lies outside this wavelength grid`);
	}
	// Discretisation makes the on-grid area differ from the analytic one by < 1e-4: then the grid area normalises exactly.
	// Otherwise the model's own total does (off-grid power, or a line that comes on top of powerW, e.g. 185 nm Hg).
	const f = shape.totalArea > 0 && Math.abs(1 - area / shape.totalArea) > 1e-4 ? powerW / shape.totalArea : powerW / area;
	const powerWPerNm = new Float64Array(shape.values.length);
	for (let i = 0; i < powerWPerNm.length; i++) powerWPerNm[i] = shape.values[i] * f;
	return { powerWPerNm, outsideGridFraction: outside > 1e-4 ? outside : 0 };
}
