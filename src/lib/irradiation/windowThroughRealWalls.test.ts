/**
 * The window finder on the group's real wall data (src/lib/irradiation/data/materials.ts, derived from the CC0
 * refractive-index database) rather than synthetic edges.
 */
import { describe, expect, it } from 'vitest';
import { computeWindow } from './computeWindow';
import { findWallMaterial } from './data/materials';
import { findSolvent, solventAbsorbanceOnGrid } from './solvents';
import { lampSpectrum, photonFluxSpectrum } from './lamps';
import { wallTransmissionOnGrid } from './walls';
import { COMPUTATION_GRID, gridWavelengths } from './wavelengthGrid';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
/** Invented substrate: one Gaussian band at 255 nm (FWHM 25 nm, ε 8000) — it absorbs only below ≈ 290 nm. */
const eps = wl.map((x) => 8000 * Math.exp((-4 * Math.LN2 * (x - 255) ** 2) / 25 ** 2));
const acetonitrile = findSolvent('acetonitrile')!;
const solv = solventAbsorbanceOnGrid(acetonitrile.cutoffNm, grid.fromNm, grid.stepNm, grid.count, 1);
const lamp = (peakNm: number) => ({ id: String(peakNm), name: `${peakNm} nm LED`, photonFluxPerNm: photonFluxSpectrum(lampSpectrum({ type: 'led', peakNm, fwhmNm: 12 }, 1, grid)) });

function windowsThrough(materialId: string, thicknessMm: number) {
	const m = findWallMaterial(materialId)!;
	const out = computeWindow({
		grid,
		substrate: { name: 'substrate', epsilon: eps, concentrationM: 0.001 },
		solventAbsorbancePerCm: solv,
		wallTransmission: wallTransmissionOnGrid(m.definition, thicknessMm, grid.fromNm, grid.stepNm, grid.count),
		pathCm: 1,
		lamps: [lamp(265), lamp(365)]
	});
	if (!out.ok) throw new Error(JSON.stringify(out.issues));
	return out.value;
}

describe('windows through real wall data', () => {
	it('a substrate absorbing only below 290 nm has no window in 2 mm borosilicate 3.3 tubing but one in fused silica', () => {
		// common practice: borosilicate 3.3 blocks UV-C below ≈ 280 nm, fused silica transmits to < 200 nm
		expect(windowsThrough('borosilicate-3.3-tubing', 2).windows).toEqual([]);
		const silica = windowsThrough('fused-silica-uv-grade', 2);
		expect(silica.windows.length).toBeGreaterThan(0);
		expect(silica.windows[0].fromNm).toBeLessThan(260);
		// the 265 nm LED is the useful lamp through silica (common practice: UV-C source for a UV-C absorber)
		expect(silica.lamps[0].name).toBe('265 nm LED');
		expect(silica.lamps[0].absorbedPhotonFluxEinsteinPerS).toBeGreaterThan(0);
	});

	it('through borosilicate the 265 nm LED loses most of its photons in the wall', () => {
		const boro = windowsThrough('borosilicate-3.3-tubing', 2);
		const led265 = boro.lamps.find((l) => l.name === '265 nm LED')!;
		// REFERENCE.md §2.3 [computed]: 2 mm tubing internal T ≈ 0 at 254 nm and 0.002 at 280 nm
		expect(led265.shares.wall).toBeGreaterThan(0.9);
	});
});
