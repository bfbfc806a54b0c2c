/**
 * Units written in delimited-text headers and key–value blocks: x axes (nm, µm, Å, cm⁻¹, eV), y quantities with
 * their scale to the stored unit (W m⁻² µm⁻¹ → W m⁻² nm⁻¹ is × 10⁻³, mW cm⁻² nm⁻¹ → W m⁻² nm⁻¹ is × 10), reflectance,
 * optical constants (n, k) and the axes of non-optical tables (time, temperature, concentration, potential).
 * Pure helpers; `parseXUnit`/`parseYUnit` in ../units stay the shared fallbacks.
 */
import type { SpectrumKind, XUnit, YUnit } from '../types';
import { HC_EV_NM, parseYUnit, photonUnit, type YUnitGuess } from '../units';

/** x units a header may state; 'angstrom' and 'ev' are converted to nm by the reader. */
export type HeaderXUnit = XUnit | 'angstrom' | 'ev';

const words = (s: string) =>
	s
		.normalize('NFKC')
		.replace(/[()[\]{},;:/|]/g, ' ')
		.replace(/[_]/g, ' ')
		.trim()
		.toLowerCase();

/** Axis names: a column so named is an x axis, never a spectrum. */
const AXIS_WORD = /\b(wave\s*length|wavelengths?|lambda|wave\s*numbers?|wavenumbers?|photon\s*energy)\b|λ|ν̃|^\s*(nm|x|wl|energy\s*\(?ev\)?)\s*$/i;

/** True when a header names a spectral axis (wavelength, wavenumber, photon energy). */
export function isAxisName(name: string): boolean {
	return AXIS_WORD.test(name.trim());
}

/**
 * The x unit a header names. Checked on word boundaries of the raw label, so "Wavelength um" is µm and
 * "Wavelength (A)" is ångström only next to a wavelength word (a bare "A" is absorbance).
 */
export function xUnitOfHeader(label: string | undefined): HeaderXUnit | undefined {
	if (!label) return undefined;
	const raw = label.normalize('NFKC');
	const w = ` ${words(raw)} `;
	if (/\bev\b|electron\s*-?volts?/.test(w)) return 'ev';
	if (/1\s*cm|cm\s*-\s*1|cm\^-1|cm-1|cm⁻¹|\bwave\s*numbers?\b|\bwavenumbers?\b|\bper\s*cm\b|\bkaysers?\b/.test(w)) return 'cm-1';
	if (/ångström|angstr|\bå\b|Å/i.test(raw) || (/\ba\b/.test(w) && /wave\s*length|lambda|λ/.test(w))) return 'angstrom';
	if (/\bµm\b|\bμm\b|\bum\b|\bmicrons?\b|\bmicromet(er|re)s?\b/.test(w) || /µm|μm/.test(raw)) return 'um';
	if (/\bnm\b|nanomet(er|re)s?/.test(w)) return 'nm';
	if (/wave\s*length|lambda|λ/.test(w)) return 'nm';
	return undefined;
}

/** x value in nm for a header unit (λ = hc/E for eV, 1e7/ν̃ for cm⁻¹). */
export function toNm(v: number, u: HeaderXUnit): number {
	switch (u) {
		case 'nm':
			return v;
		case 'um':
			return v * 1000;
		case 'angstrom':
			return v / 10;
		case 'cm-1':
			return 1e7 / v;
		case 'ev':
			return HC_EV_NM / v;
	}
}

export const X_UNIT_NAMES: Record<HeaderXUnit, string> = { nm: 'nm', um: 'µm', angstrom: 'Å', 'cm-1': 'cm⁻¹', ev: 'eV' };

/** A y quantity read from a header, with the factor that brings the file's numbers to `yUnit`. */
export interface HeaderYUnit extends YUnitGuess {
	/** Multiply the file's values by this to get `yUnit` (1 when the file's unit is the stored one). */
	scale: number;
	/** The spectral density is per this x unit (Jacobian needed when it differs from the x axis). */
	perX?: 'nm' | 'um' | 'ev' | 'cm-1';
	/** Human form of the unit as read, for messages. */
	as?: string;
}

const POWER: Record<string, number> = { '': 1, k: 1e3, m: 1e-3, µ: 1e-6, μ: 1e-6, u: 1e-6, n: 1e-9 };
const AREA: Record<string, number> = { m: 1, cm: 1e4, mm: 1e6 };
const PER_X: Record<string, { f: number; perX: HeaderYUnit['perX'] }> = { nm: { f: 1, perX: 'nm' }, um: { f: 1e-3, perX: 'nm' }, µm: { f: 1e-3, perX: 'nm' }, μm: { f: 1e-3, perX: 'nm' }, micron: { f: 1e-3, perX: 'nm' }, ev: { f: 1, perX: 'ev' } };

/**
 * Radiometric units with prefixes, areas and per-wavelength parts: `W/m2/nm`, `W m-2 µm-1`, `E-490 W/m2/micron`,
 * `mW/cm²/nm`, `µW cm^-2 nm^-1`, `W/nm`. Returns undefined when the label is not a radiometric unit.
 */
export function radiometricUnit(label: string): HeaderYUnit | undefined {
	const s = label.normalize('NFKC').toLowerCase().replace(/\s+/g, ' ').replace(/[²]/g, '2').replace(/⁻¹/g, '-1').replace(/⁻²/g, '-2');
	// power prefix + W, then optional area, then optional per-x
	const m = /(^|[^a-z])([kmµμun]?)w(?![a-z])\s*(?:[./·\s]|\bper\b)*\s*(?:(m|cm|mm)\s*(?:\^?-?2|2))?\s*(?:[./·\s]|\bper\b|s\^?-1)*\s*(?:(nm|µm|μm|um|microns?|ev)\s*(?:\^?-1)?)?(?![a-z])/.exec(s);
	if (!m) return undefined;
	const [, , prefix, area, perRaw] = m;
	if (!area && !perRaw) return undefined;
	const per = perRaw ? PER_X[perRaw.replace(/s$/, '')] : undefined;
	if (!per) return undefined; // W m⁻² with no per-wavelength part is an integral, not a spectrum
	const scale = (POWER[prefix] ?? 1) * (area ? AREA[area] : 1) * per.f;
	return { yUnit: area ? 'W/m2/nm' : 'W/nm', kind: 'emission', scale, perX: per.perX, as: m[0].trim() };
}

/** Reflectance headers: `%R`, `R%`, `R (%)`, `Reflectance`, `Refl.`; fraction vs percent decided like %T. */
export function reflectanceUnit(label: string): { percent: boolean | undefined } | undefined {
	const s = label.trim().toLowerCase();
	if (/^%\s*r$|^r\s*%$|^r\s*\(%\)$|^r\s*\[%\]$/.test(s)) return { percent: true };
	if (/reflect|^refl\.?\b|^diffuse\s*refl/.test(s)) return { percent: /%|percent/.test(s) ? true : undefined };
	if (/^r$/.test(s)) return { percent: undefined };
	return undefined;
}

/** `n`, `k`, `refractive index`, `extinction coefficient k`, `kappa`: columns of an optical-constants table. */
export function opticalConstantRole(label: string): 'n' | 'k' | undefined {
	const s = label.trim().toLowerCase().replace(/[()[\]]/g, ' ').trim();
	if (/^n$|^n\s|refractive\s*index|^re\s*\(?n/.test(s)) return 'n';
	if (/^k$|^k\s|^kappa$|extinction\s*coef+icient\s*k|^im\s*\(?n/.test(s)) return 'k';
	return undefined;
}

/** Axes that make a table non-optical (HTTP 415 with the reason). */
const NON_OPTICAL: [RegExp, string][] = [
	[/^\s*(time|t|elapsed|seconds?|minutes?|hours?|days?|sec|min|hr)\b|\btime\b|zeit|temps/i, 'time'],
	[/temperature|^\s*temp\b|^\s*t\s*\(\s*(°c|k|°f)\s*\)|°c|kelvin/i, 'temperature'],
	[/concentration|^\s*conc\b|^\s*c\s*\(\s*(m|mm|µm|mol)/i, 'concentration'],
	[/voltage|potential|^\s*e\s*\(\s*v|\bv\s*vs\b|^\s*u\s*\(\s*v\)|^\s*(v|mv)\s*$/i, 'potential'],
	[/current|^\s*i\s*\(\s*(a|ma|µa)/i, 'current'],
	[/^\s*ph\s*$|pressure|^\s*mass\b|^\s*m\/z\b|retention|volume\s*\(|2\s*theta|2θ|angle|field\b/i, 'non-optical']
];

/** The kind of non-optical axis a header names ('time', 'temperature', …), or undefined. */
export function nonOpticalAxis(name: string): string | undefined {
	if (!name.trim() || isAxisName(name)) return undefined;
	for (const [re, what] of NON_OPTICAL) if (re.test(name)) return what;
	return undefined;
}

/** Seconds per unit of a time label (`Time (s)`, `t / min`, `30 ms`, `h`); undefined when none is named. */
export function timeUnitSeconds(label: string): number | undefined {
	const s = ` ${label.toLowerCase().replace(/[()[\]/,]/g, ' ')} `;
	if (/\bms\b|millisec/.test(s)) return 1e-3;
	if (/\bµs\b|\bus\b|microsec/.test(s)) return 1e-6;
	if (/\bs\b|\bsec\b|\bsecs\b|\bseconds?\b/.test(s)) return 1;
	if (/\bmin\b|\bmins\b|\bminutes?\b/.test(s)) return 60;
	if (/\bh\b|\bhr\b|\bhrs\b|\bhours?\b/.test(s)) return 3600;
	if (/\bd\b|\bdays?\b/.test(s)) return 86400;
	return undefined;
}

/** y quantity of a column header: reflectance first, then radiometric units with scale, then the shared parser. */
export function yUnitOfHeader(label: string | undefined): (HeaderYUnit & { reflectance?: { percent: boolean | undefined } }) | undefined {
	if (!label || !label.trim()) return undefined;
	const r = reflectanceUnit(label);
	if (r) return { yUnit: r.percent ? 'reflectance-percent' : 'reflectance', kind: 'reflectance', scale: 1, reflectance: r, transmittanceScaleUnknown: r.percent === undefined };
	const w = radiometricUnit(label);
	if (w) return w;
	const p = photonUnit(label);
	if (p) return { yUnit: p.yUnit, kind: 'emission', scale: p.scale, perX: 'nm', as: p.as };
	// "A", "A 10 µM", "A (run 2)", "A_1": absorbance (capital A as its own word)
	if (/^A(?=$|[\s_([])/.test(label.trim())) return { yUnit: 'absorbance', kind: 'absorption', scale: 1 };
	// a bare "T" / "T (%)" column: transmittance (fraction unless it says percent; large values decide as for %T)
	const t = /^\s*t\s*(?:[([]\s*(%|fraction)?\s*[)\]])?\s*$/i.exec(label);
	if (t) return t[1] === '%' ? { yUnit: 'transmittance-percent', kind: 'transmission', scale: 1 } : { yUnit: 'transmittance', kind: 'transmission', scale: 1, transmittanceScaleUnknown: t[1] !== 'fraction' };
	const g = parseYUnit(label);
	return g ? { ...g, scale: 1 } : undefined;
}

/** Kind that goes with a stored y unit (one table for every reader: ../units.ts). */
export { KIND_OF_Y } from '../units';
