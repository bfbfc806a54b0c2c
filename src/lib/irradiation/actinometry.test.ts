import { describe, expect, it } from 'vitest';
import { ACTINOMETERS, computeActinometry, FERROIN_EPSILON_510, type ActinometryRun } from './actinometry';
import { HCNA_J_NM_PER_MOL } from './constants';
import { lampSpectrum, photonFluxSpectrum } from './lamps';
import { MERCURY_MEDIUM_PRESSURE_LINES } from './mercuryLines';

const run = (over: Partial<ActinometryRun> = {}): ActinometryRun => ({
	actinometer: 'ferrioxalate', concentrationM: 0.006, irradiatedVolumeMl: 3, aliquotVolumeMl: 0.5, finalVolumeMl: 10,
	deltaAbsorbance: 0.555, readoutPathCm: 1, irradiationTimeS: 60, absorbanceAtIrradiation: 2, vesselPathCm: 1, ...over
});
const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('ferrioxalate, monochromatic (IUPAC 2004 procedure)', () => {
	it('365 nm, 0.006 M: the hand-worked example', () => {
		// IUPAC 2004 / Hatchard & Parker 1956, worked by hand:
		// n(Fe²⁺) = V₁·V₃·ΔA/(10³·V₂·l·ε) = 3.0 × 10.0 × 0.555 / (10³ × 0.50 × 1.00 × 11100) = 3.000e-6 mol
		// Φ(365 nm, 0.006 M) = 1.26 (Lee & Seliger, J. Chem. Phys. 40, 519 (1964), REFERENCE §5.1 verified); f = 1 − 10⁻² = 0.99
		// q = 3.000e-6 / (1.26 × 60 × 0.99) = 4.00834e-8 einstein s⁻¹
		const r = computeActinometry(run(), { lineNm: 365 });
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect(r.value.molesProduct).toBeCloseTo(3.0e-6, 12);
		expect(r.value.quantumYieldUsed).toBeCloseTo(1.26, 12);
		expect(r.value.fractionAbsorbed).toBeCloseTo(0.99, 12);
		expect(rel(r.value.photonFluxEinsteinPerS, 4.00834e-8)).toBeLessThan(1e-5);
		expect(FERROIN_EPSILON_510).toBe(1.11e4); // Hatchard & Parker 1956; IUPAC 2004 (REFERENCE §5.1, from memory)
	});

	it('468 nm, 0.15 M: Φ = 0.93 from the table', () => {
		// REFERENCE §5.1 (IUPAC 2004 table, from memory): Φ(468 nm, 0.15 M) = 0.93.
		// n = 3 × 10 × 0.4/(10³ × 0.5 × 1 × 11100) = 2.16216e-6 mol; f = 1 − 10^−1.5 = 0.968377; t = 120 s
		// q = 2.16216e-6/(0.93 × 120 × 0.968377) = 2.00069e-8 einstein s⁻¹ (hand/calculator)
		const r = computeActinometry(run({ concentrationM: 0.15, deltaAbsorbance: 0.4, irradiationTimeS: 120, absorbanceAtIrradiation: 1.5 }), { lineNm: 468 });
		expect(r.ok && r.value.quantumYieldUsed).toBeCloseTo(0.93, 12);
		expect(r.ok && rel(r.value.photonFluxEinsteinPerS, 2.00069e-8)).toBeLessThan(1e-5);
	});

	it('Lee & Seliger at 365/366 nm for both strengths (REFERENCE §5.1, verified: 1.26 and 1.20)', () => {
		const a = computeActinometry(run(), { lineNm: 366 });
		const b = computeActinometry(run({ concentrationM: 0.15 }), { lineNm: 365 });
		expect(a.ok && a.value.quantumYieldUsed).toBe(1.26);
		expect(b.ok && b.value.quantumYieldUsed).toBe(1.2);
	});
});

describe('ferrioxalate, polychromatic (medium-pressure Hg)', () => {
	// Expected values computed with a separate script from the Calvert & Pitts line table (REFERENCE §3.2, the complete
	// table in mercuryLines.ts), the 0.006 M Φ table (REFERENCE §5.1) and the app's approximate ε table (from memory),
	// summing over the discrete lines: f_i = 1 − 10^(−ε_i·c·l), Φ_used = Σq_i f_i Φ_i / Σq_i f_i, f_used = Σq_i f_i / Σq_i:
	// f_used = 0.385443, Φ_used = 1.224651, n = 3 × 10 × 0.80/(10³ × 0.5 × 11100) = 4.324324e-6 mol, t = 30 s
	// → q = n/(Φ_used·t·f_used) = 3.05369e-7 einstein s⁻¹ entering the solution.
	const lines = MERCURY_MEDIUM_PRESSURE_LINES.map((l) => ({ wavelengthNm: l.wavelengthNm, photonFlux: (l.relativePower * l.wavelengthNm) / HCNA_J_NM_PER_MOL }));
	const mp = run({ deltaAbsorbance: 0.8, irradiationTimeS: 30, absorbanceAtIrradiation: undefined });

	it('weights Φ(λ)·f(λ) over the lamp’s photon lines', () => {
		const r = computeActinometry(mp, { lines });
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect(rel(r.value.fractionAbsorbed, 0.385443)).toBeLessThan(1e-5);
		expect(rel(r.value.quantumYieldUsed, 1.224651)).toBeLessThan(1e-5);
		expect(rel(r.value.photonFluxEinsteinPerS, 3.05369e-7)).toBeLessThan(1e-5);
		// 10.7 % of the absorbed photons lie at 222–248 nm, outside the Φ table: said so
		expect(r.value.warnings.join(' ')).toMatch(/outside the Φ table/);
	});

	it('the broadened model spectrum on the planner grid gives the same flux within 1 %', () => {
		const s = lampSpectrum({ type: 'mercury-medium-pressure' }, 1);
		const r = computeActinometry(mp, { wavelengthNm: s.wavelengthNm, photonFluxPerNm: photonFluxSpectrum(s) });
		// the grid drops the 1128.7 and 1367.3 nm groups (not absorbed, but part of ∫s): f_used rises by their photon share
		expect(r.ok).toBe(true);
		if (r.ok) expect(rel(r.value.quantumYieldUsed, 1.224651)).toBeLessThan(0.01);
	});
});

describe("Reinecke's salt (beyond 500 nm)", () => {
	it('NCS⁻ read-out at 450 nm, Φ ≈ 0.29 at 520 nm', () => {
		// Wegner & Adamson 1966 via REFERENCE §5.2 (from memory): Φ ≈ 0.29–0.30 at 450–520 nm; ε(Fe–NCS, 450) = 4.3e3.
		// n = 5 × 10 × 0.5/(10³ × 1 × 1 × 4300) = 5.81395e-6 mol; f = 1 − 10^−0.6 = 0.748811; t = 600 s
		// q = 5.81395e-6/(0.29 × 600 × 0.748811) = 4.46221e-8 einstein s⁻¹
		const r = computeActinometry(run({ actinometer: 'reinecke', concentrationM: 0.015, irradiatedVolumeMl: 5, aliquotVolumeMl: 1, deltaAbsorbance: 0.5, irradiationTimeS: 600, absorbanceAtIrradiation: 0.6 }), { lineNm: 520 });
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect(r.value.quantumYieldUsed).toBeCloseTo(0.29, 12);
		expect(rel(r.value.photonFluxEinsteinPerS, 4.46221e-8)).toBeLessThan(1e-5);
		const red = ACTINOMETERS.find((a) => a.id === 'reinecke')!;
		expect(red.rangeNm[1]).toBeGreaterThanOrEqual(600);
	});

	it('needs the measured absorbance (no ε table)', () => {
		const r = computeActinometry(run({ actinometer: 'reinecke', concentrationM: 0.015, absorbanceAtIrradiation: undefined }), { lineNm: 520 });
		expect(!r.ok && r.issues[0].field).toBe('absorbanceAtIrradiation');
	});
});

describe('bad input names the field and computes nothing', () => {
	const cases: [Partial<ActinometryRun>, string][] = [
		[{ irradiationTimeS: 0 }, 'irradiationTimeS'],
		[{ irradiationTimeS: -5 }, 'irradiationTimeS'],
		[{ irradiatedVolumeMl: -1 }, 'irradiatedVolumeMl'],
		[{ deltaAbsorbance: 0 }, 'deltaAbsorbance'],
		[{ deltaAbsorbance: 2.5 }, 'deltaAbsorbance'],
		[{ absorbanceAtIrradiation: -0.1 }, 'absorbanceAtIrradiation'],
		[{ finalVolumeMl: 0.2 }, 'finalVolumeMl'],
		[{ aliquotVolumeMl: 4 }, 'aliquotVolumeMl'],
		[{ concentrationM: 0.05 }, 'concentrationM'],
		[{ actinometer: 'uranyl-oxalate' }, 'actinometer']
	];
	it.each(cases)('%o → %s', (over, field) => {
		const r = computeActinometry(run(over), { lineNm: 365 });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues.map((i) => i.field)).toContain(field);
	});

	it('a lamp the actinometer does not absorb is refused', () => {
		const r = computeActinometry(run({ absorbanceAtIrradiation: undefined }), { lineNm: 700 });
		expect(!r.ok && r.issues[0].field).toBe('actinometer');
	});
});
