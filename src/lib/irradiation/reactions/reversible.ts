/**
 * Reversible photoreaction S ⇌ P (E/Z photoswitches, ring opening/closing): S → P with Φ_f per photon S absorbs,
 * P → S with Φ_b per photon P absorbs, optionally P → S thermally with first-order k_T (s⁻¹).
 *
 *   dX/dt = [Φ_f·q_abs,S(X) − Φ_b·q_abs,P(X)]/n₀ − k_T·X,   X = n_P/(n_S + n_P)
 *   q_abs,i = ∫ q_in·A_i·g(A_S + A_P + A_fixed) dλ,  A_S = ε_S·c₀·l·(1 − X),  A_P = ε_P·c₀·l·X
 *
 * (rate = Φ × absorbed photon flux, IUPAC Glossary 2007). The photostationary state X_pss is where the net rate is
 * zero; under polychromatic light it depends on the lamp's whole photon spectrum and the inner filter, and is found
 * by bisection. Under monochromatic light (and k_T = 0) both species share the same inner-filter factor and
 * X_pss = ε_S·Φ_f/(ε_S·Φ_f + ε_P·Φ_b) (the classical photostationary-state relation, e.g. Zimmerman, Chow & Paik,
 * J. Am. Chem. Soc. 80, 3528 (1958)); `photostationaryCurve` gives that over wavelength.
 */
import { absorbedFractionPerAbsorbance } from '../innerFilter';
import type { NumberArray, WavelengthGrid } from '../wavelengthGrid';
import { finiteOrNull, integrateConversion, packLight, percent, pick, type ReactionTimes } from './kinetics';

export interface ReversibleInput {
	stepNm: number;
	photonFluxInMixturePerNm: NumberArray;
	pathCm: number;
	volumeL: number;
	amountMol?: number;
	substrateEpsilon: NumberArray;
	substrateConcentrationM: number;
	productEpsilon: NumberArray;
	fixedAbsorbance?: NumberArray;
	/** Φ_f, S → P. */
	quantumYield: number;
	/** Φ_b, P → S (≥ 0). */
	quantumYieldBack: number;
	/** k_T, P → S in the dark, s⁻¹ (default 0). */
	thermalBackRateConstantPerS?: number;
	fractionPerAbsorbance?: (a: number) => number;
}

export interface PreparedReversible {
	amountMol: number;
	/** { S, P } absorbed photon fluxes (einstein s⁻¹) at product fraction X. */
	absorbedFluxes(x: number): { substrate: number; product: number };
	/** dX/dt, s⁻¹. */
	netRate(x: number): number;
	quantumYield: number;
}

export function prepareReversible(input: ReversibleInput): PreparedReversible {
	const l = input.pathCm;
	const eS = input.substrateEpsilon, eP = input.productEpsilon;
	const light = packLight(input.photonFluxInMixturePerNm, input.stepNm, (i) => eS[i] > 0 || eP[i] > 0);
	const c0l = input.substrateConcentrationM * l;
	const aS = pick(eS, light, c0l), aP = pick(eP, light, c0l), aF = pick(input.fixedAbsorbance, light);
	const w = light.weight;
	const m = w.length;
	const g = input.fractionPerAbsorbance ?? absorbedFractionPerAbsorbance;
	const amountMol = input.amountMol ?? input.substrateConcentrationM * input.volumeL;
	const phiF = input.quantumYield, phiB = input.quantumYieldBack, kT = input.thermalBackRateConstantPerS ?? 0;
	const absorbedFluxes = (x: number) => {
		let s = 0, p = 0;
		for (let k = 0; k < m; k++) {
			const a1 = aS[k] * (1 - x), a2 = aP[k] * x;
			const gg = w[k] * g(a1 + a2 + aF[k]);
			s += a1 * gg;
			p += a2 * gg;
		}
		return { substrate: s, product: p };
	};
	return {
		amountMol,
		quantumYield: phiF,
		absorbedFluxes,
		netRate(x) {
			const f = absorbedFluxes(x);
			return (phiF * f.substrate - phiB * f.product) / amountMol - kT * x;
		}
	};
}

/** Photostationary product fraction X_pss ∈ [0, 1] (bisection on the sign of the net rate, 1e-12 in X). */
export function photostationaryFraction(p: PreparedReversible): number {
	if (!(p.netRate(0) > 0)) return 0;
	const r1 = p.netRate(1);
	if (r1 >= 0) return 1;
	let lo = 0, hi = 1;
	for (let k = 0; k < 60 && hi - lo > 1e-13; k++) {
		const mid = 0.5 * (lo + hi);
		if (p.netRate(mid) > 0) lo = mid;
		else hi = mid;
	}
	return 0.5 * (lo + hi);
}

export interface ReversibleTimes extends ReactionTimes {
	photostationaryProductFraction: number;
	timeTo50PctOfStationaryS: number | null;
	timeTo90PctOfStationaryS: number | null;
	timeTo99PctOfStationaryS: number | null;
}

/** Photostationary state, times to 50/90/99 % of it and to 50/90/99 % conversion where those lie below it. */
export function reversibleTimes(p: PreparedReversible, stepsPerDecade = 48): ReversibleTimes {
	const xp = photostationaryFraction(p);
	const none = { timeS: [0], conversion: [0] };
	if (!(xp > 0)) {
		return {
			photostationaryProductFraction: 0, timeTo50PctOfStationaryS: null, timeTo90PctOfStationaryS: null, timeTo99PctOfStationaryS: null,
			initialRateTimeTo90PctS: null, timeTo50PctS: null, timeTo90PctS: null, timeTo99PctS: null,
			unreachableReason: 'the substrate absorbs none of this lamp’s light', limitConversion: 0, curve: none
		};
	}
	const targets = [0.5 * xp, 0.9 * xp, 0.99 * xp, 0.5, 0.9, 0.99];
	const course = integrateConversion((x) => p.netRate(x), xp, targets, stepsPerDecade);
	const [s50, s90, s99, t50, t90, t99] = course.times;
	let reason: string | null = null;
	if (t99 === null) {
		const which = t50 === null ? '50' : t90 === null ? '90' : '99';
		reason = `under this lamp the photostationary state holds ${percent(xp, 1)} product, so ${which} % conversion cannot be reached (the product photoreverts); a wavelength where the product absorbs less gives more`;
	}
	const q0 = p.absorbedFluxes(0).substrate;
	return {
		photostationaryProductFraction: xp,
		timeTo50PctOfStationaryS: s50,
		timeTo90PctOfStationaryS: s90,
		timeTo99PctOfStationaryS: s99,
		initialRateTimeTo90PctS: t90 === null ? null : finiteOrNull((0.9 * p.amountMol) / (p.quantumYield * q0)),
		timeTo50PctS: t50,
		timeTo90PctS: t90,
		timeTo99PctS: t99,
		unreachableReason: reason,
		limitConversion: xp,
		curve: course.curve
	};
}

export interface PhotostationaryCurve {
	wavelengthNm: number[];
	productFraction: number[];
}

/**
 * Monochromatic photostationary product fraction over wavelength, x(λ) = ε_S·Φ_f/(ε_S·Φ_f + ε_P·Φ_b), at every
 * `every`-th grid point where the mixture absorbs (ε_S + ε_P > minEpsilon); photochemical only (no thermal step).
 */
export function photostationaryCurve(grid: WavelengthGrid, eS: NumberArray, eP: NumberArray, phiF: number, phiB: number, every = 2, minEpsilon = 1e-9): PhotostationaryCurve {
	const wavelengthNm: number[] = [], productFraction: number[] = [];
	for (let i = 0; i < grid.count; i += every) {
		if (!(eS[i] + eP[i] > minEpsilon)) continue;
		const f = eS[i] * phiF, b = eP[i] * phiB;
		wavelengthNm.push(grid.fromNm + i * grid.stepNm);
		productFraction.push(f + b > 0 ? f / (f + b) : 0);
	}
	return { wavelengthNm, productFraction };
}
