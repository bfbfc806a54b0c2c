/**
 * The derived values stored with each spectrum (API.md: lambdaMaxNm, edgeNm, cutoff10Nm, cutoff50Nm, peaks, search
 * vector) plus the longest-wavelength band, the saturated / noise stretches left out of every derived value, and the
 * stretch of the 1 nm grid that shape similarity may use.
 */
import { findAbsorptionEdge, findBandMaxima, findCutoff, findMaxIndex, type RangeNm } from './bands';
import { GRID_FROM_NM, SEARCH_LENGTH, SEARCH_STEP_NM, toSearchVector } from './grid';
import { findPeaks } from './peaks';
import { findExcludedStretches, mergeStretches, type ExcludedStretch } from './stretches';
import type { NormalisedSpectrum, SpectrumDerived } from './types';

export interface DeriveOptions {
	/** Wavelength range searched for λmax and the edge (default: all data); e.g. `{ fromNm: 230 }` to skip a solvent cut-off region. */
	range?: RangeNm;
	/** y × absorbancePerY = absorbance (1 for absorbance, c·l for ε); undefined: saturation is not judged. Default 1 for absorbance spectra. */
	absorbancePerY?: number;
	/** Upper end of the instrument's linear range, absorbance (default 2.5). */
	linearLimitAbsorbance?: number;
}

/** Inclusive index ranges [fromNm, toNm] on the 1 nm search grid. */
export type GridRanges = [number, number][];

/** Where two spectra may be compared: measured and not excluded (`usable`), and clearly above the noise (`aboveNoise`). */
export interface SimilarityStretch {
	usable: GridRanges;
	aboveNoise: GridRanges;
}

function rangesOf(mask: Uint8Array): GridRanges {
	const out: GridRanges = [];
	for (let i = 0; i < mask.length; i++) {
		if (!mask[i]) continue;
		let j = i;
		while (j + 1 < mask.length && mask[j + 1]) j++;
		out.push([GRID_FROM_NM + i * SEARCH_STEP_NM, GRID_FROM_NM + j * SEARCH_STEP_NM]);
		i = j;
	}
	return out;
}

function similarityStretch(spec: NormalisedSpectrum, vector: Float32Array, excluded: ExcludedStretch[], sigma: number): SimilarityStretch {
	const lo = spec.x[0];
	const hi = spec.x[spec.x.length - 1];
	const usable = new Uint8Array(SEARCH_LENGTH);
	const above = new Uint8Array(SEARCH_LENGTH);
	for (let i = 0; i < SEARCH_LENGTH; i++) {
		const w = GRID_FROM_NM + i * SEARCH_STEP_NM;
		usable[i] = w >= lo && w <= hi && !excluded.some((s) => w >= s.fromNm - 1 && w <= s.toNm + 1) ? 1 : 0;
		above[i] = usable[i] && Math.abs(vector[i]) > 5 * sigma ? 1 : 0;
	}
	return { usable: rangesOf(usable), aboveNoise: rangesOf(above) };
}

/**
 * λmax (largest usable sample; absorption and emission), value at λmax, the longest-wavelength band maximum above
 * noise (absorption), absorption edge, 10 % / 50 % cut-offs (transmission), peaks, the 1 nm search vector, the
 * saturated and noise stretches (left out of all of these) and the stretch similarity may use.
 */
export function deriveSpectrum(spec: NormalisedSpectrum, options: DeriveOptions = {}): SpectrumDerived {
	const { x, y } = spec;
	const n = x.length;
	const isT = spec.kind === 'transmission';
	const perY = options.absorbancePerY ?? (spec.kind === 'absorption' && spec.yUnit === 'absorbance' ? 1 : undefined);
	const st = findExcludedStretches(x, y, { absorbancePerY: spec.kind === 'absorption' ? perY : undefined, linearLimitAbsorbance: options.linearLimitAbsorbance });
	// only absorption: emission lines and the fine structure of a solar spectrum are signal, not noise
	const excluded = spec.kind === 'absorption' ? mergeStretches(st.excluded, 3) : [];
	const mask = new Uint8Array(n);
	const satMask = new Uint8Array(n);
	for (let i = 0; i < n; i++) {
		const s = excluded.find((e) => x[i] >= e.fromNm && x[i] <= e.toNm);
		if (s) (mask[i] = 1), (satMask[i] = s.reason === 'saturated' ? 1 : 0);
	}
	const range = options.range ?? {};
	const yUsable = Float64Array.from(y, (v, i) => (mask[i] ? -Infinity : v));
	const top = isT ? -1 : findMaxIndex(x, yUsable, range);
	const lo = range.fromNm ?? -Infinity;
	const hi = range.toNm ?? Infinity;
	const bands =
		spec.kind === 'absorption'
			? findBandMaxima(x, y, { excludedMask: mask, saturatedMask: satMask, noiseSigma: st.noiseSigma }).filter((b) => b.wavelengthNm >= lo && b.wavelengthNm <= hi)
			: [];
	const longest = bands.length ? bands[bands.length - 1] : null;
	const near = (w: number) => excluded.some((e) => w >= e.fromNm - 2 && w <= e.toNm + 2);
	const peaks = isT ? [] : findPeaks(spec).filter((p) => p.wavelengthNm >= lo && p.wavelengthNm <= hi && !near(p.wavelengthNm));
	if (longest && !longest.saturated && !peaks.some((p) => Math.abs(p.wavelengthNm - longest.wavelengthNm) <= 2))
		peaks.push({ wavelengthNm: longest.wavelengthNm, value: longest.value });
	peaks.sort((a, b) => a.wavelengthNm - b.wavelengthNm);
	const searchVector = toSearchVector(spec);
	return {
		lambdaMaxNm: top >= 0 && Number.isFinite(yUsable[top]) ? x[top] : null,
		valueAtMax: top >= 0 && Number.isFinite(yUsable[top]) ? y[top] : null,
		longestBandNm: longest ? longest.wavelengthNm : null,
		longestBandValue: longest ? longest.value : null,
		longestBandSaturated: longest ? longest.saturated : false,
		bands: bands.map((b) => ({ wavelengthNm: b.wavelengthNm, value: b.value, saturated: b.saturated })),
		edgeNm: spec.kind === 'absorption' ? findAbsorptionEdge(x, yUsable.map((v) => (Number.isFinite(v) ? v : 0)), 0.1, range) : null,
		cutoff10Nm: isT ? findCutoff(x, y, 0.1) : null,
		cutoff50Nm: isT ? findCutoff(x, y, 0.5) : null,
		cutoffNotes: isT ? cutoffNotes(x, y) : {},
		peaks,
		excluded,
		noiseSigma: st.noiseSigma,
		similarity: similarityStretch(spec, searchVector, excluded, st.noiseSigma),
		searchVector
	};
}

const pct = (t: number) => `${(t * 100).toFixed(t < 0.1 ? 1 : 0)} %`;

/**
 * Why a transmission cut-off is null: T never falls below the threshold inside the data, so the cut-off lies below
 * the data range ("below the data range, T(300 nm) = 81 %"), or T is still below it at the long end.
 */
export function cutoffNotes(x: ArrayLike<number>, t: ArrayLike<number>): { cutoff10?: string; cutoff50?: string } {
	const n = x.length;
	const out: { cutoff10?: string; cutoff50?: string } = {};
	if (!n) return out;
	for (const [key, level] of [['cutoff10', 0.1], ['cutoff50', 0.5]] as const) {
		if (findCutoff(x, t, level) !== null) continue;
		if (t[n - 1] < level) out[key] = `above the data range, T(${x[n - 1]} nm) = ${pct(t[n - 1])}`;
		else out[key] = `below the data range, T(${x[0]} nm) = ${pct(t[0])}`;
	}
	return out;
}
