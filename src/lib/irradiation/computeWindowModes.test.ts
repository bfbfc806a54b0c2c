import { describe, expect, it } from 'vitest';
import { photonFluxEinsteinPerS } from './constants';
import { computeWindow, computeWindowRanking, type ComputeWindowInput } from './computeWindow';
import { adaptiveSimpson } from './reactions/testSolvers';
import { COMPUTATION_GRID, gridWavelengths } from './wavelengthGrid';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const band = (mu: number, fwhm: number, peak: number) => wl.map((x) => peak * Math.exp((-4 * Math.LN2 * (x - mu) ** 2) / (fwhm * fwhm)));
const led = (peak: number, fwhm: number, powerW: number) => band(peak, fwhm, (powerW * 2 * Math.sqrt(Math.LN2 / Math.PI)) / fwhm).map((p, i) => photonFluxEinsteinPerS(p, wl[i]));

// Invented photoredox mixture: a UV-absorbing aryl halide substrate (0.1 M), an invented ruthenium-like catalyst
// (1 mM, band 452 nm), in a solvent with a 190 nm cut-off; lamps of 1 W each: a 450 nm LED, a 365 nm LED, a UV tube at 313 nm.
const substrate = { name: 'aryl bromide', epsilon: band(275, 30, 1200), concentrationM: 0.1 };
const catalyst = { name: 'Ru catalyst', epsilon: wl.map((x, i) => band(452, 70, 14000)[i] + band(290, 30, 80000)[i]), concentrationM: 0.001 };
const base: ComputeWindowInput = {
	grid,
	substrate,
	solventAbsorbancePerCm: wl.map((x) => 10 ** ((190 - x) / 10)),
	wallTransmission: wl.map((x) => 0.92 / (1 + Math.exp(-(x - 290) / 6))),
	pathCm: 1,
	lamps: [
		{ id: 'uv313', name: 'UV-B tube', photonFluxPerNm: led(313, 30, 1) },
		{ id: 'led365', name: '365 nm LED', photonFluxPerNm: led(365, 12, 1) },
		{ id: 'led450', name: '450 nm LED', photonFluxPerNm: led(450, 22, 1) }
	],
	quantumYield: 0.5,
	volumeL: 0.004
};

describe('photocatalytic mode in the Window finder', () => {
	it('ranks the blue LED first and does not count the photocatalyst as a competitor', () => {
		const r = computeWindow({ ...base, reaction: { type: 'photocatalytic', photocatalyst: catalyst } });
		if (!r.ok) throw new Error(JSON.stringify(r.issues));
		const v = r.value;
		expect(v.lamps[0].id).toBe('led450');
		expect(v.reaction.intendedAbsorber).toBe('Ru catalyst');
		expect(v.lamps[0].perSpecies.map((s) => s.name)).toEqual(['Ru catalyst', 'aryl bromide']);
		expect(v.lamps[0].absorbedByIntendedEinsteinPerS).toBe(v.lamps[0].absorbedPhotonFluxEinsteinPerS);
		expect(v.lamps[0].sentence).toMatch(/reach the photocatalyst$/);
		// headline: the catalyst's longest-wavelength band sits at 452 nm; wall T there from the wall curve
		expect(v.wallTransmissionAtBandMaximum!.wavelengthNm).toBe(452);
		expect(v.wallTransmissionAtBandMaximum!.transmission).toBeCloseTo(0.92 / (1 + Math.exp(-(452 - 290) / 6)), 9);
		expect(v.explanation[0]).toMatch(/^At its band maximum \(452 nm\) the wall passes 92 %/);
		expect(v.windows.some((w) => w.fromNm <= 452 && w.toNm >= 452)).toBe(true);
		// zero order with a (nearly) transparent substrate at 450 nm: t90 ≈ 0.9·n₀/(Φ·q_abs,cat(0)) (closed form)
		const best = v.lamps[0];
		expect(best.timeTo90PctS! / ((0.9 * 0.1 * 0.004) / (0.5 * best.absorbedByIntendedEinsteinPerS))).toBeCloseTo(1, 3);
		// the ranking over lamps × walls × solvents uses the photocatalyst as well
		const rk = computeWindowRanking({ ...base, reaction: { type: 'photocatalytic', photocatalyst: catalyst }, walls: [{ id: 'w', name: 'wall', transmission: base.wallTransmission }], solvents: [{ id: 's', name: 'solvent', absorbancePerCm: base.solventAbsorbancePerCm }] });
		if (!rk.ok) throw new Error('ranking failed');
		expect(rk.value.combinations[0].lampId).toBe('led450');
		expect(rk.value.combinations[0].sentence).toMatch(/photocatalyst$/);
	});

	it('the old way — the catalyst entered as another absorber in direct mode — makes the blue LED look useless', () => {
		const r = computeWindow({ ...base, others: [catalyst] });
		if (!r.ok) throw new Error('issues');
		expect(r.value.lamps[0].id).not.toBe('led450');
	});

	it('Φ up to 10⁴ (chains) is accepted with a note; above is refused naming the field', () => {
		const ok = computeWindow({ ...base, quantumYield: 5000 });
		if (!ok.ok) throw new Error('issues');
		expect(ok.value.reaction.notes.join(' ')).toMatch(/chain reaction/);
		const bad = computeWindow({ ...base, quantumYield: 2e4 });
		expect(bad.ok).toBe(false);
		if (!bad.ok) expect(bad.issues[0].field).toBe('quantumYield');
	});
});

describe('reversible mode in the Window finder', () => {
	// invented E/Z switch: E absorbs at 330 nm strongly, Z less there but more at 440 nm
	const eE = wl.map((_, i) => band(330, 50, 20000)[i] + band(440, 60, 400)[i]);
	const eZ = wl.map((_, i) => band(300, 60, 6000)[i] + band(435, 60, 1400)[i]);
	it('gives the PSS per lamp, null t90 with a reason, time to 90 % of the PSS, and the PSS over wavelength', () => {
		const r = computeWindow({ ...base, substrate: { name: 'E isomer', epsilon: eE, concentrationM: 1e-4 }, quantumYield: 0.12, reaction: { type: 'reversible', product: { name: 'Z isomer', epsilon: eZ }, quantumYieldBack: 0.45 } });
		if (!r.ok) throw new Error(JSON.stringify(r.issues));
		const v = r.value;
		const l365 = v.lamps.find((l) => l.id === 'led365')!;
		expect(l365.photostationaryProductFraction).toBeGreaterThan(0.5);
		expect(l365.photostationaryProductFraction).toBeLessThan(0.9);
		expect(l365.timeTo90PctS).toBeNull();
		expect(l365.unreachableReason).toMatch(/photostationary state/);
		expect(l365.timeTo90PctOfStationaryS).toBeGreaterThan(0);
		expect(l365.timeTo50PctS).toBeGreaterThan(0);
		// monochromatic PSS curve agrees with the closed form at 365 nm: ε_E·Φ_f/(ε_E·Φ_f + ε_Z·Φ_b)
		const k = v.photostationaryCurve!.wavelengthNm.indexOf(365);
		const i = (365 - grid.fromNm) / grid.stepNm;
		expect(v.photostationaryCurve!.productFraction[k]).toBeCloseTo((eE[i] * 0.12) / (eE[i] * 0.12 + eZ[i] * 0.45), 12);
		expect(v.bestPhotostationaryWavelength!.productFraction).toBeGreaterThanOrEqual(v.photostationaryCurve!.productFraction[k] - 1e-12);
		const l450 = v.lamps.find((l) => l.id === 'led450')!;
		expect(l450.photostationaryProductFraction!).toBeLessThan(l365.photostationaryProductFraction!);
	});
	it('refuses a reversible mode without the back quantum yield', () => {
		const r = computeWindow({ ...base, reaction: { type: 'reversible', product: { name: 'Z', epsilon: eZ }, quantumYieldBack: undefined as unknown as number } });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues[0].field).toBe('reaction.quantumYieldBack');
	});
});

describe('vessel shapes in the Window finder', () => {
	it('cylinder: the absorbed share equals the chord average of the contract (independent quadrature), and is below the slab', () => {
		// a flat ε and a transparent wall/solvent: every photon entering meets a = ε·c cm⁻¹
		const flat = new Float64Array(grid.count).fill(100);
		const input: ComputeWindowInput = { ...base, substrate: { name: 'S', epsilon: flat, concentrationM: 5e-4 }, wallTransmission: new Float64Array(grid.count).fill(1), solventAbsorbancePerCm: new Float64Array(grid.count), lamps: [base.lamps[1]], volumeL: undefined };
		const cyl = computeWindow({ ...input, vessel: { shape: 'cylinder', innerDiameterCm: 4 } });
		const slab = computeWindow({ ...input, pathCm: 4 });
		if (!cyl.ok || !slab.ok) throw new Error('issues');
		const a = 100 * 5e-4, r = 2;
		const chord = adaptiveSimpson((y) => 1 - 10 ** (-a * 2 * Math.sqrt(Math.max(0, r * r - y * y))), -r, r) / (2 * r); // (1/D)∫(1 − 10^(−a·2√(R²−y²)))dy
		expect(chord).toBeCloseTo(0.29966, 5); // the contract's check value at a = 0.05 cm⁻¹, D = 4 cm
		expect(cyl.value.lamps[0].fractionOfLampPhotonsToSubstrate).toBeCloseTo(chord, 6);
		expect(slab.value.lamps[0].fractionOfLampPhotonsToSubstrate).toBeCloseTo(1 - 10 ** -0.2, 6);
		expect(cyl.value.vessel.meanPathCm).toBeCloseTo(Math.PI, 12);
		expect(cyl.value.lamps[0].shares.transmitted).toBeCloseTo(1 - chord, 6);
		// penetration depth: a·d = 1 → d = 20 cm (Beer–Lambert), longer than the tube
		expect(cyl.value.lamps[0].penetrationDepth90Cm).toBeCloseTo(20, 4);
	});
	it('annulus: the gap is the path; outer ≤ inner names the field', () => {
		const ann = computeWindow({ ...base, vessel: { shape: 'annulus', innerDiameterCm: 3, outerDiameterCm: 5 }, pathCm: undefined as unknown as number });
		if (!ann.ok) throw new Error(JSON.stringify(ann.issues));
		expect(ann.value.vessel.referencePathCm).toBe(1);
		const bad = computeWindow({ ...base, vessel: { shape: 'annulus', innerDiameterCm: 5, outerDiameterCm: 4 } });
		expect(bad.ok).toBe(false);
		if (!bad.ok) expect(bad.issues[0].field).toBe('vessel.outerDiameterCm');
	});
});
