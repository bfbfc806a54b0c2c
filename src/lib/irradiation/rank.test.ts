import { describe, expect, it } from 'vitest';
import { absorbedPhotonFlux } from './innerFilter';
import { rankCombinations, rankedEntries, type RankInput } from './rank';
import { COMPUTATION_GRID, gridWavelengths } from './wavelengthGrid';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const gauss = (mu: number, fwhm: number, peak: number) => wl.map((x) => peak * Math.exp((-4 * Math.LN2 * (x - mu) ** 2) / (fwhm * fwhm)));

// invented demo inputs: a substrate band at 320 nm, a competitor at 450 nm, LEDs at 310/365/450 nm
const input: RankInput = {
	stepNm: grid.stepNm,
	pathCm: 1,
	substrateAbsorbance: gauss(320, 50, 1.5),
	otherAbsorbance: gauss(450, 60, 0.8),
	lamps: [
		{ id: 'led310', name: '310 nm LED', photonFluxPerNm: gauss(310, 12, 1e-7) },
		{ id: 'led365', name: '365 nm LED', photonFluxPerNm: gauss(365, 10, 6e-7) },
		{ id: 'led450', name: '450 nm LED', photonFluxPerNm: gauss(450, 20, 5e-7) }
	],
	walls: [
		{ id: 'silica', name: '2 mm fused silica', transmission: new Float64Array(grid.count).fill(0.93) },
		{ id: 'boro', name: '2 mm borosilicate 3.3', transmission: wl.map((x) => 0.92 / (1 + Math.exp(-(x - 300) / 5))) }
	],
	solvents: [
		{ id: 'mecn', name: 'acetonitrile', absorbancePerCm: wl.map((x) => 10 ** ((190 - x) / 10)) },
		{ id: 'tol', name: 'toluene', absorbancePerCm: wl.map((x) => 10 ** ((284 - x) / 10)) }
	]
};

describe('rankCombinations', () => {
	const ranking = rankCombinations(input);
	it('agrees with the per-combination inner-filter integral (1e-9 relative)', () => {
		// consistency with innerFilter.absorbedPhotonFlux (same IUPAC 2007 fractions, untrimmed trapezoid)
		for (let l = 0; l < 3; l++)
			for (let w = 0; w < 2; w++)
				for (let s = 0; s < 2; s++) {
					const ref = absorbedPhotonFlux({
						stepNm: grid.stepNm,
						photonFluxPerNm: input.lamps[l].photonFluxPerNm,
						wallTransmission: input.walls[w].transmission,
						speciesAbsorbance: [input.substrateAbsorbance, input.otherAbsorbance!],
						solventAbsorbance: input.solvents[s].absorbancePerCm
					});
					const idx = (l * 2 + w) * 2 + s;
					const total = ref.perSpeciesEinsteinPerS[0] + ref.perSpeciesEinsteinPerS[1];
					expect(Math.abs(ranking.substrateFluxEinsteinPerS[idx] - ref.perSpeciesEinsteinPerS[0])).toBeLessThanOrEqual(1e-9 * ref.incidentEinsteinPerS);
					expect(Math.abs(ranking.speciesFluxEinsteinPerS[idx] - total)).toBeLessThanOrEqual(1e-9 * ref.incidentEinsteinPerS);
				}
	});
	it('orders by absorbed substrate flux and words the sentence with the caller’s names', () => {
		const flux = Array.from(ranking.order, (i) => ranking.substrateFluxEinsteinPerS[i]);
		for (let k = 1; k < flux.length; k++) expect(flux[k]).toBeLessThanOrEqual(flux[k - 1]);
		const top = rankedEntries(input, ranking, 3);
		expect(top[0].lampId).toBe('led365'); // a 6e-7 peak on the band's flank beats the weaker 310 nm LED (invented data)
		expect(top[0].wallId).toBe('silica');
		expect(top[0].sentence).toMatch(/^the 365 nm LED through 2 mm fused silica in acetonitrile: \d+ % of its photons reach the substrate$/);
		expect(top[0].fractionOfLampPhotonsToSubstrate).toBeGreaterThan(0);
		expect(top[0].fractionOfLampPhotonsToSubstrate).toBeLessThan(1);
	});
	it('toluene and borosilicate cost the 310 nm LED most of its photons', () => {
		// common practice: toluene cut-off ~284 nm and borosilicate edge ~300 nm sit on the 310 nm LED's short side
		const at = (w: number, s: number) => ranking.substrateFluxEinsteinPerS[(0 * 2 + w) * 2 + s];
		expect(at(1, 0)).toBeLessThan(at(0, 0));
		expect(at(0, 1)).toBeLessThan(at(0, 0));
	});
	it('leaves out combinations that are not allowed', () => {
		const r = rankCombinations({ ...input, isAllowed: (_l, w) => w === 0 });
		expect(r.order.length).toBe(6);
		for (const i of r.order) expect(Math.floor(i / 2) % 2).toBe(0);
	});

	it('sorts many combinations exactly like a comparator would (flux, then selectivity, then index)', () => {
		// 24 lamps (with exact duplicates and a lamp the walls block entirely), 6 walls, 12 solvents: ties and zeros
		const lamps = Array.from({ length: 24 }, (_, k) => ({ id: `L${k}`, name: `L${k}`, photonFluxPerNm: k === 23 ? gauss(200, 5, 1e-7) : gauss(300 + (k % 12) * 15, 10 + (k % 3) * 5, 1e-7 * (1 + (k % 4))) }));
		const walls = Array.from({ length: 6 }, (_, k) => ({ id: `W${k}`, name: `W${k}`, transmission: wl.map((x) => 0.9 / (1 + Math.exp(-(x - (230 + k * 20)) / 4))) }));
		const solvents = Array.from({ length: 12 }, (_, k) => ({ id: `S${k}`, name: `S${k}`, absorbancePerCm: wl.map((x) => 10 ** ((190 + k * 12 - x) / 10)) }));
		const big = { ...input, lamps, walls, solvents };
		const r = rankCombinations(big);
		const sel = (i: number) => (r.speciesFluxEinsteinPerS[i] > 0 ? r.substrateFluxEinsteinPerS[i] / r.speciesFluxEinsteinPerS[i] : 0);
		const expected = Array.from(r.order).sort((x, y) => r.substrateFluxEinsteinPerS[y] - r.substrateFluxEinsteinPerS[x] || sel(y) - sel(x) || x - y);
		expect(Array.from(r.order)).toEqual(expected);
		expect(r.order.length).toBe(24 * 6 * 12);
	});
});
