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

/** Ranges in which a stated µm or cm⁻¹ axis is believed: 100 nm–100 µm, the product's limit for x (UV-C starts at 100 nm, CIE S 017 — from memory). */
export const BELIEVED_X: Record<XUnit, [number, number]> = { nm: [100, 100000], um: [0.1, 100], 'cm-1': [100, 100000] };

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
	// A stated wavenumber or micrometre axis is believed wherever it is a light wavelength at all (100 nm–100 µm):
	// infrared data stay infrared (and are refused for their range later) instead of being read as nm. The one
	// exception is the mislabelled UV file, a cm⁻¹ header over numbers that lie entirely within 190–1100.
	const mislabelledUv = declared === 'cm-1' && min >= 190 && max <= 1100;
	if (!mislabelledUv && declared !== 'nm' && min >= BELIEVED_X[declared][0] && max <= BELIEVED_X[declared][1]) return { xUnit: declared };
	if (fits(declared) && !mislabelledUv) return { xUnit: declared };
	const others = mislabelledUv ? (['nm'] as XUnit[]) : (['nm', 'um', 'cm-1'] as XUnit[]).filter((u) => u !== declared && fits(u));
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

/** What an x-axis label says: an optical unit (with a factor to it), an energy axis, or a non-optical quantity. */
export type XAxisLabel =
	| { unit: XUnit; factor: number; name: string }
	| { unit: 'eV'; factor: 1; name: string }
	| { notOptical: string; name: string };

const squashLabel = (s: string) => s.toLowerCase().replace(/[\s_.()[\]{}]/g, '');

/**
 * Reads an x-axis label (JCAMP-DX ##XUNITS, a column header's unit) for what it measures. Undefined when it says
 * nothing usable (`ARBITRARY UNITS`, empty). Reciprocal nanometres and ångström are wavenumber and wavelength
 * axes with a factor (1 nm⁻¹ = 10⁷ cm⁻¹; 1 Å = 0.1 nm).
 */
export function parseXAxisLabel(label: string | undefined): XAxisLabel | undefined {
	if (!label || !label.trim()) return undefined;
	const s = squashLabel(label);
	const name = label.trim();
	if (/^(1\/nm|nm-1|nm\^-1|nm⁻¹|reciprocalnanomet)/.test(s)) return { unit: 'cm-1', factor: 1e7, name };
	if (/1\/cm|cm-1|cm\^-1|cm⁻¹|wavenumber|percm|reciprocalcentimet|kayser/.test(s)) return { unit: 'cm-1', factor: 1, name };
	if (/^(ev|electronvolts?|electron-?volts?)$|\(ev\)|energy.*ev|ev$/.test(s) && !/mev|kev/.test(s)) return { unit: 'eV', factor: 1, name };
	if (/micromet|^microns?$|µm|μm|(^|[^a-z])um$/.test(s)) return { unit: 'um', factor: 1, name };
	if (/nanomet|(^|[^a-z])nm$|^nm|wavelength|lambda/.test(s)) return { unit: 'nm', factor: 1, name };
	if (/^(å|angstroms?|ångströms?|a°)$/.test(s)) return { unit: 'nm', factor: 0.1, name };
	if (/ppm|^hz$|^khz$|^mhz$|hertz|chemicalshift/.test(s)) return { notOptical: `an NMR spectrum (x in ${name})`, name };
	if (/^m\/z$|^mz$|^da$|dalton|^amu$|^u$|mass\/charge|masstocharge/.test(s)) return { notOptical: `a mass spectrum (x in ${name})`, name };
	if (/^(m?v|volts?|millivolts?|potential.*|e\/v|evs.*)$/.test(s) && !/ev$/.test(s)) return { notOptical: `a current–voltage or electrochemical curve (x in ${name})`, name };
	if (/^(m?s|µs|us|sec|secs|seconds?|milliseconds?|min|mins|minutes?|h|hours?|time.*)$/.test(s)) return { notOptical: `a time trace (x in ${name})`, name };
	if (/^(m?l|µl|ul|millilit(re|er)s?|volume.*)$/.test(s)) return { notOptical: `a titration or volume curve (x in ${name})`, name };
	if (/^(°c|degc|c|k|kelvin|celsius|temperature.*)$/.test(s)) return { notOptical: `a thermal curve (x in ${name})`, name };
	if (/2θ|2theta|degrees?2|^deg$|^degrees?$/.test(s)) return { notOptical: `a diffractogram (x in ${name})`, name };
	if (/gauss|^mt$|tesla/.test(s)) return { notOptical: `an EPR spectrum (x in ${name})`, name };
	return undefined;
}
