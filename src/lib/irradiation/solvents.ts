/**
 * Solvent absorbance-edge model: A_1cm(λ) = 10^((λc − λ)/s), A = 1 at the cut-off λc and s ≈ 10 nm per
 * decade (the planner's documented cut-off model; label it "model" in the UI). Scaled by the path
 * length (Beer–Lambert): A(λ, l) = A_1cm(λ)·l, T = 10^(−A).
 */
import { SOLVENTS, type SolventRecord } from './data/solvents';

export { SOLVENTS, type SolventRecord, type ReferenceStatus } from './data/solvents';

/** Default edge slope, nm per decade of absorbance. */
export const DEFAULT_SOLVENT_SLOPE_NM_PER_DECADE = 10;

function checkSlope(slopeNmPerDecade: number): void {
	if (!(slopeNmPerDecade > 0) || !Number.isFinite(slopeNmPerDecade)) {
		throw new RangeError(`slopeNmPerDecade must be a positive number, got ${slopeNmPerDecade}`);
	}
}

/**
 * Decadic absorbance of a 1 cm path of the neat solvent at `wavelengthNm` from its cut-off `cutoffNm`.
 * @param slopeNmPerDecade edge slope s, default 10 nm/decade. Unbounded below the cut-off (≈ 1e90 at most on 190–1100 nm).
 */
export function solventAbsorbance1Cm(cutoffNm: number, wavelengthNm: number, slopeNmPerDecade = DEFAULT_SOLVENT_SLOPE_NM_PER_DECADE): number {
	checkSlope(slopeNmPerDecade);
	return 10 ** ((cutoffNm - wavelengthNm) / slopeNmPerDecade);
}

/**
 * Solvent absorbance over `pathCm` on the uniform grid fromNm + i·stepNm, i < count (Float64Array).
 * @param pathCm optical path, cm (default 1).
 */
export function solventAbsorbanceOnGrid(
	cutoffNm: number, fromNm: number, stepNm: number, count: number, pathCm = 1, slopeNmPerDecade = DEFAULT_SOLVENT_SLOPE_NM_PER_DECADE
): Float64Array {
	checkSlope(slopeNmPerDecade);
	if (!(pathCm >= 0)) throw new RangeError(`pathCm must be ≥ 0, got ${pathCm}`);
	const out = new Float64Array(count);
	for (let i = 0; i < count; i++) out[i] = pathCm * 10 ** ((cutoffNm - (fromNm + i * stepNm)) / slopeNmPerDecade);
	return out;
}

/** Transmittance (0–1) of `pathCm` of solvent at `wavelengthNm`: T = 10^(−A_1cm·l). */
export function solventTransmission(cutoffNm: number, wavelengthNm: number, pathCm: number, slopeNmPerDecade = DEFAULT_SOLVENT_SLOPE_NM_PER_DECADE): number {
	if (!(pathCm >= 0)) throw new RangeError(`pathCm must be ≥ 0, got ${pathCm}`);
	return 10 ** (-solventAbsorbance1Cm(cutoffNm, wavelengthNm, slopeNmPerDecade) * pathCm);
}

/**
 * Solvents whose modelled transmittance over `pathCm` at `wavelengthNm` is at least `minT` (default 0.9),
 * in order of cut-off.
 */
export function transmittingSolvents(
	wavelengthNm: number, pathCm: number, minT = 0.9, solvents: readonly SolventRecord[] = SOLVENTS
): SolventRecord[] {
	return solvents
		.filter((sv) => solventTransmission(sv.cutoffNm, wavelengthNm, pathCm) >= minT)
		.sort((a, b) => a.cutoffNm - b.cutoffNm);
}

/** Finds a solvent by id, name, synonym or CAS number (case-insensitive); undefined when unknown. */
export function findSolvent(query: string, solvents: readonly SolventRecord[] = SOLVENTS): SolventRecord | undefined {
	const q = query.trim().toLowerCase();
	return solvents.find(
		(sv) => sv.id === q || sv.name.toLowerCase() === q || sv.casNumber === q || sv.synonyms.some((y) => y.toLowerCase() === q)
	);
}
