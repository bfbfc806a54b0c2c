/**
 * The computation grid shared by every irradiation array (PRODUCT.md: "Common grid: 190–1100 nm,
 * 0.5 nm step for computation"). Wall T(λ), solvent A(λ), lamp q(λ) and species ε(λ) are all put
 * on this grid first, so the overlap integrals are plain indexed loops.
 *
 * Pure module: no framework, database or DOM imports.
 */
import { resampleToGrid } from '../spectra/resample';

/** A uniform wavelength grid: point i sits at fromNm + i·stepNm. */
export interface WavelengthGrid {
	fromNm: number;
	stepNm: number;
	count: number;
}

/** Anything indexable with numbers (plain arrays and typed arrays). */
export type NumberArray = ArrayLike<number>;

/** 190–1100 nm at 0.5 nm: 1821 points (PRODUCT.md). */
export const COMPUTATION_GRID: Readonly<WavelengthGrid> = Object.freeze({ fromNm: 190, stepNm: 0.5, count: 1821 });

/** Wavelengths (nm) of every grid point. */
export function gridWavelengths(grid: WavelengthGrid): Float64Array {
	const out = new Float64Array(grid.count);
	for (let i = 0; i < grid.count; i++) out[i] = grid.fromNm + i * grid.stepNm;
	return out;
}

/** Last wavelength of the grid (nm). */
export function gridToNm(grid: WavelengthGrid): number {
	return grid.fromNm + (grid.count - 1) * grid.stepNm;
}

/**
 * Linear interpolation of (x, y) onto the grid (x monotonic, nm); grid points outside the data get
 * `outside` (default 0 — "no emission / no absorption there"). Delegates to the spectra core's
 * resampleToGrid (one implementation of the interpolation in the project); throws its RangeError
 * on mismatched lengths.
 */
export function resampleOnto(x: NumberArray, y: NumberArray, grid: WavelengthGrid, outside = 0): Float64Array {
	const out = resampleToGrid(x, y, grid.fromNm, gridToNm(grid), grid.stepNm);
	if (out.length !== grid.count) throw new RangeError(`resampleOnto: grid of ${grid.count} points resampled to ${out.length}`);
	for (let i = 0; i < out.length; i++) if (Number.isNaN(out[i])) out[i] = outside;
	return out;
}

/**
 * Trapezoid rule on a uniform grid: ∫y dλ ≈ h·(Σ y_i − (y_0 + y_last)/2).
 * Used for every spectral integral in this folder (common practice).
 */
export function trapezoidUniform(y: NumberArray, stepNm: number): number {
	const n = y.length;
	if (n < 2) return 0;
	let s = 0;
	for (let i = 0; i < n; i++) s += y[i];
	return stepNm * (s - 0.5 * (y[0] + y[n - 1]));
}
