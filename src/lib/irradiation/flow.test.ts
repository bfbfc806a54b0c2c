import { describe, expect, it } from 'vitest';
import { computeFlow } from './flow';
import { COMPUTATION_GRID, gridWavelengths, trapezoidUniform } from './wavelengthGrid';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const lamp = wl.map((x) => 2e-8 * Math.exp((-4 * Math.LN2 * (x - 450) ** 2) / 400)); // invented 450 nm LED
const flat = (v: number) => new Float64Array(grid.count).fill(v);
const input = {
	stepNm: grid.stepNm,
	photonFluxInMixturePerNm: lamp,
	pathCm: 0.1,
	substrateEpsilon: flat(5000),
	substrateConcentrationM: 0.05, // A₀ = 5000 × 0.05 × 0.1 = 25: optically thick
	quantumYield: 0.8,
	reactorVolumeMl: 10,
	flowRateMlPerMin: 1
};

describe('computeFlow', () => {
	it('residence time, photons per molecule and productivity', () => {
		const r = computeFlow(input);
		if (!r.ok) throw new Error('unexpected issues');
		// τ = V_R/F = 10 mL / (1 mL min⁻¹) = 600 s (common practice definition)
		expect(r.value.residenceTimeS).toBeCloseTo(600, 9);
		const q = trapezoidUniform(lamp, grid.stepNm);
		// photons per molecule = q·τ/(c₀·V_R) (arithmetic)
		expect(r.value.incidentPhotonsPerMolecule).toBeCloseTo((q * 600) / (0.05 * 0.01), 9);
		// optically thick while X is small → all photons absorbed; closed form with A ≫ 1: X = Φ·q·τ/n₀ (Beer–Lambert, 1 − 10^(−A) ≈ 1)
		const expectedX = (0.8 * q * 600) / (0.05 * 0.01);
		expect(r.value.conversion).toBeCloseTo(expectedX, 6);
		// productivity = ν·c₀·F·X, F = 0.06 L h⁻¹
		expect(r.value.productivityMolPerH).toBeCloseTo(0.05 * 0.06 * r.value.conversion, 12);
	});
	it('names the bad field', () => {
		const r = computeFlow({ ...input, flowRateMlPerMin: 0, reactorVolumeMl: -1 });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues.map((i) => i.field).sort()).toEqual(['flowRateMlPerMin', 'reactorVolumeMl']);
	});
});
