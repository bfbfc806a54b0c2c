/**
 * Inner filter: how the photons that pass the wall are shared between the absorbing species,
 * the solvent, and the light that leaves the mixture unabsorbed.
 *
 * Sources: Beer–Lambert law (A = ε·c·l, decadic); fraction absorbed by species i in a mixture
 * f_i = (A_i/A_tot)·(1 − 10^(−A_tot)), A_tot = Σ A_j + A_solv (PRODUCT.md; IUPAC Glossary of
 * Terms Used in Photochemistry, 3rd ed., Pure Appl. Chem. 79, 293 (2007)); absorbed photon flux
 * q_abs,i = ∫ q(λ)·T_wall(λ)·f_i(λ) dλ, selectivity = q_abs,S / Σ_i q_abs,i (PRODUCT.md).
 * Integrals use the trapezoid rule on the uniform grid.
 */
import type { NumberArray } from './wavelengthGrid';

const LN10 = Math.LN10;

/** Species absorbance over the path, A(λ) = ε(λ)·c·l (Beer–Lambert). ε in M⁻¹ cm⁻¹, c in M, l in cm. */
export function speciesAbsorbance(epsilonPerMPerCm: NumberArray, concentrationM: number, pathCm: number): Float64Array {
	const out = new Float64Array(epsilonPerMPerCm.length);
	const k = concentrationM * pathCm;
	for (let i = 0; i < out.length; i++) out[i] = epsilonPerMPerCm[i] * k;
	return out;
}

/**
 * Absorbance spectrum measured over `measuredPathCm` (and at the reaction concentration) scaled to
 * the reaction path: A(l) = A(l₀)·l/l₀ (Beer–Lambert). Also used for the solvent: pass its
 * absorbance per cm with measuredPathCm = 1.
 */
export function scaleAbsorbance(absorbance: NumberArray, measuredPathCm: number, pathCm: number): Float64Array {
	const out = new Float64Array(absorbance.length);
	const k = pathCm / measuredPathCm;
	for (let i = 0; i < out.length; i++) out[i] = absorbance[i] * k;
	return out;
}

/**
 * (1 − 10^(−A))/A, the factor that turns a species' absorbance into its absorbed fraction
 * (f_i = A_i·g(A_tot)); → ln 10 as A → 0. expm1 keeps precision for small A.
 */
export function absorbedFractionPerAbsorbance(totalAbsorbance: number): number {
	return totalAbsorbance > 1e-12 ? -Math.expm1(-LN10 * totalAbsorbance) / totalAbsorbance : LN10;
}

/** Fraction of incident photons absorbed by a species of absorbance `a` in a mixture of total `aTotal` (IUPAC 2007). */
export function fractionAbsorbed(a: number, aTotal: number): number {
	return a * absorbedFractionPerAbsorbance(aTotal);
}

export interface AbsorbedFluxInput {
	/** Grid step (nm). */
	stepNm: number;
	/** Lamp photon flux per nm reaching the outside of the wall, einstein s⁻¹ nm⁻¹. */
	photonFluxPerNm: NumberArray;
	/** Wall transmission 0–1. */
	wallTransmission: NumberArray;
	/** Absorbance over the path of each species; index 0 is the substrate. */
	speciesAbsorbance: NumberArray[];
	/** Solvent absorbance over the path. */
	solventAbsorbance: NumberArray;
	/** Vessel geometry g(A) = F(A)/A (vessels.ts); default the flat layer (1 − 10^(−A))/A. */
	fractionPerAbsorbance?: (absorbance: number) => number;
}

export interface AbsorbedFlux {
	/** ∫q dλ, einstein s⁻¹. */
	incidentEinsteinPerS: number;
	/** Absorbed photon flux of each species (same order as the input), einstein s⁻¹. */
	perSpeciesEinsteinPerS: Float64Array;
	/** q_abs,substrate / Σ_i q_abs,i (0 when nothing absorbs). */
	selectivity: number;
	/** Shares of the incident photons (sum to 1): lost in the wall, absorbed by the solvent, by each species, transmitted. */
	shares: { wall: number; solvent: number; species: Float64Array; transmitted: number };
}

/**
 * Absorbed photon flux per species and the photon budget (wall / solvent / species / transmitted).
 * Trapezoid rule; one pass over the grid, no per-point allocation.
 */
export function absorbedPhotonFlux(input: AbsorbedFluxInput): AbsorbedFlux {
	const { stepNm, photonFluxPerNm: q, wallTransmission: t, speciesAbsorbance: sp, solventAbsorbance: solv } = input;
	const gOf = input.fractionPerAbsorbance ?? absorbedFractionPerAbsorbance;
	const slab = gOf === absorbedFractionPerAbsorbance;
	const n = q.length;
	const m = sp.length;
	const perSpecies = new Float64Array(m);
	let incident = 0;
	let wall = 0;
	let solvent = 0;
	let transmitted = 0;
	for (let i = 0; i < n; i++) {
		const qi = q[i];
		if (qi === 0) continue;
		// trapezoid weight on a uniform grid: half at both ends
		const w = i === 0 || i === n - 1 ? 0.5 * stepNm : stepNm;
		const inc = qi * w;
		const through = inc * t[i];
		let aTot = solv[i];
		for (let j = 0; j < m; j++) aTot += sp[j][i];
		const g = gOf(aTot);
		incident += inc;
		wall += inc - through;
		solvent += through * solv[i] * g;
		for (let j = 0; j < m; j++) perSpecies[j] += through * sp[j][i] * g;
		// what the liquid does not absorb leaves it (slab: 10^(−A_tot); other shapes: 1 − F(A_tot))
		transmitted += slab ? through * Math.exp(-LN10 * aTot) : through * Math.max(0, 1 - aTot * g);
	}
	let speciesTotal = 0;
	for (let j = 0; j < m; j++) speciesTotal += perSpecies[j];
	const share = (x: number) => (incident > 0 ? x / incident : 0);
	const speciesShares = new Float64Array(m);
	for (let j = 0; j < m; j++) speciesShares[j] = share(perSpecies[j]);
	return {
		incidentEinsteinPerS: incident,
		perSpeciesEinsteinPerS: perSpecies,
		selectivity: speciesTotal > 0 && m > 0 ? perSpecies[0] / speciesTotal : 0,
		shares: { wall: share(wall), solvent: share(solvent), species: speciesShares, transmitted: share(transmitted) }
	};
}
