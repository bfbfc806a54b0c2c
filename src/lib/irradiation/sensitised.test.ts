import { describe, expect, it } from 'vitest';
import { speciesAbsorbance } from './innerFilter';
import { suggestPhotocatalysts, type CatalystCandidate } from './sensitised';
import { COMPUTATION_GRID, gridWavelengths } from './wavelengthGrid';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const band = (mu: number, fwhm: number, eps: number) => wl.map((x) => eps * Math.exp((-4 * Math.LN2 * (x - mu) ** 2) / (fwhm * fwhm)));
// invented scenario: a diene-like substrate absorbing only at 230 nm (behind a borosilicate-like wall)
const substrate = speciesAbsorbance(band(230, 30, 20000), 0.1, 1);
const wall = wl.map((x) => 0.92 / (1 + Math.exp(-(x - 300) / 5)));
const solvent = wl.map((x) => 10 ** ((190 - x) / 10));
const candidates: CatalystCandidate[] = [
	{ id: 'hi', name: 'catalyst Hi', epsilon: band(380, 40, 6000), tripletEnergyKJPerMol: 265 },
	{ id: 'lo', name: 'catalyst Lo', epsilon: band(450, 50, 14000), tripletEnergyKJPerMol: 205 },
	{ id: 'close', name: 'catalyst Close', epsilon: band(400, 40, 8000), tripletEnergyKJPerMol: 255 },
	{ id: 'unknown', name: 'catalyst Unknown', epsilon: band(420, 40, 8000) },
	{ id: 'uv', name: 'catalyst UV', epsilon: band(240, 20, 8000), tripletEnergyKJPerMol: 320 }
];
const input = { grid, pathCm: 1, wallTransmission: wall, solventAbsorbance: solvent, competingAbsorbance: substrate, substrateTripletEnergyKJPerMol: 250, candidates };

describe('suggestPhotocatalysts', () => {
	it('suggests a catalyst whose triplet energy exceeds the substrate’s, never one below it', () => {
		// triplet–triplet energy transfer needs E_T(sensitiser) > E_T(acceptor) (IUPAC Glossary 2007, "photosensitization");
		// 10 kJ mol⁻¹ margin: common practice
		const r = suggestPhotocatalysts(input);
		expect(r.suggestions.map((s) => s.id)).toEqual(['hi']);
		expect(r.rejected.map((s) => s.id).sort()).toEqual(['close', 'lo', 'uv']);
		expect(r.rejected.find((s) => s.id === 'uv')?.reason).toMatch(/no usable window/);
		expect(r.suggestions[0].windows.length).toBeGreaterThan(0);
	});
	it('the margin is adjustable, and a catalyst below the substrate stays out even at margin 0', () => {
		const r = suggestPhotocatalysts({ ...input, marginKJPerMol: 0 });
		expect(r.suggestions.map((s) => s.id).sort()).toEqual(['close', 'hi']);
		expect(r.suggestions.some((s) => s.id === 'lo')).toBe(false);
	});
	it('says which data are missing when energies are unknown', () => {
		const r = suggestPhotocatalysts(input);
		expect(r.needsData.map((s) => s.id)).toEqual(['unknown']);
		expect(r.needsData[0].missing).toEqual(['triplet energy of catalyst Unknown (kJ mol⁻¹)']);
		const noSubstrate = suggestPhotocatalysts({ ...input, substrateTripletEnergyKJPerMol: undefined });
		expect(noSubstrate.suggestions).toEqual([]);
		expect(noSubstrate.needsData.find((s) => s.id === 'hi')?.missing).toEqual(['triplet energy of the substrate (kJ mol⁻¹)']);
	});
});
