/**
 * Derived values as the Library stores them: the core's `deriveSpectrum` (saturated and noise stretches left out,
 * longest-wavelength band) plus guards seen in real instrument exports, each with a warning the user sees:
 * 1. absorption data that are pure noise at the short end (solvent or cell cut-off, e.g. THF below ~235 nm);
 * 2. a largest sample at the very end of the usable range is a band's flank, not its maximum (kinetics runs cut at
 *    350 nm): λmax becomes the longest-wavelength band maximum at least half as high as the highest band; with no band at all (a neat solvent's cut-off edge) λmax is null.
 */
import { deriveSpectrum } from '../../spectra/derive';
import type { NormalisedSpectrum, ParseIssue, SpectrumDerived } from '../../spectra/types';

/** Shortest wavelength above which the data stop being noise (undefined when they start clean). Common practice: second differences above 5 % of the spectrum's largest |y| mark noise. */
export function noisyLeadingEndNm(x: ArrayLike<number>, y: ArrayLike<number>): number | undefined {
	const n = x.length;
	if (n < 20) return undefined;
	let maxAbs = 0;
	for (let i = 0; i < n; i++) maxAbs = Math.max(maxAbs, Math.abs(y[i]));
	if (!(maxAbs > 0)) return undefined;
	const rough = (i: number) => Math.abs(y[i - 1] - 2 * y[i] + y[i + 1]) > 0.05 * maxAbs;
	let lastNoisy = -1;
	// Only a noisy stretch that starts at the short end counts; it ends at 10 smooth samples in a row.
	for (let i = 1; i < n - 1 && x[i] < 320; i++) {
		if (rough(i)) lastNoisy = i;
		else if (i - Math.max(lastNoisy, 0) > 10) break;
	}
	if (lastNoisy < 0) return undefined;
	return x[Math.min(n - 1, lastNoisy + 2)];
}

export interface LibraryDeriveOptions {
	/** Concentration (mol L⁻¹) and path (cm) of the measurement: with ε data they give A = ε·c·l for the saturation check. */
	concentrationM?: number | null;
	pathCm?: number | null;
	/** Upper end of the instrument's linear range, absorbance (default 2.5). */
	linearLimitAbsorbance?: number;
}

const fmt = (v: number) => String(Math.round(v * 10) / 10);

/** Derives λmax, longest band, edge, cut-offs, peaks and the search vector; returns warnings about the guards used. */
export function deriveForLibrary(spec: NormalisedSpectrum, options: LibraryDeriveOptions = {}): { derived: SpectrumDerived; warnings: ParseIssue[] } {
	const warnings: ParseIssue[] = [];
	const cl = options.concentrationM && options.pathCm ? options.concentrationM * options.pathCm : undefined;
	const absorbancePerY = spec.yUnit === 'absorbance' ? 1 : spec.yUnit === 'epsilon' ? cl : undefined;
	const common = { absorbancePerY, linearLimitAbsorbance: options.linearLimitAbsorbance };
	if (spec.kind === 'transmission') {
		const derived = deriveSpectrum(spec, common);
		for (const note of Object.values(derived.cutoffNotes ?? {})) if (note) warnings.push({ severity: 'warning', code: 'cutoff_outside_data', message: `cut-off ${note}` });
		return { derived, warnings };
	}
	// noise at the short end (solvent or cell cut-off) is one of the excluded stretches of the core
	const fromNm: number | undefined = undefined;
	const derived = deriveSpectrum(spec, common);
	for (const e of derived.excluded ?? []) {
		if (e.reason === 'saturated')
			warnings.push({ severity: 'warning', code: 'saturated', message: `${fmt(e.fromNm)}–${fmt(e.toNm)} nm: absorbance above the linear range (${options.linearLimitAbsorbance ?? 2.5}); left out of λmax, peaks and similarity` });
		else
			warnings.push({ severity: 'warning', code: e.fromNm === spec.x[0] ? 'noisy_short_end' : 'noisy_stretch', message: `${fmt(e.fromNm)}–${fmt(e.toNm)} nm: noise-dominated (a solvent or cell cut-off, or the end of the detector's range); left out of λmax, peaks and similarity` });
	}
	const { x } = spec;
	const n = x.length;
	const top = derived.lambdaMaxNm;
	const usableEnds = usableEndsNm(x, derived.excluded ?? []);
	const nextToSaturated = top !== null && (derived.excluded ?? []).some((e) => e.reason === 'saturated' && top >= e.fromNm - 2 && top <= e.toNm + 2);
	if (top !== null && n > 2 && usableEnds && (top === usableEnds[0] || top === usableEnds[1] || nextToSaturated)) {
		const bands = (derived.bands ?? []).filter((b) => fromNm === undefined || b.wavelengthNm >= fromNm);
		// the long-wavelength band: the longest-wavelength band maximum at least half as high as the highest one
		const tallest = Math.max(...bands.map((b) => b.value));
		const highest = bands.filter((b) => b.value >= 0.5 * tallest).at(-1) ?? null;
		if (highest) {
			const why = highest.saturated ? `; its top is saturated, so ${fmt(highest.value)} is a lower bound` : '';
			warnings.push({ severity: 'warning', code: 'maximum_at_range_end', message: `the largest usable value lies at the end of the usable range (${top} nm); λmax is the maximum of the long-wavelength band, ${highest.wavelengthNm} nm${why}` });
			derived.lambdaMaxNm = highest.wavelengthNm;
			derived.valueAtMax = highest.value;
		} else if (spec.kind === 'absorption') {
			warnings.push({ severity: 'warning', code: 'no_band_maximum', message: `no band maximum in the data: the absorbance rises towards ${top} nm (a cut-off edge), so λmax is not given` });
			derived.lambdaMaxNm = null;
			derived.valueAtMax = null;
		}
	}
	return { derived, warnings };
}

/** First and last wavelength outside the excluded stretches. */
function usableEndsNm(x: ArrayLike<number>, excluded: { fromNm: number; toNm: number }[]): [number, number] | null {
	const ok = (w: number) => !excluded.some((e) => w >= e.fromNm && w <= e.toNm);
	let a = -1;
	let b = -1;
	for (let i = 0; i < x.length; i++) if (ok(x[i])) (a = a < 0 ? i : a), (b = i);
	return a < 0 ? null : [x[a], x[b]];
}

/** Version of the derivation rules; rows derived with an older one are re-derived by seeds/05_library_links.ts. */
export const DERIVE_VERSION = 2;

/** What the `derived_extra` JSON column holds (besides the `longest_band_nm` column). */
export interface DerivedExtra {
	deriveVersion: number;
	longestBandValue: number | null;
	longestBandSaturated: boolean;
	excluded: { fromNm: number; toNm: number; reason: 'saturated' | 'noise' }[];
	noiseSigma: number;
	cutoffNotes: { cutoff10?: string; cutoff50?: string };
	similarity: { usable: [number, number][]; aboveNoise: [number, number][] } | null;
}

/** The columns of `spectra` that hold the derived values added after the first release (longest band, stretches). */
export function derivedColumns(d: SpectrumDerived): { longest_band_nm: number | null; derived_extra: string } {
	const extra: DerivedExtra = {
		deriveVersion: DERIVE_VERSION,
		longestBandValue: d.longestBandValue ?? null,
		longestBandSaturated: d.longestBandSaturated ?? false,
		excluded: d.excluded ?? [],
		noiseSigma: d.noiseSigma ?? 0,
		cutoffNotes: d.cutoffNotes ?? {},
		similarity: d.similarity ?? null
	};
	return { longest_band_nm: d.longestBandNm ?? null, derived_extra: JSON.stringify(extra) };
}

/** Parses `derived_extra` (null/invalid → null). */
export function parseDerivedExtra(s: string | null | undefined): DerivedExtra | null {
	if (!s) return null;
	try {
		return JSON.parse(s) as DerivedExtra;
	} catch {
		return null;
	}
}
