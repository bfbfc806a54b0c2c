import { describe, expect, it } from 'vitest';
import { cylinderAbsorbedFraction, cylinderFractionPerAbsorbance, innerFaceCorrection, penetrationDepth90Cm, vesselIssues, vesselOptics } from './vessels';

/**
 * Independent check: adaptive Simpson quadrature of the chord integral exactly as written in the contract,
 * F = (1/D)·∫_{−R}^{R} (1 − 10^(−a·2√(R² − y²))) dy — in y, not in the angle the code uses.
 */
function chordAverage(aPerCm: number, diameterCm: number): number {
	const r = diameterCm / 2;
	const f = (y: number) => 1 - 10 ** (-aPerCm * 2 * Math.sqrt(Math.max(0, r * r - y * y)));
	const simpson = (a: number, b: number, fa: number, fm: number, fb: number) => ((b - a) / 6) * (fa + 4 * fm + fb);
	const adapt = (a: number, b: number, fa: number, fm: number, fb: number, whole: number, depth: number): number => {
		const m = (a + b) / 2, lm = (a + m) / 2, rm = (m + b) / 2;
		const flm = f(lm), frm = f(rm);
		const left = simpson(a, m, fa, flm, fm), right = simpson(m, b, fm, frm, fb);
		if (depth > 40 || Math.abs(left + right - whole) < 1e-13) return left + right + (left + right - whole) / 15;
		return adapt(a, m, fa, flm, fm, left, depth + 1) + adapt(m, b, fm, frm, fb, right, depth + 1);
	};
	const fa = f(-r), fm = f(0), fb = f(r);
	return adapt(-r, r, fa, fm, fb, simpson(-r, r, fa, fm, fb), 0) / diameterCm;
}

describe('cylinder (side-lit, collimated) absorbed fraction', () => {
	// Expected values: numerical quadrature of the chord integral (values quoted in the task that asked for round
	// vessels, reproduced here by the adaptive Simpson above).
	it.each([
		[0.05, 4, 0.29966],
		[0.25, 4, 0.80801],
		[1.0, 4, 0.98768]
	])('a = %f cm⁻¹, D = %f cm → %f', (a, d, expected) => {
		expect(chordAverage(a, d)).toBeCloseTo(expected, 5);
		expect(cylinderAbsorbedFraction(a * d)).toBeCloseTo(expected, 5);
		expect(vesselOptics({ shape: 'cylinder', innerDiameterCm: d }).absorbedFraction(a * d)).toBeCloseTo(expected, 5);
	});

	it('is 23 % below the slab of the same diameter at a = 0.05 cm⁻¹, D = 4 cm', () => {
		// slab: 1 − 10^(−0.2) = 0.36904 (Beer–Lambert)
		const slab = 1 - 10 ** -0.2;
		expect(slab).toBeCloseTo(0.36904, 5);
		expect(slab / cylinderAbsorbedFraction(0.2)).toBeCloseTo(1.2315, 3);
	});

	it('agrees with the independent quadrature from very thin to very thick', () => {
		for (const a of [1e-6, 1e-3, 0.01, 0.3, 1, 3, 10, 50, 200, 800]) {
			const ref = chordAverage(a, 1);
			expect(Math.abs(cylinderAbsorbedFraction(a) - ref)).toBeLessThan(2e-9 + 2e-9 * ref);
		}
	});

	it('thin limit: g(A) → ln10·π/4 (mean chord πD/4; geometric mean-chord result, common practice)', () => {
		expect(cylinderFractionPerAbsorbance(0)).toBeCloseTo((Math.LN10 * Math.PI) / 4, 12);
		expect(cylinderFractionPerAbsorbance(1e-7)).toBeCloseTo((Math.LN10 * Math.PI) / 4, 6);
	});

	it('the fast table matches the direct quadrature to 1e-8 relative', () => {
		let worst = 0;
		for (let k = 0; k < 3000; k++) {
			const a = 1e-5 * Math.exp(k * 0.0055); // 1e-5 … ~1.5e2 and past the table's end
			const direct = cylinderAbsorbedFraction(a) / a;
			worst = Math.max(worst, Math.abs(cylinderFractionPerAbsorbance(a) / direct - 1));
		}
		expect(worst).toBeLessThan(1e-8);
		expect(cylinderFractionPerAbsorbance(1000) * 1000).toBeCloseTo(chordAverage(1000, 1), 8);
	});
});

describe('vessel descriptions', () => {
	it('annulus: the gap is the path; outer ≤ inner is refused naming the field', () => {
		const o = vesselOptics({ shape: 'annulus', innerDiameterCm: 4, outerDiameterCm: 7 });
		expect(o.referencePathCm).toBeCloseTo(1.5, 12);
		expect(o.absorbedFraction(1)).toBeCloseTo(0.9, 12); // 1 − 10^−1
		expect(vesselIssues({ shape: 'annulus', innerDiameterCm: 5, outerDiameterCm: 5 })[0].field).toBe('vessel.outerDiameterCm');
		expect(vesselIssues({ shape: 'cylinder', innerDiameterCm: -1 })[0].field).toBe('vessel.innerDiameterCm');
		expect(vesselIssues({ shape: 'annulus', innerDiameterCm: -2, outerDiameterCm: 3 })[0].field).toBe('vessel.innerDiameterCm');
	});

	it('cylinder mean chord is πD/4 (geometry)', () => {
		expect(vesselOptics({ shape: 'cylinder', innerDiameterCm: 2 }).meanPathCm).toBeCloseTo(Math.PI / 2, 12);
	});

	it('inner face against the liquid: borosilicate 3.3 (n 1.472) into water (n 1.333) gains the air/glass loss back', () => {
		// REFERENCE.md §2.1 [computed]: R air/borosilicate 3.65 %, R water/borosilicate 0.25 %
		const k = innerFaceCorrection(1.472, 1.333);
		expect(k).toBeCloseTo((1 - 0.0025) / (1 - 0.0365), 3);
		expect(innerFaceCorrection(1.472, null)).toBe(1);
	});
});

describe('penetration depth', () => {
	it('monochromatic: 90 % absorbed where a·d = 1 (Beer–Lambert: 10^−1 transmitted)', () => {
		expect(penetrationDepth90Cm([1], [2.5])).toBeCloseTo(0.4, 6);
	});
	it('null when the lamp emits mostly where the mixture is transparent', () => {
		expect(penetrationDepth90Cm([1, 1], [5, 0])).toBeNull();
	});
});
