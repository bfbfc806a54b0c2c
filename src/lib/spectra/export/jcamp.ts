/**
 * JCAMP-DX export through convert-to-jcamp `fromJSON` (a `##PEAK TABLE=(XY..XY)` with full-precision
 * numbers). Units are passed explicitly (`fromVariables` may put a y label's unit on x).
 */
import { fromJSON } from 'convert-to-jcamp';
import type { NormalisedSpectrum, SpectrumFileMetadata } from '../types';
import { JCAMP_DATA_TYPE, JCAMP_Y_UNITS } from './labels';

const text = (v: unknown) => (v === undefined || v === null ? undefined : String(v).replace(/[\r\n]+/g, ' '));

/** Writes the spectrum with its metadata (title, owner, origin, CAS, solvent, concentration, path, date). */
export function exportJcamp(spec: NormalisedSpectrum, metadata: SpectrumFileMetadata = {}): string {
	const info: Record<string, string | number> = {
		title: text(metadata.title) ?? 'spectrum',
		dataType: JCAMP_DATA_TYPE[spec.kind],
		owner: text(metadata.owner) ?? '',
		origin: text(metadata.origin) ?? '',
		xUnits: 'NANOMETERS',
		yUnits: JCAMP_Y_UNITS[spec.yUnit]
	};
	const add = (label: string, v: unknown) => {
		const t = text(v);
		if (t !== undefined && t !== '') info[label] = t;
	};
	add('CAS REGISTRY NO', metadata.cas);
	add('SOLVENT NAME', metadata.solvent);
	add('CONCENTRATIONS', metadata.concentrationM === undefined ? undefined : `${metadata.concentrationM} M`);
	add('PATH LENGTH', metadata.pathCm === undefined ? undefined : `${metadata.pathCm} cm`);
	add('DATE', metadata.date);
	add('$KIND', spec.kind);
	// convert-to-jcamp 7.0.1 writes any |y| < ~1.1e-16 as 0 (getNumber snaps values within
	// Number.EPSILON of an integer) and divides twice by a yFactor it is given. So scale y here by an
	// exact power of two and write the inverse as YFACTOR ourselves: both steps are exact in binary.
	const k = yScaleExponent(spec.y);
	const y = Array.from(spec.y, (v) => v * 2 ** k);
	const out = fromJSON({ x: Array.from(spec.x), y }, { info });
	return k === 0 ? out : out.replace(/^##YFACTOR=1$/m, `##YFACTOR=${2 ** -k}`);
}

/** Power of two that lifts the smallest non-zero |y| to ≥ 1e-6 (0 when not needed). */
function yScaleExponent(y: ArrayLike<number>): number {
	let min = Infinity;
	for (let i = 0; i < y.length; i++) {
		const a = Math.abs(y[i]);
		if (a > 0 && a < min) min = a;
	}
	return min < 1e-6 && Number.isFinite(min) ? Math.min(1000, Math.ceil(Math.log2(1e-6 / min))) : 0;
}
