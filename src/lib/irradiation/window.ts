/**
 * Excitation windows: contiguous wavelength ranges where the wall transmits, the solvent is
 * transparent enough over the path, the substrate absorbs, and the substrate out-competes the other
 * absorbers (PRODUCT.md "Excitation window"; selectivity per wavelength A_S/A_tot with
 * A_tot = Σ A_j + A_solv after the IUPAC 2007 inner-filter fraction).
 */
import type { NumberArray, WavelengthGrid } from './wavelengthGrid';

/** User-adjustable thresholds (API.md names). */
export interface WindowThresholds {
	/** Wall transmission T ≥ this (0–1). */
	minWallTransmission: number;
	/** Solvent absorbance over the reaction path ≤ this. */
	maxSolventAbsorbance: number;
	/** Substrate absorbance over the reaction path ≥ this. */
	minSubstrateAbsorbance: number;
	/** Per-wavelength selectivity A_S/A_tot ≥ this (0–1). */
	minSelectivity: number;
}

/**
 * Defaults (common practice, chosen for this product):
 * - T_min 0.5 — the wall's 50 % cut-off, the usual "transmits" edge quoted for vessel glass;
 * - A_max 0.5 over the path — the solvent takes at most ~68 % of the light on its own;
 * - A_min 0.1 over the path — the substrate absorbs at least ~21 % of what reaches it;
 * - S_min 0.5 — the substrate takes at least half of what the mixture absorbs.
 */
export const DEFAULT_WINDOW_THRESHOLDS: Readonly<WindowThresholds> = Object.freeze({
	minWallTransmission: 0.5,
	maxSolventAbsorbance: 0.5,
	minSubstrateAbsorbance: 0.1,
	minSelectivity: 0.5
});

export interface WindowInput {
	grid: WavelengthGrid;
	/** Wall transmission 0–1 on the grid. */
	wallTransmission: NumberArray;
	/** Solvent absorbance over the reaction path. */
	solventAbsorbance: NumberArray;
	/** Absorbance of the species that should absorb (substrate, or a photocatalyst) over the path. */
	substrateAbsorbance: NumberArray;
	/** Sum of every other species' absorbance over the path (omit when there are none). */
	otherAbsorbance?: NumberArray;
}

export interface WavelengthRange {
	fromNm: number;
	toNm: number;
}

/** Contiguous grid ranges that pass all four tests; `[]` when there is no window. */
export function findWindows(input: WindowInput, thresholds: Partial<WindowThresholds> = {}): WavelengthRange[] {
	const th = { ...DEFAULT_WINDOW_THRESHOLDS, ...thresholds };
	const { grid, wallTransmission: t, solventAbsorbance: solv, substrateAbsorbance: aS, otherAbsorbance: other } = input;
	const ranges: WavelengthRange[] = [];
	let start = -1;
	for (let i = 0; i <= grid.count; i++) {
		let ok = false;
		if (i < grid.count) {
			const aTot = aS[i] + solv[i] + (other ? other[i] : 0);
			ok =
				t[i] >= th.minWallTransmission &&
				solv[i] <= th.maxSolventAbsorbance &&
				aS[i] >= th.minSubstrateAbsorbance &&
				aTot > 0 &&
				aS[i] / aTot >= th.minSelectivity;
		}
		if (ok && start < 0) start = i;
		if (!ok && start >= 0) {
			ranges.push({ fromNm: grid.fromNm + start * grid.stepNm, toNm: grid.fromNm + (i - 1) * grid.stepNm });
			start = -1;
		}
	}
	return ranges;
}
