import { describe, expect, it } from 'vitest';
import { DEFAULT_WINDOW_THRESHOLDS, findWindows } from './window';
import { COMPUTATION_GRID, gridWavelengths } from './wavelengthGrid';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
// substrate absorbing only below 290 nm: Gaussian band at 250 nm, σ 10 nm, A = 2 over the path (A < 1e-3 above 290 nm)
const substrate = wl.map((x) => 2 * Math.exp(-((x - 250) ** 2) / 200));
// acetonitrile-like solvent edge (PRODUCT.md edge model, cut-off 190 nm, 10 nm/decade), 1 cm
const solvent = wl.map((x) => 10 ** ((190 - x) / 10));

describe('findWindows', () => {
	it('no window through a borosilicate-like wall, a window through a flat 0.93 fused-silica-like wall', () => {
		// common practice: borosilicate 3.3 vessels block below ~290 nm (REFERENCE.md §2.3: 2 mm tubing T10 291 nm, T50 307 nm);
		// fused silica transmits ~93 % flat (two Fresnel faces, REFERENCE.md §2.1)
		const borosilicate = wl.map((x) => 0.92 / (1 + Math.exp(-(x - 300) / 5)));
		const silica = new Float64Array(grid.count).fill(0.93);
		expect(findWindows({ grid, wallTransmission: borosilicate, solventAbsorbance: solvent, substrateAbsorbance: substrate })).toEqual([]);
		const w = findWindows({ grid, wallTransmission: silica, solventAbsorbance: solvent, substrateAbsorbance: substrate });
		expect(w.length).toBe(1);
		// A ≥ 0.1 where |λ − 250| ≤ 10·√(2 ln 20) = 24.48 nm → 225.5–274.5 nm on the 0.5 nm grid (arithmetic)
		expect(w[0]).toEqual({ fromNm: 226, toNm: 274 });
	});
	it('a competing absorber and the solvent edge cut the window (selectivity and A_max)', () => {
		const silica = new Float64Array(grid.count).fill(0.93);
		const competitor = wl.map((x) => (x < 250 ? 5 : 0)); // out-absorbs the substrate below 250 nm
		const w = findWindows({ grid, wallTransmission: silica, solventAbsorbance: solvent, substrateAbsorbance: substrate, otherAbsorbance: competitor });
		expect(w).toEqual([{ fromNm: 250, toNm: 274 }]);
		const acetoneLike = wl.map((x) => 10 ** ((330 - x) / 10)); // cut-off 330 nm (REFERENCE.md §1, from memory)
		expect(findWindows({ grid, wallTransmission: silica, solventAbsorbance: acetoneLike, substrateAbsorbance: substrate })).toEqual([]);
	});
	it('documents its defaults', () => {
		expect(DEFAULT_WINDOW_THRESHOLDS).toEqual({ minWallTransmission: 0.5, maxSolventAbsorbance: 0.5, minSubstrateAbsorbance: 0.1, minSelectivity: 0.5 });
	});
});
