/**
 * Checks a declared x unit against the data range and never silently moves a spectrum:
 * UV–vis–NIR (about 100–5000 nm) is 0.1–5 µm or about 2000–100 000 cm⁻¹ (ν̃ = 1e7/λ).
 * When the declared unit is implausible and exactly one other unit fits, the data are read in
 * that unit with the warning `units_contradict_data` (the upload preview asks the user to confirm).
 */
import type { ParseIssue, XUnit } from '../types';

/** Plausible x ranges per unit for UV–vis–NIR spectra (common practice). */
export const PLAUSIBLE_X: Record<XUnit, [number, number]> = {
	nm: [100, 5000],
	um: [0.1, 5],
	'cm-1': [2000, 100000]
};

const NAMES: Record<XUnit, string> = { nm: 'nm', um: 'µm', 'cm-1': 'cm⁻¹' };

/** Returns the unit to read x in, with a warning when it differs from the declared one. */
export function checkXUnit(
	x: ArrayLike<number>,
	declared: XUnit,
	block?: number
): { xUnit: XUnit; issue?: ParseIssue } {
	let min = Infinity;
	let max = -Infinity;
	for (let i = 0; i < x.length; i++) {
		if (x[i] < min) min = x[i];
		if (x[i] > max) max = x[i];
	}
	if (!(min <= max)) return { xUnit: declared };
	const fits = (u: XUnit) => min >= PLAUSIBLE_X[u][0] && max <= PLAUSIBLE_X[u][1];
	if (fits(declared)) return { xUnit: declared };
	const others = (['nm', 'um', 'cm-1'] as XUnit[]).filter((u) => u !== declared && fits(u));
	const range = `${min}–${max}`;
	if (others.length === 1) {
		const u = others[0];
		const wrongNm = declared === 'cm-1' ? `${(1e7 / max).toFixed(0)}–${(1e7 / min).toFixed(0)} nm` : declared === 'um' ? `${min * 1000}–${max * 1000} nm` : `${range} nm`;
		return {
			xUnit: u,
			issue: {
				severity: 'warning',
				code: 'units_contradict_data',
				message: `x is declared in ${NAMES[declared]} but runs ${range}, which in ${NAMES[declared]} would be ${wrongNm} (not UV–vis). Read as ${NAMES[u]}; please confirm the x unit in the preview.`,
				block
			}
		};
	}
	return {
		xUnit: declared,
		issue: {
			severity: 'warning',
			code: 'x_range_unusual',
			message: `x runs ${range} ${NAMES[declared]}, outside the usual UV–vis–NIR range; please check the x unit.`,
			block
		}
	};
}
