import { describe, expect, it } from 'vitest';
import { actinicEffectiveFraction, icnirpActinicWeighting } from './icnirp';

describe('ICNIRP 2004 actinic weighting S(λ)', () => {
	// Reference table §7 [computed from ICNIRP 2004 eqs 2a–2c]: S(222) = 0.134, S(254) = 0.512, S(270) = 1,
	// S(280) = 0.884, S(300) = 0.300, S(313) = 0.0064, S(365) = 1.12e-4.
	it.each([[222, 0.134, 0.001], [254, 0.512, 0.001], [270, 1, 1e-9], [280, 0.884, 0.001], [300, 0.3, 0.001], [313, 0.0064, 0.0001], [365, 1.12e-4, 0.01e-4]])(
		'S(%d nm) = %f', (nm, s, tol) => {
			expect(Math.abs(icnirpActinicWeighting(nm) - s)).toBeLessThanOrEqual(tol);
		}
	);

	it('is 0 above 400 nm and continuous at 210 nm', () => {
		expect(icnirpActinicWeighting(450)).toBe(0);
		expect(icnirpActinicWeighting(209.999)).toBeCloseTo(icnirpActinicWeighting(210), 4);
	});

	it('effective fraction of a flat 250–260 nm spectrum ≈ mean S there', () => {
		const x = Array.from({ length: 41 }, (_, i) => 240 + i * 0.5);
		const p = x.map((w) => (w >= 250 && w <= 260 ? 1 : 0));
		expect(actinicEffectiveFraction(x, p)).toBeCloseTo(icnirpActinicWeighting(255), 1);
	});
});
