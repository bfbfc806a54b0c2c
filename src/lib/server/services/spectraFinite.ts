/**
 * Last guard before a spectrum row is written: every stored number must be finite (MariaDB DOUBLE takes no NaN or
 * Infinity, and a NaN inside a Float64 BLOB would poison every later computation). Parsing refuses such data
 * earlier with a line number; reaching this guard means a bug upstream, answered as 422 naming the field, not 500.
 */
import { ApiError } from '../http';
import type { PreparedSpectrum } from './spectraPrepare';

function firstBad(values: ArrayLike<number>): number {
	for (let i = 0; i < values.length; i++) if (!Number.isFinite(values[i])) return i;
	return -1;
}

/** @throws ApiError 422 (`not_finite`) naming the spectrum, the field and the index of the first bad value */
export function assertFiniteSpectra(spectra: PreparedSpectrum[], filename: string): void {
	spectra.forEach((s, k) => {
		const d = s.derived;
		const arrays: [string, ArrayLike<number>][] = [
			['x (file)', s.raw.x], ['y (file)', s.raw.y], ['wavelength (nm)', s.norm.x], ['y (normalised)', s.norm.y], ['search vector', d.searchVector],
			['peaks', d.peaks.flatMap((p) => [p.wavelengthNm, p.value])]
		];
		const scalars: [string, number | null][] = [['lambdaMaxNm', d.lambdaMaxNm], ['valueAtMax', d.valueAtMax], ['edgeNm', d.edgeNm], ['cutoff10Nm', d.cutoff10Nm], ['cutoff50Nm', d.cutoff50Nm]];
		for (const [field, v] of scalars) if (v !== null && v !== undefined && !Number.isFinite(v)) arrays.push([field, [v]]);
		for (const [field, values] of arrays) {
			const i = firstBad(values);
			if (i < 0) continue;
			const line = field.endsWith('(file)') ? s.raw.lines?.[i] : undefined;
			throw new ApiError(422, 'physically_invalid', `${filename}: spectrum ${k + 1} ("${s.raw.label}"): ${field} holds a non-finite value (${values[i]}) at point ${i + 1}${line ? `, line ${line}` : ''}; nothing was stored`, { field, line, block: s.raw.index });
		}
	});
}
