import { describe, expect, it } from 'vitest';
import { computeAbsorberMatrix } from './absorberMatrix';
import { COMPUTATION_GRID, gridWavelengths } from './wavelengthGrid';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const n = grid.count;
const filled = (v: number) => new Float64Array(n).fill(v);
const box = (from: number, to: number, q: number) => Float64Array.from(wl, (x) => (x >= from && x <= to ? q : 0));

describe('computeAbsorberMatrix', () => {
	it('gives the Beer–Lambert absorbed fraction 1 − 10^−A for a lone absorber (A = ε·c·l = 1 → 0.9)', () => {
		// Beer–Lambert law, IUPAC Gold Book "Beer–Lambert law": T = 10^−εcl, so 90 % is absorbed at A = 1.
		const m = computeAbsorberMatrix({
			stepNm: grid.stepNm, pathCm: 1, concentrationM: 1e-3, solventAbsorbancePerCm: filled(0), wallTransmission: filled(1),
			lamps: [{ id: 'a', name: 'flat 400–500', photonFluxPerNm: box(400, 500, 1e-8) }],
			absorbers: [{ id: 's', epsilon: filled(1000) }]
		});
		expect(m.absorbedPhotonFluxEinsteinPerS[0] / m.lampFluxEinsteinPerS[0]).toBeCloseTo(0.9, 12);
		expect(m.selectivity[0]).toBeCloseTo(1, 12);
	});

	it('shares photons with the solvent as A_i/A_tot·(1 − 10^−A_tot) and scales with the wall transmission', () => {
		// Competitive absorption in a mixture (IUPAC Glossary of Terms Used in Photochemistry, 3rd ed., 2007, "inner filter"):
		// absorber A = 1 and solvent A = 1 → absorber takes ½·(1 − 10⁻²) = 0.495; a wall of T = 0.5 halves it.
		const m = computeAbsorberMatrix({
			stepNm: grid.stepNm, pathCm: 2, concentrationM: 5e-4, solventAbsorbancePerCm: filled(0.5), wallTransmission: filled(0.5),
			lamps: [{ id: 'a', name: 'flat', photonFluxPerNm: box(350, 450, 2e-9) }],
			absorbers: [{ id: 's', epsilon: filled(1000) }]
		});
		expect(m.absorbedPhotonFluxEinsteinPerS[0] / m.lampFluxEinsteinPerS[0]).toBeCloseTo(0.5 * 0.495, 12);
		expect(m.selectivity[0]).toBeCloseTo(0.5, 12);
	});

	it('agrees with a direct trapezoid integral for every cell (Gaussian lamps and bands, invented)', () => {
		const g = (p: number, f: number, h: number) => Float64Array.from(wl, (x) => h * Math.exp((-4 * Math.LN2 * (x - p) ** 2) / (f * f)));
		const lamps = [365, 405, 450, 525].map((p, k) => ({ id: String(k), name: `${p}`, photonFluxPerNm: g(p, 15 + k * 5, 1e-7) }));
		const absorbers = [[310, 40, 9000], [420, 60, 14000], [452, 50, 4000]].map(([p, f, e], k) => ({ id: String(k), epsilon: g(p, f, e) }));
		const solvent = Float64Array.from(wl, (x) => 10 ** ((230 - x) / 10));
		const wall = Float64Array.from(wl, (x) => 0.92 / (1 + Math.exp(-(x - 300) / 6)));
		const c = 2e-3, l = 1;
		const m = computeAbsorberMatrix({ stepNm: grid.stepNm, pathCm: l, concentrationM: c, solventAbsorbancePerCm: solvent, wallTransmission: wall, lamps, absorbers });
		for (let a = 0; a < absorbers.length; a++) {
			for (let k = 0; k < lamps.length; k++) {
				let sum = 0;
				for (let i = 0; i < n; i++) {
					const aA = absorbers[a].epsilon[i] * c * l, aTot = aA + solvent[i] * l;
					const f = aTot > 0 ? (aA / aTot) * (1 - 10 ** -aTot) : 0;
					const w = i === 0 || i === n - 1 ? 0.5 : 1;
					sum += w * grid.stepNm * lamps[k].photonFluxPerNm[i] * wall[i] * f;
				}
				// rank.ts trims lamp tails below 1e-12 of their maximum: error bound ~1e-10 of the lamp's own flux.
				expect(Math.abs(m.absorbedPhotonFluxEinsteinPerS[a * lamps.length + k] - sum)).toBeLessThan(1e-9 * m.lampFluxEinsteinPerS[k]);
			}
		}
	});

	it('refuses a path ≤ 0 and a negative concentration', () => {
		const base = { stepNm: 0.5, concentrationM: 0.01, solventAbsorbancePerCm: filled(0), wallTransmission: filled(1), lamps: [], absorbers: [] };
		expect(() => computeAbsorberMatrix({ ...base, pathCm: 0 })).toThrow(RangeError);
		expect(() => computeAbsorberMatrix({ ...base, pathCm: 1, concentrationM: -1 })).toThrow(RangeError);
	});
});
