import { describe, expect, it } from 'vitest';
import { photonFluxEinsteinPerS } from './constants';
import { computeWindow, computeWindowRanking, type ComputeWindowInput } from './computeWindow';
import { COMPUTATION_GRID, gridWavelengths } from './wavelengthGrid';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const band = (mu: number, fwhm: number, peak: number) => wl.map((x) => peak * Math.exp((-4 * Math.LN2 * (x - mu) ** 2) / (fwhm * fwhm)));
/** Gaussian LED of `powerW` (area-normalised, PRODUCT.md q = P·λ/(hcN_A)). */
const led = (peak: number, fwhm: number, powerW: number) =>
	band(peak, fwhm, (powerW * 2 * Math.sqrt(Math.LN2 / Math.PI)) / fwhm).map((p, i) => photonFluxEinsteinPerS(p, wl[i]));

// invented scenario: the demo group's enone (band 330 nm), a 390 nm and a 450 nm LED, borosilicate-like wall
const input: ComputeWindowInput = {
	grid,
	substrate: { name: 'enone', epsilon: band(330, 60, 3000), concentrationM: 0.05 },
	others: [{ name: 'additive', epsilon: band(280, 30, 8000), concentrationM: 0.01 }],
	product: { name: 'cyclobutane', epsilon: band(300, 30, 500) },
	solventAbsorbancePerCm: wl.map((x) => 10 ** ((190 - x) / 10)),
	wallTransmission: wl.map((x) => 0.92 / (1 + Math.exp(-(x - 300) / 5))),
	pathCm: 1,
	lamps: [
		{ id: 'led450', name: '450 nm LED', photonFluxPerNm: led(450, 20, 1) },
		{ id: 'led365', name: '365 nm LED', photonFluxPerNm: led(365, 10, 1) }
	],
	quantumYield: 0.3,
	volumeL: 0.005,
	names: { wall: '2 mm borosilicate 3.3' }
};

describe('computeWindow', () => {
	it('answers windows, ranked lamps with shares, per-species flux and times', () => {
		const r = computeWindow(input);
		if (!r.ok) throw new Error(JSON.stringify(r.issues));
		const v = r.value;
		expect(v.windows.length).toBe(1);
		expect(v.windows[0].fromNm).toBeGreaterThanOrEqual(300);
		expect(v.lamps.map((l) => l.id)).toEqual(['led365', 'led450']);
		const best = v.lamps[0];
		// photon conservation: wall + solvent + species + transmitted = 1 (tolerance 1e-9)
		expect(best.shares.wall + best.shares.solvent + best.shares.species.reduce((s, x) => s + x.share, 0) + best.shares.transmitted).toBeCloseTo(1, 9);
		expect(best.perSpecies.map((s) => s.name)).toEqual(['enone', 'additive']);
		// 1 W at 365 nm = 3.0512 µmol s⁻¹ (REFERENCE.md §4, CODATA 2018)
		expect(best.incidentPhotonFluxEinsteinPerS * 1e6).toBeCloseTo(3.0512, 3);
		expect(best.timeTo50PctS!).toBeLessThan(best.timeTo90PctS!);
		expect(best.timeTo90PctS!).toBeLessThan(best.timeTo99PctS!);
		expect(best.timeCourse!.timeS.length).toBeGreaterThan(10);
		expect(best.sentence).toMatch(/^the 365 nm LED through 2 mm borosilicate 3\.3: \d+ % of its photons reach the substrate$/);
		expect(v.cautions).toEqual([]);
		expect(JSON.parse(JSON.stringify(v)).lamps[0].timeTo90PctS).toBe(best.timeTo90PctS);
	});
	it('gives no times without a volume, and explains a missing window', () => {
		const r = computeWindow({ ...input, volumeL: undefined, substrate: { ...input.substrate, epsilon: band(250, 20, 3000) } });
		if (!r.ok) throw new Error('unexpected issues');
		expect(r.value.windows).toEqual([]);
		expect(r.value.lamps[0].timeTo90PctS).toBeNull();
		// the headline comes first (the wall at the band maximum), then the window sentence
		expect(r.value.explanation[0]).toMatch(/^At its band maximum \(250 nm\) the wall passes 0 %/);
		expect(r.value.explanation[1]).toMatch(/No usable window.*the wall blocks 100 %/);
	});
	it('names the bad fields; a negative concentration is physically invalid', () => {
		const r = computeWindow({ ...input, substrate: { ...input.substrate, concentrationM: -1 }, wallTransmission: [1, 2] });
		expect(r.ok).toBe(false);
		if (r.ok) return;
		expect(r.issues).toContainEqual(expect.objectContaining({ field: 'substrate.concentrationM', code: 'physically-invalid' }));
		expect(r.issues).toContainEqual(expect.objectContaining({ field: 'wallTransmission', code: 'invalid' }));
	});
});

describe('computeWindowRanking', () => {
	it('ranks lamps × walls × solvents', () => {
		const { wallTransmission, solventAbsorbancePerCm, names, ...rest } = input;
		const r = computeWindowRanking({
			...rest,
			walls: [
				{ id: 'boro', name: '2 mm borosilicate 3.3', transmission: wallTransmission },
				{ id: 'silica', name: '2 mm fused silica', transmission: new Float64Array(grid.count).fill(0.93) }
			],
			solvents: [
				{ id: 'mecn', name: 'acetonitrile', absorbancePerCm: solventAbsorbancePerCm },
				{ id: 'acetone', name: 'acetone', absorbancePerCm: wl.map((x) => 10 ** ((330 - x) / 10)) }
			]
		});
		if (!r.ok) throw new Error('unexpected issues');
		expect(r.value.totalCombinations).toBe(8);
		expect(r.value.combinations[0]).toMatchObject({ lampId: 'led365', wallId: 'silica', solventId: 'mecn' });
		expect(r.value.windows.length).toBe(4);
	});
});
