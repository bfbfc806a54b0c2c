/**
 * Photocatalytic (or photosensitised) mode: the photocatalyst is the intended absorber and is not consumed; the
 * substrate is consumed at Φ·q_abs,cat, Φ = substrate molecules converted per photon the photocatalyst absorbs
 * (0 < Φ ≤ 10⁴: radical chains give Φ > 1). The substrate and the product still absorb and compete for the light.
 *
 *   dn_S/dt = −Φ·q_abs,cat(X),  q_abs,cat = ∫ q_in·A_cat·g(A_cat + A_S + A_P + A_fixed) dλ
 *   A_cat = ε_cat·c_cat·l·y,  A_S = ε_S·c₀·l·(1 − X),  A_P = ε_P·ν·c₀·l·X.
 *
 * Optional bleaching: the photocatalyst decomposes with Φ_dec per photon it absorbs, dn_cat/dt = −Φ_dec·q_abs,cat.
 * Both rates are driven by the same q_abs,cat, so dn_cat/dn_S = Φ_dec/Φ and the catalyst left is linear in the
 * conversion, y = 1 − β·X with β = Φ_dec·n₀/(Φ·n_cat,0); the reaction stops at X_lim = 1/β.
 *
 * With a transparent substrate and product and no bleaching q_abs,cat is constant and the law is zero order,
 * t(X) = X·n₀/(Φ·q_abs,cat) — checked in the tests. Φ is taken as independent of the substrate concentration
 * (quenching efficiency constant); at low [S] real reactions slow down, which the explanation says.
 */
import { absorbedFractionPerAbsorbance } from '../innerFilter';
import type { NumberArray } from '../wavelengthGrid';
import { finiteOrNull, integrateConversion, packLight, percent, pick, type ReactionTimes } from './kinetics';

export interface PhotocatalyticInput {
	stepNm: number;
	/** q(λ)·T_wall(λ) inside the wall, einstein s⁻¹ nm⁻¹. */
	photonFluxInMixturePerNm: NumberArray;
	/** Length the absorbances are computed over (vessels.ts referencePathCm). */
	pathCm: number;
	volumeL: number;
	/** Substrate amount, mol; default c₀·V. */
	amountMol?: number;
	catalystEpsilon: NumberArray;
	catalystConcentrationM: number;
	/** Φ_dec: photocatalyst molecules destroyed per photon it absorbs (default 0: stable). */
	catalystBleachingQuantumYield?: number;
	substrateEpsilon: NumberArray;
	substrateConcentrationM: number;
	productEpsilon?: NumberArray;
	productPerSubstrate?: number;
	/** Absorbance over the path that does not change (solvent + additives). */
	fixedAbsorbance?: NumberArray;
	/** Φ per photon absorbed by the photocatalyst. */
	quantumYield: number;
	fractionPerAbsorbance?: (a: number) => number;
}

export interface PreparedPhotocatalytic {
	amountMol: number;
	quantumYield: number;
	/** β = Φ_dec·n₀/(Φ·n_cat,0): catalyst fraction lost per unit conversion. */
	bleachingPerConversion: number;
	/** q_abs,cat (einstein s⁻¹) at conversion X. */
	catalystAbsorbedFlux(conversion: number): number;
}

export function preparePhotocatalytic(input: PhotocatalyticInput): PreparedPhotocatalytic {
	const l = input.pathCm;
	const eC = input.catalystEpsilon;
	const light = packLight(input.photonFluxInMixturePerNm, input.stepNm, (i) => eC[i] > 0);
	const aC = pick(eC, light, input.catalystConcentrationM * l);
	const aS = pick(input.substrateEpsilon, light, input.substrateConcentrationM * l);
	const aP = pick(input.productEpsilon, light, (input.productPerSubstrate ?? 1) * input.substrateConcentrationM * l);
	const aF = pick(input.fixedAbsorbance, light);
	const w = light.weight;
	const g = input.fractionPerAbsorbance ?? absorbedFractionPerAbsorbance;
	const amountMol = input.amountMol ?? input.substrateConcentrationM * input.volumeL;
	const catalystMol = input.catalystConcentrationM * input.volumeL;
	const phiDec = input.catalystBleachingQuantumYield ?? 0;
	const beta = phiDec > 0 && catalystMol > 0 ? (phiDec * amountMol) / (input.quantumYield * catalystMol) : 0;
	const m = w.length;
	return {
		amountMol,
		quantumYield: input.quantumYield,
		bleachingPerConversion: beta,
		catalystAbsorbedFlux(x) {
			const y = Math.max(0, 1 - beta * x);
			let sum = 0;
			for (let k = 0; k < m; k++) {
				const a = aC[k] * y;
				sum += w[k] * a * g(a + aS[k] * (1 - x) + aP[k] * x + aF[k]);
			}
			return sum;
		}
	};
}

/** Times to 50/90/99 % conversion of the substrate; bleaching may put some out of reach (null + reason). */
export function photocatalyticTimes(p: PreparedPhotocatalytic, stepsPerDecade = 48): ReactionTimes {
	const q0 = p.catalystAbsorbedFlux(0);
	const limit = p.bleachingPerConversion > 0 ? 1 / p.bleachingPerConversion : Infinity;
	if (!(q0 > 0)) {
		return { initialRateTimeTo90PctS: null, timeTo50PctS: null, timeTo90PctS: null, timeTo99PctS: null, unreachableReason: 'the photocatalyst absorbs none of this lamp’s light', limitConversion: 0, curve: { timeS: [0], conversion: [0] } };
	}
	const rate = (x: number) => (p.quantumYield * p.catalystAbsorbedFlux(x)) / p.amountMol;
	const course = integrateConversion(rate, limit, [0.5, 0.9, 0.99, Math.min(1, Number.isFinite(limit) ? 0.999 * limit : 1)], stepsPerDecade);
	const [t50, t90, t99] = course.times;
	const limitConversion = Math.min(1, limit);
	const unreachableReason =
		limitConversion < 0.99
			? `the photocatalyst is bleached (Φ_dec) after about ${percent(limitConversion)} conversion, so ${limitConversion < 0.5 ? '50' : limitConversion < 0.9 ? '90' : '99'} % and more cannot be reached with this loading`
			: null;
	return {
		initialRateTimeTo90PctS: t90 === null ? null : finiteOrNull((0.9 * p.amountMol) / (p.quantumYield * q0)),
		timeTo50PctS: t50,
		timeTo90PctS: t90,
		timeTo99PctS: t99,
		unreachableReason,
		limitConversion,
		curve: course.curve
	};
}
