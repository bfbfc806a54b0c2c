/** The derived values added with the longest-band work, as the API shows them (spread into spectrumToApi). */
import type { SpectrumRow } from '../db/spectra';
import { parseDerivedExtra } from './spectraDerive';

/**
 * `longestWavelengthBandNm` (the lowest-energy band maximum above noise, absorption) with its ε or absorbance,
 * `excludedRanges` (saturated or noise stretches left out of λmax, peaks, bands and similarity) and `cutoffNotes`
 * (why a transmission cut-off is null, e.g. "below the data range, T(300 nm) = 81 %").
 */
export function derivedForApi(row: Pick<SpectrumRow, 'longest_band_nm' | 'derived_extra' | 'y_unit' | 'concentration_m' | 'path_cm'>) {
	const extra = parseDerivedExtra(row.derived_extra);
	const v = extra?.longestBandValue ?? null;
	const cl = row.concentration_m && row.path_cm ? row.concentration_m * row.path_cm : null;
	return {
		longestWavelengthBandNm: row.longest_band_nm ?? null,
		longestWavelengthBand:
			row.longest_band_nm == null || v === null
				? null
				: {
						wavelengthNm: row.longest_band_nm,
						...(row.y_unit === 'epsilon' ? { epsilon: v, ...(cl ? { absorbance: v * cl } : {}) } : row.y_unit === 'absorbance' ? { absorbance: v } : { value: v }),
						saturated: extra?.longestBandSaturated ?? false
					},
		excludedRanges: extra?.excluded ?? [],
		cutoffNotes: extra?.cutoffNotes ?? {}
	};
}
