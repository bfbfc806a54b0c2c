/**
 * The common wavelength grid (PRODUCT.md): 190–1100 nm, 0.5 nm for computation, 1 nm for the stored
 * search vector (911 Float32 values, 0 outside the measured range), and its BLOB encoding.
 */
import type { NormalisedSpectrum } from './types';
import { gridLength, resampleToGrid } from './resample';

export const GRID_FROM_NM = 190;
export const GRID_TO_NM = 1100;
/** Step of the computation grid, nm. */
export const COMPUTE_STEP_NM = 0.5;
/** Step of the stored search vector, nm. */
export const SEARCH_STEP_NM = 1;
/** Length of the search vector: 190..1100 nm at 1 nm = 911. */
export const SEARCH_LENGTH = gridLength(GRID_FROM_NM, GRID_TO_NM, SEARCH_STEP_NM);

/** Wavelengths fromNm, fromNm + stepNm, …, toNm (defaults: the 0.5 nm computation grid). */
export function makeGrid(fromNm = GRID_FROM_NM, toNm = GRID_TO_NM, stepNm = COMPUTE_STEP_NM): Float64Array {
	const n = gridLength(fromNm, toNm, stepNm);
	const g = new Float64Array(n);
	for (let i = 0; i < n; i++) g[i] = fromNm + i * stepNm;
	return g;
}

/** The 1 nm search vector of a normalised spectrum: linear interpolation, 0 outside the measured range. */
export function toSearchVector(spec: Pick<NormalisedSpectrum, 'x' | 'y'>): Float32Array {
	const r = resampleToGrid(spec.x, spec.y, GRID_FROM_NM, GRID_TO_NM, SEARCH_STEP_NM);
	const v = new Float32Array(SEARCH_LENGTH);
	for (let i = 0; i < SEARCH_LENGTH; i++) v[i] = Number.isFinite(r[i]) ? r[i] : 0;
	return v;
}

/** Float32 vector → little-endian bytes (for a BLOB column). */
export function vectorToBuffer(v: Float32Array): Uint8Array {
	const out = new Uint8Array(v.length * 4);
	const view = new DataView(out.buffer);
	for (let i = 0; i < v.length; i++) view.setFloat32(i * 4, v[i], true);
	return out;
}

/**
 * Little-endian bytes → Float32 vector (copies, so any alignment works).
 * @throws RangeError when the byte length is not a multiple of 4
 */
export function bufferToVector(buf: Uint8Array): Float32Array {
	if (buf.byteLength % 4 !== 0) throw new RangeError(`buffer of ${buf.byteLength} bytes is not a Float32 vector`);
	const view = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
	const v = new Float32Array(buf.byteLength / 4);
	for (let i = 0; i < v.length; i++) v[i] = view.getFloat32(i * 4, true);
	return v;
}
