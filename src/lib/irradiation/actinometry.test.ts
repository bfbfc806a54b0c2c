import { describe, expect, it } from 'vitest';
import { FERROIN_EPSILON_510, ferrioxalatePhotonFlux, ferrioxalateQuantumYield } from './actinometry';

describe('ferrioxalate actinometry', () => {
	it('reproduces a hand-computed photon flux', () => {
		// IUPAC 2004 / Hatchard & Parker 1956 procedure, worked by hand:
		// n(Fe²⁺) = V₁·V₃·ΔA/(10³·V₂·l·ε) = 3.0 mL × 10.0 mL × 0.555 / (10³ × 0.50 mL × 1.00 cm × 11100 M⁻¹ cm⁻¹)
		//         = 16.65 / 5.55e6 = 3.000e-6 mol
		// Φ(365 nm, 0.006 M) = 1.26 (Lee & Seliger 1964); 1 − 10^(−2) = 0.99; t = 60 s
		// q_p = 3.000e-6 / (1.26 × 60 × 0.99) = 3.000e-6 / 74.844 = 4.00834e-8 einstein s⁻¹
		const r = ferrioxalatePhotonFlux({
			irradiatedVolumeMl: 3,
			aliquotVolumeMl: 0.5,
			finalVolumeMl: 10,
			deltaAbsorbance510: 0.555,
			readoutPathCm: 1,
			irradiationTimeS: 60,
			absorbanceAtIrradiation: 2,
			wavelengthNm: 365,
			strength: '0.006M'
		});
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect(r.value.molesFe2).toBeCloseTo(3.0e-6, 12);
		expect(r.value.quantumYield).toBe(1.26);
		expect(r.value.fractionAbsorbed).toBeCloseTo(0.99, 12);
		expect(Math.abs(r.value.photonFluxEinsteinPerS / 4.00834e-8 - 1)).toBeLessThan(1e-5);
		expect(FERROIN_EPSILON_510).toBe(1.11e4); // Hatchard & Parker 1956; IUPAC 2004 (REFERENCE.md §5.1, from memory)
	});
	it('uses Lee & Seliger at 365/366 nm and the tables elsewhere', () => {
		// Lee & Seliger, J. Chem. Phys. 40, 519 (1964): 1.26 (0.006 M), 1.20 (0.15 M) [verified in REFERENCE.md §5.1]
		expect(ferrioxalateQuantumYield(366, '0.006M')).toBe(1.26);
		expect(ferrioxalateQuantumYield(365, '0.15M')).toBe(1.2);
		// IUPAC 2004 table after Hatchard & Parker (REFERENCE.md §5.1, from memory): 436 nm 0.15 M → 1.01; 509 nm → 0.86
		expect(ferrioxalateQuantumYield(436, '0.15M')).toBe(1.01);
		expect(ferrioxalateQuantumYield(509, '0.15M')).toBe(0.86);
		expect(ferrioxalateQuantumYield(700, '0.15M')).toBeUndefined();
	});
	it('returns field-named issues for bad input', () => {
		const r = ferrioxalatePhotonFlux({
			irradiatedVolumeMl: -3,
			aliquotVolumeMl: 0.5,
			finalVolumeMl: 10,
			deltaAbsorbance510: Number.NaN,
			readoutPathCm: 1,
			irradiationTimeS: 60,
			absorbanceAtIrradiation: 2,
			wavelengthNm: 365,
			strength: '0.006M'
		});
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues.map((i) => i.field)).toEqual(['irradiatedVolumeMl', 'deltaAbsorbance510']);
		const outside = ferrioxalatePhotonFlux({ irradiatedVolumeMl: 3, aliquotVolumeMl: 0.5, finalVolumeMl: 10, deltaAbsorbance510: 0.5, readoutPathCm: 1, irradiationTimeS: 60, absorbanceAtIrradiation: 2, wavelengthNm: 620, strength: '0.15M' });
		expect(outside.ok).toBe(false);
		if (!outside.ok) expect(outside.issues[0].field).toBe('wavelengthNm');
	});
});
