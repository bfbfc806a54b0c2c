/**
 * The lamp × absorber matrix of a group: for every absorber alone at one concentration in one solvent, behind one
 * wall, the photon flux each lamp delivers into it, q_abs = ∫ q(λ)·T_wall(λ)·f(λ) dλ with the inner-filter fraction
 * f = (A/A_tot)(1 − 10^(−A_tot)), A_tot = A + A_solvent (IUPAC Glossary of Terms Used in Photochemistry, 3rd ed.,
 * Pure Appl. Chem. 79, 293 (2007)); slab vessel lit face-on (the model the page names beside the numbers).
 *
 * Built on the ranking core (rank.ts): one call per absorber ranks every lamp through the wall, with the solvent
 * passed as the only other absorber, so `selectivity` is the absorber's share of the photons absorbed in the
 * mixture (q_abs / (q_abs + q_abs,solvent)). Pure: no framework, database or DOM imports.
 */
import { rankCombinations, type RankLamp } from './rank';
import type { NumberArray } from './wavelengthGrid';

export interface MatrixAbsorber {
	id: string;
	/** Decadic molar absorptivity ε on the grid, M⁻¹ cm⁻¹. */
	epsilon: NumberArray;
}

export interface AbsorberMatrixInput {
	stepNm: number;
	/** Optical depth of the liquid, cm. */
	pathCm: number;
	/** The concentration every absorber is taken at, mol L⁻¹. */
	concentrationM: number;
	/** Solvent absorbance per cm on the grid. */
	solventAbsorbancePerCm: NumberArray;
	/** Wall transmission (0–1) on the grid. */
	wallTransmission: NumberArray;
	lamps: RankLamp[];
	absorbers: MatrixAbsorber[];
}

export interface AbsorberMatrix {
	lampCount: number;
	absorberCount: number;
	/** q_abs of absorber a under lamp l at index a·lampCount + l, einstein s⁻¹. */
	absorbedPhotonFluxEinsteinPerS: Float64Array;
	/** q_abs / (q_abs + q_abs,solvent) at the same index (0 when nothing is absorbed). */
	selectivity: Float64Array;
	/** ∫q dλ of each lamp, einstein s⁻¹ (before the wall). */
	lampFluxEinsteinPerS: Float64Array;
}

/** Computes every lamp × absorber cell. Throws RangeError for a non-positive path or a negative concentration. */
export function computeAbsorberMatrix(input: AbsorberMatrixInput): AbsorberMatrix {
	const { stepNm, pathCm, concentrationM, lamps, absorbers } = input;
	if (!(pathCm > 0)) throw new RangeError('pathCm must be above 0');
	if (!(concentrationM >= 0)) throw new RangeError('concentrationM must not be negative');
	const n = input.wallTransmission.length;
	const L = lamps.length;
	const A = absorbers.length;
	const flux = new Float64Array(A * L);
	const sel = new Float64Array(A * L);
	let lampFlux = new Float64Array(L);
	const solventOverPath = new Float64Array(n);
	for (let i = 0; i < n; i++) solventOverPath[i] = input.solventAbsorbancePerCm[i] * pathCm;
	const noSolvent = [{ id: 'none', name: 'none', absorbancePerCm: new Float64Array(n) }];
	const walls = [{ id: 'wall', name: 'wall', transmission: input.wallTransmission }];
	const aS = new Float64Array(n);
	const scale = concentrationM * pathCm;
	for (let a = 0; a < A; a++) {
		const eps = absorbers[a].epsilon;
		for (let i = 0; i < n; i++) aS[i] = eps[i] * scale;
		const r = rankCombinations({ stepNm, pathCm, substrateAbsorbance: aS, otherAbsorbance: solventOverPath, lamps, walls, solvents: noSolvent });
		// With one wall and one solvent the combination index is the lamp index.
		for (let l = 0; l < L; l++) {
			const q = r.substrateFluxEinsteinPerS[l];
			const all = r.speciesFluxEinsteinPerS[l];
			flux[a * L + l] = q;
			sel[a * L + l] = all > 0 ? q / all : 0;
		}
		if (a === 0) lampFlux = Float64Array.from(r.lampFluxEinsteinPerS);
	}
	return { lampCount: L, absorberCount: A, absorbedPhotonFluxEinsteinPerS: flux, selectivity: sel, lampFluxEinsteinPerS: lampFlux };
}
