/**
 * Unit recognition and axis / y display conversions.
 * Constants: CODATA 2018 exact SI values (h, c, e are defined constants since the 2019 SI revision).
 */
import type { SpectrumKind, XUnit, YUnit } from './types';

/** Planck constant, J s (CODATA 2018, exact). */
export const PLANCK_J_S = 6.62607015e-34;
/** Speed of light in vacuum, m s^-1 (CODATA 2018, exact). */
export const SPEED_OF_LIGHT_M_S = 299792458;
/** Elementary charge, C (CODATA 2018, exact). */
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;
/** h·c/e in eV nm = 1239.841984… (CODATA 2018). */
export const HC_EV_NM = ((PLANCK_J_S * SPEED_OF_LIGHT_M_S) / ELEMENTARY_CHARGE_C) * 1e9;

/** Display axes for x. */
export type Axis = 'nm' | 'cm-1' | 'eV';

/** Converts wavelength (nm) to the given axis: cm⁻¹ = 1e7/λ, eV = hc/(eλ). */
export function toAxis(wavelengthNm: number, axis: Axis): number {
	if (axis === 'nm') return wavelengthNm;
	if (axis === 'cm-1') return 1e7 / wavelengthNm;
	return HC_EV_NM / wavelengthNm;
}

/** Converts a value on the given axis back to wavelength in nm (the maps are their own inverse). */
export function fromAxis(value: number, axis: Axis): number {
	return toAxis(value, axis);
}

/** log10 ε from ε (M⁻¹ cm⁻¹); non-positive ε gives -Infinity. */
export const epsilonToLogEpsilon = (epsilon: number): number => Math.log10(epsilon);
/** ε (M⁻¹ cm⁻¹) from log10 ε. */
export const logEpsilonToEpsilon = (logEpsilon: number): number => 10 ** logEpsilon;
/** %T from decadic absorbance: %T = 100·10^(−A). */
export const absorbanceToPercentT = (absorbance: number): number => 100 * 10 ** -absorbance;
/** Decadic absorbance from %T: A = 2 − log10(%T) (IUPAC Gold Book, "absorbance"). */
export const percentTToAbsorbance = (percentT: number): number => 2 - Math.log10(percentT);

const squash = (s: string) => s.toLowerCase().replace(/[\s_.()[\]{}]/g, '');

/** Recognises an x unit string (`nm`, `NANOMETERS`, `Wavelength (nm)`, `1/CM`, `cm-1`, `MICROMETERS`, `µm`). */
export function parseXUnit(label: string | undefined): XUnit | undefined {
	if (!label) return undefined;
	const s = squash(label);
	if (/1\/cm|cm-1|cm\^-1|cm⁻¹|wavenumber|percm/.test(s)) return 'cm-1';
	if (/micromet|microns?$|µm|μm|(^|[^a-z])um$/.test(s)) return 'um';
	if (/nanomet|nm|wavelength|lambda/.test(s)) return 'nm';
	return undefined;
}

export interface YUnitGuess {
	yUnit: YUnit;
	kind: SpectrumKind;
	/** Transmittance whose percent/fraction scale must be decided from the data. */
	transmittanceScaleUnknown?: boolean;
	/** The label names a quantity that is not a spectrum (variance, standard deviation). */
	notSpectrum?: boolean;
}

/**
 * Recognises a y unit or column header. Returns undefined when it gives no hint
 * (e.g. `ARBITRARY UNITS`, a bare number).
 */
export function parseYUnit(label: string | undefined): YUnitGuess | undefined {
	if (!label) return undefined;
	const raw = label.trim();
	const s = squash(raw);
	if (/variance|stddev|std\.?dev|standarddeviation|^sd$|uncertainty|error|sigma/.test(s))
		return { yUnit: 'relative', kind: 'absorption', notSpectrum: true };
	// log ε in any spelling: "Logarithm epsilon", "LOG(EPSILON)", "lg ε", "log10 eps", "log molar absorptivity"
	if (/(log(arithm)?(10)?|lg)[-^]?(of)?(ε|epsilon|eps|e$|molar|extinction)/.test(s)) return { yUnit: 'log-epsilon', kind: 'absorption' };
	if (/ε|epsilon|molarabs|extinctioncoef|m-1cm-1|l\/mol|lmol-1cm-1|m\^-1cm\^-1/.test(s))
		return { yUnit: 'epsilon', kind: 'absorption' };
	// photon units: µmol (m⁻²) s⁻¹ nm⁻¹ are stored as such; other prefixes need the factor (csvUnits applies it), and a
	// photon unit without a per-wavelength part keeps only the shape, as relative emission
	const photon = photonUnit(raw);
	if (photon && photon.scale === 1) return { yUnit: photon.yUnit, kind: 'emission' };
	// reflectance is not transmittance: no hint (the preview asks the user)
	if (/^r%$|reflect/.test(s)) return undefined;
	// power or irradiance with a metric prefix or per cm² (mW/nm, µW/cm²/nm): keep the shape as relative emission rather than
	// store milli- or micro-watts under a watt label
	if (/(^|[^a-z])(m|µ|μ|u|n)w(\/|cm|m2|m-2|nm)|w\/cm|wcm-2/.test(s)) return { yUnit: 'relative', kind: 'emission' };
	if (/%t|percenttrans|transmittance%|transmission%|t%|%$/.test(s) && /t|%/.test(s))
		return { yUnit: 'transmittance-percent', kind: 'transmission' };
	if (/transm|^trans\.?$/.test(s)) return { yUnit: 'transmittance', kind: 'transmission', transmittanceScaleUnknown: true };
	if (/^a$|absorb|^abs|opticaldensity|^od$/.test(s)) return { yUnit: 'absorbance', kind: 'absorption' };
	if (/w\/?m-?2\/?nm|wm-2nm-1|w\/m2|wm2|w\.m2|irradiance|extraterrestrial|global|direct/.test(s))
		return { yUnit: 'W/m2/nm', kind: 'emission' };
	if (/w\/nm|wnm-1|radiantflux|spectralpower/.test(s)) return { yUnit: 'W/nm', kind: 'emission' };
	if (/counts|^cts|intensity\(counts\)/.test(s)) return { yUnit: 'counts', kind: 'emission' };
	if (/mols-1|mol\/s|mol\/m2\/s|molm-2s-1|photon|quanta|einstein/.test(s)) return { yUnit: 'relative', kind: 'emission' };
	if (/emission|fluoresc|luminesc|relativeintensity|intensity|spd|illuminant|daylight|incandescent|cie|\d{4}k/.test(s))
		return { yUnit: 'relative', kind: 'emission' };
	return undefined;
}

/** Kind that goes with a stored y unit. */
export const KIND_OF_Y: Record<YUnit, SpectrumKind> = {
	absorbance: 'absorption',
	epsilon: 'absorption',
	'log-epsilon': 'absorption',
	transmittance: 'transmission',
	'transmittance-percent': 'transmission',
	reflectance: 'reflectance',
	'reflectance-percent': 'reflectance',
	relative: 'emission',
	'W/nm': 'emission',
	'W/m2/nm': 'emission',
	'umol/s/nm': 'emission',
	'umol/m2/s/nm': 'emission',
	counts: 'emission'
};

/** A stored y unit as a chemist writes it (axis labels, values, messages). */
export const Y_UNIT_TEXT: Record<string, string> = {
	absorbance: 'absorbance',
	epsilon: 'ε (M⁻¹ cm⁻¹)',
	'log-epsilon': 'log ε',
	transmittance: 'transmittance (fraction)',
	'transmittance-percent': 'transmittance (%)',
	reflectance: 'reflectance (fraction)',
	'reflectance-percent': 'reflectance (%)',
	relative: 'relative',
	'W/nm': 'W nm⁻¹',
	'W/m2/nm': 'W m⁻² nm⁻¹',
	'umol/s/nm': 'µmol s⁻¹ nm⁻¹',
	'umol/m2/s/nm': 'µmol m⁻² s⁻¹ nm⁻¹',
	counts: 'counts'
};

/**
 * Photon-flux units with their factor to µmol (s⁻¹ nm⁻¹, optionally per m²): `µmol m⁻² s⁻¹ nm⁻¹`, `umol/m2/s/nm`,
 * `mol/s/nm`, `photons cm-2 s-1 nm-1`, `µE m-2 s-1 nm-1` (einstein = mol of photons), `µmol m-2 s-1 µm-1`.
 * Returns undefined when the label is not a photon-flux density (no per-second or no per-wavelength part).
 * Avogadro constant 6.02214076e23 mol⁻¹ (CODATA 2018, exact).
 */
export function photonUnit(label: string): { yUnit: 'umol/s/nm' | 'umol/m2/s/nm'; scale: number; as: string } | undefined {
	const s = label
		.normalize('NFKC')
		.toLowerCase()
		.replace(/[⁻−–]/g, '-')
		.replace(/¹/g, '1')
		.replace(/²/g, '2')
		.replace(/μ/g, 'µ')
		.replace(/\bmicro-?/g, 'µ');
	// an amount in moles (einstein = mol of photons) wins over a bare "photons" word ("photon irradiance (µmol …)")
	const amount =
		/(?:^|[^a-z])(µ|u|n|m|)(mol|e|einsteins?)(?:\s*(?:of\s*)?photons?)?(?![a-z])/.exec(s) ?? /(?:^|[^a-z])()()(photons?|quanta)(?![a-z])/.exec(s);
	if (!amount) return undefined;
	const rest = s.slice(amount.index + amount[0].length);
	if (!/(^|[^a-z])s(ec)?\s*(\^?-1|-1)?(?![a-z])|\/s(?![a-z])|per\s*second/.test(rest)) return undefined;
	const perX = /(nm|µm|um|microns?)\s*(\^?-1)?(?![a-z])/.exec(rest);
	if (!perX) return undefined;
	const area = /(?:^|[^a-z])(m|cm|mm)\s*(\^?-?2)(?![a-z])/.exec(rest);
	const AVOGADRO = 6.02214076e23;
	const PREFIX: Record<string, number> = { '': 1e6, m: 1e3, µ: 1, u: 1, n: 1e-3 };
	const toMicromol = amount[3] ? 1e6 / AVOGADRO : PREFIX[amount[1]] ?? 1;
	const perArea = area ? { m: 1, cm: 1e4, mm: 1e6 }[area[1] as 'm' | 'cm' | 'mm'] : 1;
	const perNm = perX[1] === 'nm' ? 1 : 1e-3;
	return { yUnit: area ? 'umol/m2/s/nm' : 'umol/s/nm', scale: toMicromol * perArea * perNm, as: label.trim() };
}
