/** The derived values stored with each spectrum (API.md: lambdaMaxNm, edgeNm, cutoff10Nm, cutoff50Nm, peaks, search vector). */
import { findAbsorptionEdge, findCutoff, findMaxIndex, type RangeNm } from './bands';
import { toSearchVector } from './grid';
import { findPeaks } from './peaks';
import type { NormalisedSpectrum, SpectrumDerived } from './types';

export interface DeriveOptions {
	/** Wavelength range searched for λmax and the edge (default: all data); e.g. `{ fromNm: 230 }` to skip a solvent cut-off region. */
	range?: RangeNm;
}

/**
 * λmax (largest sample; absorption and emission), value at λmax, absorption edge (absorption),
 * 10 % / 50 % cut-offs (transmission), gsd peaks and the 1 nm search vector.
 */
export function deriveSpectrum(spec: NormalisedSpectrum, options: DeriveOptions = {}): SpectrumDerived {
	const { x, y } = spec;
	const isT = spec.kind === 'transmission';
	const top = isT ? -1 : findMaxIndex(x, y, options.range);
	const lo = options.range?.fromNm ?? -Infinity;
	const hi = options.range?.toNm ?? Infinity;
	return {
		lambdaMaxNm: top >= 0 ? x[top] : null,
		valueAtMax: top >= 0 ? y[top] : null,
		edgeNm: spec.kind === 'absorption' ? findAbsorptionEdge(x, y, 0.1, options.range) : null,
		cutoff10Nm: isT ? findCutoff(x, y, 0.1) : null,
		cutoff50Nm: isT ? findCutoff(x, y, 0.5) : null,
		peaks: findPeaks(spec).filter((p) => p.wavelengthNm >= lo && p.wavelengthNm <= hi),
		searchVector: toSearchVector(spec)
	};
}
