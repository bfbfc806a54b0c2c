/**
 * Irradiation time: the initial-rate estimate t = n·X/(Φ·q_abs,S) and the time course of
 * dn_S/dt = −Φ·q_abs,S(t) while the product builds up and competes for the light (PRODUCT.md;
 * IUPAC Glossary of Terms Used in Photochemistry, 3rd ed., Pure Appl. Chem. 79, 293 (2007):
 * rate = Φ × absorbed photon flux). q_abs,S(X) = ∫ q_in(λ)·(A_S/A_tot)(1 − 10^(−A_tot)) dλ with
 * A_S = ε_S·c₀(1 − X)·l, A_P = ε_P·ν·c₀·X·l (ν mol product per mol substrate, 1:1 by default),
 * A_tot = A_S + A_P + A_fixed (solvent + other species). Conversion X = 1 − n_S/n₀.
 */
import { absorbedFractionPerAbsorbance } from './innerFilter';
import type { NumberArray } from './wavelengthGrid';

export interface KineticsInput {
	stepNm: number;
	/** Photon flux per nm inside the wall, q(λ)·T_wall(λ), einstein s⁻¹ nm⁻¹. */
	photonFluxInMixturePerNm: NumberArray;
	pathCm: number;
	/** Irradiated volume, L (sets n₀ = c₀·V unless amountMol is given). */
	volumeL: number;
	substrateEpsilon: NumberArray;
	substrateConcentrationM: number;
	/** Product ε (M⁻¹ cm⁻¹); omit for a transparent product. */
	productEpsilon?: NumberArray;
	/** mol product per mol substrate converted; default 1. */
	productPerSubstrate?: number;
	/** Absorbance over the path that does not change (solvent + photocatalyst + additives). */
	fixedAbsorbance?: NumberArray;
	/** Quantum yield of substrate conversion, 0 < Φ. */
	quantumYield: number;
	/** Substrate amount, mol; default c₀·V. */
	amountMol?: number;
	/** Vessel geometry g(A) = F(A)/A (vessels.ts); default the flat layer (1 − 10^(−A))/A. */
	fractionPerAbsorbance?: (absorbance: number) => number;
}

/** Everything that does not change with conversion, packed on the points that matter. */
export interface PreparedKinetics {
	amountMol: number;
	quantumYield: number;
	/** q_abs,S (einstein s⁻¹) at conversion X. */
	substrateAbsorbedFlux(conversion: number): number;
}

/**
 * Pack the time-independent parts: keep only grid points where light arrives and the substrate
 * absorbs (elsewhere q_abs,S gets nothing), with the trapezoid weight folded into the flux.
 */
export function prepareKinetics(input: KineticsInput): PreparedKinetics {
	const { stepNm, photonFluxInMixturePerNm: q, pathCm, substrateEpsilon: eS, productEpsilon: eP, fixedAbsorbance: fix } = input;
	const c0l = input.substrateConcentrationM * pathCm;
	const nu = input.productPerSubstrate ?? 1;
	const n = q.length;
	// drop the lamp's far tails (< 1e-12 of its peak), as rank.ts does: error ≤ ~1e-10 of q_in
	let qMax = 0;
	for (let i = 0; i < n; i++) if (q[i] > qMax) qMax = q[i];
	const cut = qMax * 1e-12;
	let m = 0;
	for (let i = 0; i < n; i++) if (q[i] > cut && eS[i] > 0) m++;
	const pw = new Float64Array(m), aS0 = new Float64Array(m), aP1 = new Float64Array(m), aFix = new Float64Array(m);
	for (let i = 0, k = 0; i < n; i++) {
		if (!(q[i] > cut && eS[i] > 0)) continue;
		pw[k] = q[i] * (i === 0 || i === n - 1 ? 0.5 * stepNm : stepNm);
		aS0[k] = eS[i] * c0l;
		aP1[k] = eP ? eP[i] * nu * c0l : 0;
		aFix[k] = fix ? fix[i] : 0;
		k++;
	}
	const g = input.fractionPerAbsorbance ?? absorbedFractionPerAbsorbance;
	const substrateAbsorbedFlux = (x: number): number => {
		const s = 1 - x;
		let sum = 0;
		for (let k = 0; k < m; k++) {
			const a = aS0[k] * s;
			sum += pw[k] * a * g(a + aP1[k] * x + aFix[k]);
		}
		return sum;
	};
	const amountMol = input.amountMol ?? input.substrateConcentrationM * input.volumeL;
	return { amountMol, quantumYield: input.quantumYield, substrateAbsorbedFlux };
}

/** Initial-rate estimate t = n₀·X/(Φ·q_abs,S(0)), s (valid while absorption stays constant). */
export function initialRateTimeS(k: PreparedKinetics, conversion: number): number {
	const rate = k.quantumYield * k.substrateAbsorbedFlux(0);
	return rate > 0 ? (k.amountMol * conversion) / rate : Infinity;
}

export interface TimeCourse {
	timeTo50PctS: number;
	timeTo90PctS: number;
	timeTo99PctS: number;
	/** Initial-rate estimate for 90 %, s (for comparison). */
	initialRateTimeTo90PctS: number;
	/** Conversion-vs-time samples for a plot (ascending time, from (0, 0) to 99 %). */
	curve: { timeS: Float64Array; conversion: Float64Array };
}

/**
 * Integrate the kinetics to 50/90/99 % conversion.
 *
 * Solver: the rate depends only on n_S, so t(n_S) is integrated instead of n_S(t) — the same ODE
 * with the variables swapped, valid while the rate is positive. Independent variable
 * u = −ln(1 − X), dt/du = n₀(1 − X)/(Φ·q_abs,S(X)); it stays smooth both when the mixture is
 * optically thick (q_abs,S ≈ const) and thin (q_abs,S ∝ 1 − X), so fixed steps suffice. Classical
 * fixed-step RK4 (right-hand side free of t, so k₂ = k₃ and it reduces to Simpson's rule per step),
 * `stepsPerSegment` steps (default 48) on each of [0, ln 2], [ln 2, ln 10], [ln 10, ln 100], so the
 * 50/90/99 % nodes are hit exactly. Accuracy is checked against the closed form in the tests.
 */
export function simulateTimeCourse(k: PreparedKinetics, stepsPerSegment = 48): TimeCourse {
	const bounds = [0, Math.LN2, Math.LN10, 2 * Math.LN10];
	const nPts = 3 * stepsPerSegment + 1;
	const timeS = new Float64Array(nPts);
	const conversion = new Float64Array(nPts);
	const dtdu = timePerLogUnit(k);
	let t = 0;
	let f0 = dtdu(0);
	let p = 1;
	const marks: number[] = [];
	for (let seg = 0; seg < 3; seg++) {
		const h = (bounds[seg + 1] - bounds[seg]) / stepsPerSegment;
		for (let j = 0; j < stepsPerSegment; j++, p++) {
			const u = bounds[seg] + j * h;
			const fm = dtdu(u + 0.5 * h);
			const f1 = dtdu(u + h);
			t += (h / 6) * (f0 + 4 * fm + f1);
			f0 = f1;
			timeS[p] = t;
			conversion[p] = -Math.expm1(-(u + h));
		}
		marks.push(t);
	}
	return {
		timeTo50PctS: marks[0],
		timeTo90PctS: marks[1],
		timeTo99PctS: marks[2],
		initialRateTimeTo90PctS: initialRateTimeS(k, 0.9),
		curve: { timeS, conversion }
	};
}

/**
 * dt/du in u = −ln(1 − X): dn_S/dt = −Φ·q_abs,S(X) with n_S = n₀(1 − X) gives dt/du = n₀(1 − X)/(Φ·q_abs,S(X)).
 * Infinity where no photons reach the substrate.
 */
function timePerLogUnit(k: PreparedKinetics): (u: number) => number {
	return (u) => {
		const x = -Math.expm1(-u);
		const r = k.quantumYield * k.substrateAbsorbedFlux(x);
		return r > 0 ? (k.amountMol * (1 - x)) / r : Infinity;
	};
}

/** Time to reach `conversion` (0 ≤ X < 1), s: the same RK4 in u = −ln(1 − X) with `steps` fixed steps (default 64). */
export function timeToConversionS(k: PreparedKinetics, conversion: number, steps = 64): number {
	const uEnd = -Math.log1p(-conversion);
	const h = uEnd / steps;
	const dtdu = timePerLogUnit(k);
	let t = 0;
	let f0 = dtdu(0);
	for (let j = 0; j < steps; j++) {
		const fm = dtdu((j + 0.5) * h);
		const f1 = dtdu((j + 1) * h);
		t += (h / 6) * (f0 + 4 * fm + f1); // RK4 with k₂ = k₃ (t-free right-hand side)
		f0 = f1;
	}
	return t;
}

/**
 * Conversion reached after `timeS` seconds: classical fixed-step RK4 in time on
 * dX/dt = Φ·q_abs,S(X)/n₀ with `steps` steps (default 200), X clamped to [0, 1].
 */
export function conversionAfter(k: PreparedKinetics, timeS: number, steps = 200): number {
	const h = timeS / steps;
	const f = (x: number) => (k.quantumYield * k.substrateAbsorbedFlux(Math.min(Math.max(x, 0), 1))) / k.amountMol;
	let x = 0;
	for (let j = 0; j < steps; j++) {
		const k1 = f(x);
		const k2 = f(x + 0.5 * h * k1);
		const k3 = f(x + 0.5 * h * k2);
		const k4 = f(x + h * k3);
		x = Math.min(1, x + (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4));
	}
	return x;
}
