/**
 * Irradiance at a stated distance and the ICNIRP 2004 UV limit times. Expected values computed by hand from the
 * formulas' sources: ICNIRP, Health Phys. 87, 171–186 (2004) eq. 2a–2c (S(λ)), 30 J m⁻² effective per day, UV-A eye
 * 10 kJ m⁻² (t ≤ 1000 s) / 10 W m⁻² (REFERENCE.md §7, from memory there); geometry E = P/(4πd²) for an isotropic point
 * source and E = P/(πd²) on the axis of a Lambertian emitter (radiometry textbooks, common practice).
 */
import { describe, expect, it } from 'vitest';
import { cautionsForSpectrum } from './cautions';
import { exposureAtDistance } from './exposure';

/** A narrow triangle of 1 W total at `nm` (peak 10 W nm⁻¹, ±0.1 nm). */
const line = (nm: number, watts = 1) => ({ wavelengthNm: [nm - 0.1, nm, nm + 0.1], powerWPerNm: [0, 10 * watts, 0] });

describe('irradiance at a stated distance', () => {
	it('1 W at 254 nm, isotropic point source, 1 m: E = 1/(4π) W m⁻², E_eff = E·S(254), limit 30/E_eff', () => {
		const e = exposureAtDistance(line(254), { distanceCm: 100 }, 'mercury-low-pressure')!;
		const E = 1 / (4 * Math.PI); // 0.0795775 W m⁻²
		const S254 = 0.959 ** (270 - 254); // ICNIRP 2004 eq. 2a: 0.5118
		expect(e.basis).toBe('point-source-model');
		expect(e.irradianceWPerM2).toBeCloseTo(E, 12);
		expect(e.actinicEffectiveWPerM2 / (E * S254)).toBeCloseTo(1, 9);
		expect(e.actinicLimitS! / (30 / (E * S254))).toBeCloseTo(1, 9); // ≈ 736.6 s
		expect(cautionsForSpectrum(line(254), { exposure: { distanceCm: 100 } }).find((c) => c.code === 'exposure-at-distance')!.text).toMatch(/30 J m⁻² is reached in 12\.3 min/);
		expect(e.actinicGroup).toBe('RG3'); // 0.041 W m⁻² effective ≥ 0.03 (IEC 62471 RG2 upper limit, from memory)
	});

	it('a 1 W 365 nm LED at 50 cm on its axis: E = 1/(π·0.25) W m⁻², UV-A below 10 W m⁻² (no eye-limit time)', () => {
		const e = exposureAtDistance(line(365), { distanceCm: 50 }, 'led')!;
		const E = 1 / (Math.PI * 0.5 ** 2); // 1.273 W m⁻²
		const S365 = 0.3 * 0.736 ** 65 + 10 ** (2 - 0.0163 * 365); // ICNIRP 2004 eq. 2c: 1.12e-4
		expect(e.basis).toBe('lambertian-model');
		expect(e.irradianceWPerM2).toBeCloseTo(E, 12);
		expect(e.uvaWPerM2).toBeCloseTo(E, 12);
		expect(e.uvaLimitS).toBeNull();
		expect(e.actinicEffectiveWPerM2 / (E * S365)).toBeCloseTo(1, 6);
		expect(e.actinicLimitS!).toBeGreaterThan(8 * 3600);
		expect(cautionsForSpectrum(line(365), { lampType: 'led', exposure: { distanceCm: 50 } }).find((c) => c.code === 'exposure-at-distance')!.text).toMatch(/reached in more than an 8 h working day/);
	});

	it('20 W of 365 nm at 10 cm: UV-A 637 W m⁻² reaches 10 kJ m⁻² in 15.7 s — a danger caution with the numbers', () => {
		const s = line(365, 20);
		const e = exposureAtDistance(s, { distanceCm: 10 }, 'led')!;
		const E = 20 / (Math.PI * 0.1 ** 2);
		expect(e.uvaLimitS! / (1e4 / E)).toBeCloseTo(1, 9);
		const c = cautionsForSpectrum(s, { lampType: 'led', exposure: { distanceCm: 10 } }).find((x) => x.code === 'exposure-at-distance')!;
		expect(c.severity).toBe('danger');
		expect(c.text).toMatch(/At 10 cm the lamp gives 637 W m⁻² \(model: Lambertian emitter/);
		expect(c.text).toMatch(/eye limit of 10 kJ m⁻² is reached in 16 s/);
	});

	it('a radiometer reading wins over the model and spreads over the lamp spectrum; a laser is not estimated', () => {
		const e = exposureAtDistance(line(405, 1.6), { distanceCm: 20, measuredIrradianceWPerM2: 50 }, 'led')!;
		expect(e.basis).toBe('measured');
		expect(e.irradianceWPerM2).toBe(50);
		expect(e.blueWPerM2).toBeCloseTo(50, 9);
		expect(e.uvaWPerM2).toBe(0);
		expect(exposureAtDistance(line(450), { distanceCm: 100 }, 'laser')).toBeNull();
		expect(exposureAtDistance(line(450), { distanceCm: 0 }, 'led')).toBeNull();
	});

	it('without a stated distance there is no exposure caution; the deferral to the safety officer stays last', () => {
		const plain = cautionsForSpectrum(line(254), { lampType: 'mercury-low-pressure' });
		expect(plain.some((c) => c.code === 'exposure-at-distance')).toBe(false);
		const withDistance = cautionsForSpectrum(line(254), { lampType: 'mercury-low-pressure', exposure: { distanceCm: 100 } });
		expect(withDistance.some((c) => c.code === 'exposure-at-distance')).toBe(true);
		expect(withDistance[withDistance.length - 1].code).toBe('consult-safety-officer');
	});
});
