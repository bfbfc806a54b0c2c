/**
 * POST /api/window reaction modes and vessels through the service the route uses (real test database), and plans
 * that keep the new fields. Spectra and lamps are invented test data in throw-away groups (spx-…); expected values
 * come from closed forms named beside each check.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../src/lib/server/db/index';
import { computeWindowFor } from '../../src/lib/server/services/window';
import { createPlan } from '../../src/lib/server/services/plans';
import { createLamp } from '../../src/lib/server/services/lampsApi';
import { apiFailure, csvOf, gauss, localsOf, resetSpectraWorld, upload } from './spectraTestKit';

const ε = 'wavelength (nm),epsilon (M-1 cm-1)';
let ids: { substrate: number; catalyst: number; e: number; z: number };
let lampIds: { blue: number; uv: number; violet: number };
let solventId: number, wallId: number, groupA: number;
let nLiquid: number, nWall: number;

async function spectrum(name: string, f: (x: number) => number, part: string) {
	const r = await upload('member', `${name}.csv`, csvOf(ε, f, 220, 700), { name, part, kind: 'absorption', yUnit: 'epsilon' });
	return Number(r.items[0].id);
}

beforeAll(async () => {
	({ groupA } = await resetSpectraWorld());
	const k = db();
	await k('plans').whereIn('group_id', [groupA]).delete();
	await k('lamps').whereIn('group_id', [groupA]).delete();
	ids = {
		substrate: await spectrum('spx aryl halide', (x) => gauss(x, 272, 14, 1500), 'substrate'),
		catalyst: await spectrum('spx blue catalyst', (x) => gauss(x, 452, 28, 14000) + gauss(x, 290, 15, 60000), 'photocatalyst'),
		e: await spectrum('spx switch E', (x) => gauss(x, 330, 22, 20000) + gauss(x, 440, 25, 400), 'substrate'),
		z: await spectrum('spx switch Z', (x) => gauss(x, 300, 25, 6000) + gauss(x, 435, 25, 1400), 'product')
	};
	const lamp = async (name: string, peakNm: number, fwhmNm: number) => Number((await createLamp(localsOf('member'), { name, model: { type: 'led', peakNm, fwhmNm }, powerW: 1, groupId: groupA })).id);
	lampIds = { blue: await lamp('spx 450 nm LED', 450, 20), uv: await lamp('spx 310 nm LED', 310, 12), violet: await lamp('spx 365 nm LED', 365, 12) };
	const solvent = await k('solvents').where({ slug: 'acetonitrile' }).first('id', 'refractive_index');
	const wall = await k('wall_materials').where({ slug: 'fused-silica-uv-grade' }).first('id', 'refractive_index');
	solventId = Number(solvent.id);
	wallId = Number(wall.id);
	nLiquid = Number(solvent.refractive_index);
	nWall = Number(wall.refractive_index);
});

afterAll(async () => {
	const k = db();
	await k('plans').whereIn('group_id', [groupA]).delete();
	await k('lamps').whereIn('group_id', [groupA]).delete();
});

const body = (extra: Record<string, unknown> = {}): Record<string, unknown> => ({
	substrate: { spectrumId: ids.substrate, concentrationM: 0.1 },
	solvent: { id: solventId },
	wall: { materialId: wallId, thicknessMm: 1.5 },
	pathCm: 1,
	lamps: [lampIds.uv, lampIds.violet, lampIds.blue],
	quantumYield: 0.5,
	volumeL: 0.004,
	...extra
});

describe('POST /api/window — reaction modes', () => {
	it('photocatalytic: the photocatalyst is the intended absorber; the blue LED ranks first', async () => {
		const r = await computeWindowFor(localsOf('viewer'), body({ reaction: { type: 'photocatalytic', photocatalyst: { spectrumId: ids.catalyst, concentrationM: 0.001 } }, others: [{ spectrumId: ids.catalyst, concentrationM: 0.001 }] }));
		expect(r.lamps[0].id).toBe(lampIds.blue);
		expect(r.lamps[0].absorbedByIntendedEinsteinPerS).toBeGreaterThan(0);
		expect(r.reaction.type).toBe('photocatalytic');
		expect(r.reaction.intendedAbsorber).toBe('spx blue catalyst');
		// the catalyst given again among `others` is counted once
		expect(r.lamps[0].perSpecies.map((s: { name: string }) => s.name)).toEqual(['spx blue catalyst', 'spx aryl halide']);
		expect(r.reaction.notes.join(' ')).toMatch(/counted once/);
		expect(r.wallTransmissionAtBandMaximum!.wavelengthNm).toBe(452);
		// fused silica with liquid inside: the inner face is glass/liquid — factor (1 − R_gl)/(1 − R_ga), R Fresnel (Born & Wolf)
		const R = (a: number, b: number) => ((a - b) / (a + b)) ** 2;
		expect(r.wall.innerFace.factor).toBeCloseTo((1 - R(nWall, nLiquid)) / (1 - R(nWall, 1)), 10);
		// zero order (catalyst A ≈ 14 at 452 nm takes all light; substrate transparent there): t90 = 0.9·n₀/(Φ·q_abs,cat)
		expect(r.lamps[0].timeTo90PctS! / ((0.9 * 0.1 * 0.004) / (0.5 * r.lamps[0].absorbedByIntendedEinsteinPerS))).toBeCloseTo(1, 2);
		expect(r.ranking!.combinations[0].lampId).toBe(String(lampIds.blue));
		// penetration depth: ε(452) = 14 000 at 1 mM → a = 14 cm⁻¹; monochromatic 90 % depth 1/a = 0.71 mm (Beer–Lambert);
		// the 450 nm LED's band is wider than the catalyst peak, so its 90 % depth is a little longer
		expect(r.penetrationDepth90AtBandMaximumCm).toBeCloseTo(1 / 14, 2);
		expect(r.lamps[0].penetrationDepth90Cm).toBeGreaterThan(1 / 14);
		expect(r.lamps[0].penetrationDepth90Cm).toBeLessThan(0.3);
		expect(r.explanation.join(' ')).toMatch(/stir hard/);
	});

	it('reversible: photostationary state per lamp, 90 % conversion null with a reason, PSS curve', async () => {
		const r = await computeWindowFor(localsOf('viewer'), body({ substrate: { spectrumId: ids.e, concentrationM: 1e-4 }, quantumYield: 0.12, reaction: { type: 'reversible', product: { spectrumId: ids.z }, quantumYieldBack: 0.45 } }));
		const l365 = r.lamps.find((l: { id: number }) => l.id === lampIds.violet)!;
		expect(l365.photostationaryProductFraction).toBeGreaterThan(0.3);
		expect(l365.photostationaryProductFraction).toBeLessThan(0.9);
		expect(l365.timeTo90PctS).toBeNull();
		expect(l365.unreachableReason).toMatch(/photostationary state holds/);
		expect(l365.timeTo90PctOfStationaryS).toBeGreaterThan(0);
		expect(r.photostationaryCurve!.wavelengthNm.length).toBeGreaterThan(100);
		expect(r.bestPhotostationaryWavelength!.productFraction).toBeGreaterThan(l365.photostationaryProductFraction! - 0.05);
		expect(r.explanation.join(' ')).toMatch(/photostationary state holds/);
	});

	it('round vessels: a cylinder absorbs less than a slab of its diameter and says its model', async () => {
		const cyl = await computeWindowFor(localsOf('viewer'), body({ vessel: { shape: 'cylinder', innerDiameterCm: 4 }, pathCm: undefined, substrate: { spectrumId: ids.substrate, concentrationM: 1e-5 } }));
		const slab = await computeWindowFor(localsOf('viewer'), body({ pathCm: 4, substrate: { spectrumId: ids.substrate, concentrationM: 1e-5 } }));
		const c = cyl.lamps.find((l: { id: number }) => l.id === lampIds.uv)!, s = slab.lamps.find((l: { id: number }) => l.id === lampIds.uv)!;
		expect(c.absorbedByIntendedEinsteinPerS).toBeLessThan(s.absorbedByIntendedEinsteinPerS);
		expect(cyl.vessel.shape).toBe('cylinder');
		expect(cyl.vessel.meanPathCm).toBeCloseTo(Math.PI, 10); // πD/4, D = 4 cm
		expect(cyl.vessel.model).toMatch(/averaged over the chords/);
		// 10 µM of a weak absorber at 310 nm: 90 % absorption needs more than 10 m of liquid
		expect(c.penetrationDepth90Cm).toBeNull();
		const ann = await computeWindowFor(localsOf('viewer'), body({ vessel: { shape: 'annulus', innerDiameterCm: 3, outerDiameterCm: 5 } }));
		expect(ann.vessel.referencePathCm).toBe(1);
	});

	it('bad input names the field (400 shapes, 422 physics)', async () => {
		const cases: [Record<string, unknown>, number, string][] = [
			[{ quantumYield: 0 }, 422, 'quantumYield'],
			[{ quantumYield: -0.2 }, 422, 'quantumYield'],
			[{ quantumYield: 2e4 }, 422, 'quantumYield'],
			[{ vessel: { shape: 'cylinder', innerDiameterCm: -2 } }, 422, 'vessel.innerDiameterCm'],
			[{ vessel: { shape: 'annulus', innerDiameterCm: 4, outerDiameterCm: 4 } }, 422, 'vessel.outerDiameterCm'],
			[{ vessel: { shape: 'annulus', innerDiameterCm: 4, outerDiameterCm: 3 } }, 422, 'vessel.outerDiameterCm'],
			[{ vessel: { shape: 'sphere' } }, 400, 'vessel.shape'],
			[{ reaction: { type: 'reversible', quantumYieldBack: 0.3 } }, 400, 'reaction.product'],
			[{ reaction: { type: 'reversible', product: { spectrumId: 1 } } }, 400, 'reaction.quantumYieldBack'],
			[{ reaction: { type: 'reversible', product: { spectrumId: 1 }, quantumYieldBack: -1 } }, 422, 'reaction.quantumYieldBack'],
			[{ reaction: { type: 'photocatalytic', photocatalyst: { spectrumId: 1, concentrationM: 0 } } }, 422, 'reaction.photocatalyst.concentrationM'],
			[{ reaction: { type: 'photocatalytic' } }, 400, 'reaction.photocatalyst'],
			[{ reaction: { type: 'magic' } }, 400, 'reaction.type'],
			[{ pathCm: undefined }, 400, 'pathCm']
		];
		for (const [patch, status, field] of cases) {
			const e = await apiFailure(computeWindowFor(localsOf('viewer'), body(patch)));
			expect({ patch, status: e.status, field: e.extra.field }).toEqual({ patch, status, field });
		}
	});
});

describe('plans keep the reaction mode and vessel', () => {
	it('stores the new fields with the inputs and recomputed results; bad input saves nothing', async () => {
		const inputs = body({ reaction: { type: 'photocatalytic', photocatalyst: { spectrumId: ids.catalyst, concentrationM: 0.001 } }, vessel: { shape: 'cylinder', innerDiameterCm: 2 }, pathCm: undefined });
		const { plan } = await createPlan(localsOf('member'), { title: 'spx photoredox plan', inputs, groupId: groupA });
		const row = await db()('plans').where({ id: plan.id }).first();
		const stored = typeof row.inputs === 'string' ? JSON.parse(row.inputs) : row.inputs;
		expect(stored.reaction).toEqual(inputs.reaction);
		expect(stored.vessel).toEqual({ shape: 'cylinder', innerDiameterCm: 2 });
		const results = typeof row.results === 'string' ? JSON.parse(row.results) : row.results;
		expect(results.reaction.type).toBe('photocatalytic');
		expect(results.lamps[0].id).toBe(lampIds.blue);
		const before = Number((await db()('plans').count({ n: '*' }))[0].n);
		const e = await apiFailure(createPlan(localsOf('member'), { title: 'spx bad plan', inputs: body({ vessel: { shape: 'annulus', innerDiameterCm: 5, outerDiameterCm: 2 } }), groupId: groupA }));
		expect(e.status).toBe(422);
		expect(e.extra.field).toBe('vessel.outerDiameterCm');
		expect(Number((await db()('plans').count({ n: '*' }))[0].n)).toBe(before);
	});
});

describe('a calibrated lamp and the liquid-side wall face', () => {
	it('through its calibration wall the liquid receives exactly the calibrated flux (the wall applied once)', async () => {
		// a calibration is "the photon flux entering the solution through a given vessel wall" (API.md, Actinometry)
		await db()('lamp_calibrations').insert({ lamp_id: lampIds.uv, method: 'actinometry', photon_flux_einstein_per_s: 2e-7, wavelength_nm: 310, wall_material_id: wallId, wall_thickness_mm: 1.5, vessel_path_cm: 1, measured_at: new Date() });
		const r = await computeWindowFor(localsOf('viewer'), body());
		const uv = r.lamps.find((l: { id: number }) => l.id === lampIds.uv)!;
		expect(uv.incidentPhotonFluxEinsteinPerS * (1 - uv.shares.wall)).toBeCloseTo(2e-7, 12);
		expect(uv.photonFluxBasis).toBe('actinometry');
	});
});
