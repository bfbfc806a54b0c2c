import { describe, expect, it } from 'vitest';
import { HCNA_J_NM_PER_MOL, HC_EV_NM, photonFluxEinsteinPerS } from './constants';

describe('CODATA 2018 photon arithmetic', () => {
	it('derives hcN_A and hc/e', () => {
		// REFERENCE.md §4 [computed from CODATA 2018 exact constants]: hcN_A = 1.196 265 66e8 J nm mol⁻¹, hc = 1239.841 984 eV nm
		expect(HCNA_J_NM_PER_MOL).toBeCloseTo(1.19626566e8, -1);
		expect(HC_EV_NM).toBeCloseTo(1239.841984, 5);
	});
	it('1 W at 365 nm is 3.0512 µmol s⁻¹ and at 450 nm 3.7617 µmol s⁻¹', () => {
		// REFERENCE.md §4 worked values (CODATA 2018)
		expect(photonFluxEinsteinPerS(1, 365) * 1e6).toBeCloseTo(3.0512, 4);
		expect(photonFluxEinsteinPerS(1, 450) * 1e6).toBeCloseTo(3.7617, 4);
	});
});
