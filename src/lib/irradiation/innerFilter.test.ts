import { describe, expect, it } from 'vitest';
import { photonFluxEinsteinPerS } from './constants';
import { absorbedPhotonFlux, fractionAbsorbed, scaleAbsorbance, speciesAbsorbance } from './innerFilter';
import { COMPUTATION_GRID, gridWavelengths } from './wavelengthGrid';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const gauss = (mu: number, sigma: number, peak = 1) => wl.map((x) => peak * Math.exp(-((x - mu) ** 2) / (2 * sigma * sigma)));

describe('Beer–Lambert fractions', () => {
	it('A = 1 absorbs 90 %, A = 2 absorbs 99 %', () => {
		// Beer–Lambert law: absorbed fraction 1 − 10^(−A) → 0.9 and 0.99 (exact; tolerance 1e-12)
		expect(fractionAbsorbed(1, 1)).toBeCloseTo(0.9, 12);
		expect(fractionAbsorbed(2, 2)).toBeCloseTo(0.99, 12);
		expect(fractionAbsorbed(0, 0)).toBe(0);
	});
	it('two absorbers share 1 − 10^(−A_tot) in proportion to A_i', () => {
		// IUPAC Glossary 2007 / PRODUCT.md: f_i = (A_i/A_tot)(1 − 10^(−A_tot)); A₁ = 0.3, A₂ = 0.9 → A_tot = 1.2
		const f1 = fractionAbsorbed(0.3, 1.2);
		const f2 = fractionAbsorbed(0.9, 1.2);
		expect(f1 + f2).toBeCloseTo(1 - 10 ** -1.2, 12);
		expect(f2 / f1).toBeCloseTo(3, 12);
	});
	it('A = ε·c·l and path scaling', () => {
		// Beer–Lambert: ε 1.46e4 M⁻¹ cm⁻¹ × 1e-4 M × 0.5 cm = 0.73 (arithmetic)
		expect(speciesAbsorbance([14600], 1e-4, 0.5)[0]).toBeCloseTo(0.73, 12);
		// absorbance measured over 1 cm scaled to 0.2 cm: 0.8 × 0.2 = 0.16
		expect(scaleAbsorbance([0.8], 1, 0.2)[0]).toBeCloseTo(0.16, 12);
	});
});

describe('absorbed photon flux', () => {
	it('a Gaussian lamp × Gaussian absorber overlap equals the closed-form Gaussian product integral (1e-6 relative)', () => {
		// Make A_tot constant (= C) by letting the "solvent" carry C − A₁; then f₁ = A₁(1 − 10^(−C))/C exactly and
		// q_abs,1 = (1 − 10^(−C))/C · ∫q·A₁ dλ. Closed form (Gaussian product integral, standard calculus):
		// ∫ e^(−(x−μ₁)²/2σ₁²) e^(−(x−μ₂)²/2σ₂²) dx = √(2π σ₁²σ₂²/(σ₁²+σ₂²)) · exp(−(μ₁−μ₂)²/(2(σ₁²+σ₂²)))
		const q0 = 2e-8, a0 = 0.8, C = 1.5;
		const [m1, s1, m2, s2] = [405, 8, 420, 15];
		const q = gauss(m1, s1, q0);
		const a1 = gauss(m2, s2, a0);
		const solvent = a1.map((a) => C - a);
		const r = absorbedPhotonFlux({ stepNm: grid.stepNm, photonFluxPerNm: q, wallTransmission: new Float64Array(grid.count).fill(1), speciesAbsorbance: [a1], solventAbsorbance: solvent });
		const overlap = q0 * a0 * Math.sqrt((2 * Math.PI * s1 * s1 * s2 * s2) / (s1 * s1 + s2 * s2)) * Math.exp(-((m1 - m2) ** 2) / (2 * (s1 * s1 + s2 * s2)));
		const expected = ((1 - 10 ** -C) / C) * overlap;
		expect(Math.abs(r.perSpeciesEinsteinPerS[0] / expected - 1)).toBeLessThan(1e-6);
		expect(r.selectivity).toBe(1);
	});
	it('1 W Gaussian LED at 365 nm carries 3.0512 µmol s⁻¹', () => {
		// REFERENCE.md §4 worked value from CODATA 2018 constants; a symmetric line has mean λ = peak, so ∫P·λ/hcN_A = 1 W·365 nm/hcN_A
		const fwhm = 10;
		const p = gauss(365, fwhm / (2 * Math.sqrt(2 * Math.LN2)), (2 * Math.sqrt(Math.LN2 / Math.PI)) / fwhm);
		const q = p.map((v, i) => photonFluxEinsteinPerS(v, wl[i]));
		const zero = new Float64Array(grid.count);
		const r = absorbedPhotonFlux({ stepNm: grid.stepNm, photonFluxPerNm: q, wallTransmission: zero.map(() => 1), speciesAbsorbance: [zero], solventAbsorbance: zero });
		expect(r.incidentEinsteinPerS * 1e6).toBeCloseTo(3.0512, 4);
		expect(r.shares.transmitted).toBeCloseTo(1, 12);
	});
	it('the photon budget (wall + solvent + species + transmitted) adds up to 1', () => {
		// conservation of photons (Beer–Lambert with an absorbing wall); tolerance 1e-12
		const q = gauss(300, 20, 1e-8);
		const wall = wl.map((x) => 0.92 / (1 + Math.exp(-(x - 290) / 5)));
		const r = absorbedPhotonFlux({ stepNm: grid.stepNm, photonFluxPerNm: q, wallTransmission: wall, speciesAbsorbance: [gauss(310, 15, 1.2), gauss(280, 10, 0.5)], solventAbsorbance: wl.map((x) => 10 ** ((250 - x) / 10)) });
		const s = r.shares;
		expect(s.wall + s.solvent + s.species[0] + s.species[1] + s.transmitted).toBeCloseTo(1, 12);
		expect(r.selectivity).toBeCloseTo(r.perSpeciesEinsteinPerS[0] / (r.perSpeciesEinsteinPerS[0] + r.perSpeciesEinsteinPerS[1]), 12);
	});
});
