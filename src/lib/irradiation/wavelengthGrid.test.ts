import { describe, expect, it } from 'vitest';
import { COMPUTATION_GRID, gridToNm, gridWavelengths, resampleOnto, trapezoidUniform } from './wavelengthGrid';

describe('computation grid', () => {
	it('is 190–1100 nm at 0.5 nm, 1821 points', () => {
		// PRODUCT.md: "Common grid: 190–1100 nm, 0.5 nm step for computation" → (1100 − 190)/0.5 + 1 = 1821
		expect(COMPUTATION_GRID.count).toBe(1821);
		const wl = gridWavelengths(COMPUTATION_GRID);
		expect(wl[0]).toBe(190);
		expect(wl[1820]).toBe(1100);
		expect(gridToNm(COMPUTATION_GRID)).toBe(1100);
	});
});

describe('resampleOnto', () => {
	it('reproduces a linear function exactly and fills outside the data', () => {
		// linear interpolation is exact for a straight line (elementary; tolerance 1e-12)
		const x = [200, 233.3, 401.7, 600];
		const y = x.map((v) => 3 + 0.25 * v);
		const grid = { fromNm: 190, stepNm: 0.5, count: 1821 };
		const r = resampleOnto(x, y, grid, -1);
		const wl = gridWavelengths(grid);
		for (let i = 0; i < grid.count; i++) {
			if (wl[i] < 200 || wl[i] > 600) expect(r[i]).toBe(-1);
			else expect(r[i]).toBeCloseTo(3 + 0.25 * wl[i], 12);
		}
	});
	it('accepts descending x, rejects mismatched lengths with RangeError', () => {
		const grid = { fromNm: 0, stepNm: 1, count: 3 };
		expect(Array.from(resampleOnto([2, 0], [4, 0], grid))).toEqual([0, 2, 4]); // y = 2x (arithmetic)
		expect(() => resampleOnto([1, 2], [0], grid)).toThrow(RangeError);
	});
});

describe('trapezoidUniform', () => {
	it('integrates a straight line exactly', () => {
		// ∫₀¹⁰ (2x + 1) dx = 110 (elementary calculus); the trapezoid rule is exact for linear functions
		const y = Array.from({ length: 21 }, (_, i) => 2 * (i * 0.5) + 1);
		expect(trapezoidUniform(y, 0.5)).toBeCloseTo(110, 12);
	});
});
