/**
 * Filters on the stored 1 nm search vectors (190–1100 nm, index = λ − 190):
 * "absorbs at λ with at least A or ε" and "transparent above λ".
 *
 * Two forms of each rule: over a whole vector (vectorAt, absorptionAt, absorbsAt, transparentAbove —
 * the plain statement of the rule, which the tests hold the fast form to), and from what the Library
 * index keeps per spectrum (absorbsAtValue with its value at λ and maximum, transparentAboveFromFacts),
 * which the searches use.
 */
import { GRID_FROM_NM, SEARCH_LENGTH } from '../../spectra/grid';

/** Linear interpolation of the vector at wavelength λ (nm); 0 outside 190–1100 nm. */
export function vectorAt(v: Float32Array, wavelengthNm: number): number {
	const p = wavelengthNm - GRID_FROM_NM;
	if (p < 0 || p > SEARCH_LENGTH - 1) return 0;
	const i = Math.floor(p);
	const t = p - i;
	return i + 1 < v.length ? v[i] * (1 - t) + v[i + 1] * t : v[i];
}

export interface AbsorbsAtRule {
	wavelengthNm: number;
	minAbsorbance?: number;
	minEpsilon?: number;
}

/** The row fields the rules read. */
export interface VectorRow {
	kind: string;
	y_unit: string;
	concentration_m: number | null;
	path_cm: number | null;
}

/**
 * Absorbance (if known) and ε (if known) of an absorption spectrum at λ. A = ε·c·l (Beer–Lambert)
 * when ε, concentration and path are stored.
 */
export function absorptionAt(row: VectorRow, v: Float32Array, wavelengthNm: number): { absorbance?: number; epsilon?: number } {
	return absorptionOf(row, vectorAt(v, wavelengthNm));
}

/** absorptionAt() from the vector's value y at λ. */
export function absorptionOf(row: VectorRow, y: number): { absorbance?: number; epsilon?: number } {
	if (row.y_unit === 'absorbance') return { absorbance: y };
	if (row.y_unit !== 'epsilon') return {};
	const cl = row.concentration_m && row.path_cm ? row.concentration_m * row.path_cm : undefined;
	return { epsilon: y, ...(cl ? { absorbance: y * cl } : {}) };
}

/**
 * Whether an absorption spectrum absorbs at λ: with at least `minAbsorbance` OR at least `minEpsilon`
 * where given; with neither threshold, at least 10 % of its own maximum (common practice).
 */
export function absorbsAt(row: VectorRow, v: Float32Array, rule: AbsorbsAtRule): boolean {
	if (row.kind !== 'absorption') return false;
	const at = absorptionAt(row, v, rule.wavelengthNm);
	if (rule.minAbsorbance === undefined && rule.minEpsilon === undefined) {
		let max = 0;
		for (let i = 0; i < v.length; i++) if (v[i] > max) max = v[i];
		const y = vectorAt(v, rule.wavelengthNm);
		return max > 0 && y >= 0.1 * max;
	}
	const okA = rule.minAbsorbance !== undefined && at.absorbance !== undefined && at.absorbance >= rule.minAbsorbance;
	const okE = rule.minEpsilon !== undefined && at.epsilon !== undefined && at.epsilon >= rule.minEpsilon;
	return okA || okE;
}

/**
 * Whether a spectrum lets light through above λ: absorption — everywhere above λ below 5 % of its
 * maximum; transmission — T ≥ 0.5 wherever it was measured above λ. Emission spectra never match.
 */
export function transparentAbove(row: VectorRow, v: Float32Array, wavelengthNm: number): boolean {
	const start = Math.max(0, Math.ceil(wavelengthNm - GRID_FROM_NM));
	if (row.kind === 'transmission') {
		let measured = 0;
		for (let i = start; i < v.length; i++) {
			if (v[i] === 0) continue; // outside the measured range
			measured++;
			if (v[i] < 0.5) return false;
		}
		return measured > 0;
	}
	if (row.kind !== 'absorption') return false;
	let max = 0;
	for (let i = 0; i < v.length; i++) if (v[i] > max) max = v[i];
	if (!(max > 0)) return false;
	for (let i = start; i < v.length; i++) if (v[i] > 0.05 * max) return false;
	return true;
}

/**
 * Per-vector facts that make "absorbs at" (without thresholds) and "transparent above" O(1) per
 * spectrum: the maximum, the last index above 5 % of it, the last measured (non-zero) index and the
 * last measured index with T < 0.5. `transparentAboveFromFacts` gives exactly `transparentAbove`.
 */
export interface VectorFacts {
	max: number;
	lastAbove5pct: number;
	lastMeasured: number;
	lastBelowHalf: number;
}

/** The facts of one vector (`v` may be a view into a larger array). */
export function vectorFacts(v: Float32Array): VectorFacts {
	let max = 0;
	for (let i = 0; i < v.length; i++) if (v[i] > max) max = v[i];
	let lastAbove5pct = -1;
	let lastMeasured = -1;
	let lastBelowHalf = -1;
	for (let i = 0; i < v.length; i++) {
		if (v[i] > 0.05 * max) lastAbove5pct = i;
		if (v[i] !== 0) {
			lastMeasured = i;
			if (v[i] < 0.5) lastBelowHalf = i;
		}
	}
	return { max, lastAbove5pct, lastMeasured, lastBelowHalf };
}

/** `transparentAbove` from the facts of the vector. */
export function transparentAboveFromFacts(kind: string, f: VectorFacts, wavelengthNm: number): boolean {
	const start = Math.max(0, Math.ceil(wavelengthNm - GRID_FROM_NM));
	if (kind === 'transmission') return f.lastBelowHalf < start && f.lastMeasured >= start;
	if (kind !== 'absorption') return false;
	return f.max > 0 && f.lastAbove5pct < start;
}

/** `absorbsAt` from the vector's value y at λ and its maximum (no pass over the vector). */
export function absorbsAtValue(row: VectorRow, y: number, max: number, rule: AbsorbsAtRule): boolean {
	if (row.kind !== 'absorption') return false;
	if (rule.minAbsorbance === undefined && rule.minEpsilon === undefined) return max > 0 && y >= 0.1 * max;
	const at = absorptionOf(row, y);
	const okA = rule.minAbsorbance !== undefined && at.absorbance !== undefined && at.absorbance >= rule.minAbsorbance;
	const okE = rule.minEpsilon !== undefined && at.epsilon !== undefined && at.epsilon >= rule.minEpsilon;
	return okA || okE;
}
