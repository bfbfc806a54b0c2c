/**
 * Actinometry runs and radiometer readings stored as lamp calibrations in the real test database, the lamp's basis and
 * history, the planner's use of the calibrated flux, and bad input that writes nothing.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { computeActinometry } from '$lib/irradiation/actinometry';
import { transmittedPhotonFlux } from '$lib/irradiation/lampCalibration';
import { closeDb, db } from '$lib/server/db';
import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { ApiError } from '$lib/server/http';
import { calibrationsFor, recordActinometry, recordRadiometer } from '$lib/server/services/lampCalibrations';
import { describeLamp } from '$lib/server/services/lamps';
import { createLamp, lampToApi } from '$lib/server/services/lampsApi';
import { callerOf } from '$lib/server/services/spectraAccess';
import { lampsOnGrid, GRID } from '$lib/server/services/windowInputs';
import { cleanup, localsOf, makeGroup, makeUser } from './helpers/accounts';

let member: App.Locals;
let viewer: App.Locals;
let outsider: App.Locals;
let lampId: number;
let silica: number;
let boro: number;

beforeAll(async () => {
	const m = await makeUser();
	const v = await makeUser();
	const o = await makeUser();
	const g = await makeGroup([[m, 'member'], [v, 'viewer']]);
	await makeGroup([[o, 'member']]);
	member = localsOf(m);
	viewer = localsOf(v);
	outsider = localsOf(o);
	// invented lamp: a 365 nm LED panel, 2 W optical, half of it reaching the vessel by the coupling guess
	lampId = (await createLamp(member, { name: 'Calibration test panel 365', powerW: 2, couplingFactor: 0.5, model: { type: 'led', peakNm: 365, fwhmNm: 10 }, groupId: g })).id;
	const mats = await listWallMaterials();
	silica = mats.find((x) => x.slug === 'fused-silica-uv-grade')!.id;
	boro = mats.find((x) => x.slug === 'borosilicate-3.3-tubing')!.id;
});
afterAll(async () => {
	await cleanup();
	await closeDb();
});

const run = (over: Record<string, unknown> = {}) => ({
	lampId, actinometer: 'ferrioxalate', concentrationM: 0.006, irradiatedVolumeMl: 3, aliquotVolumeMl: 0.5, finalVolumeMl: 10,
	deltaAbsorbance: 0.555, readoutPathCm: 1, irradiationTimeS: 60, absorbanceAtIrradiation: 2,
	vessel: { materialId: silica, thicknessMm: 1, pathCm: 1 }, measuredAt: '2026-12-02', operator: 'R. Quill', notes: 'invented test run', ...over
});
const failure = (p: Promise<unknown>) => p.then(() => { throw new Error('expected a failure'); }, (e) => e as ApiError);
const count = async () => Number((await db()('lamp_calibrations').where({ lamp_id: lampId }).count('* as n'))[0].n);

describe('POST /api/actinometry', () => {
	it('stores a ferrioxalate run as the flux entering through the vessel wall', async () => {
		const r = await recordActinometry(member, run());
		// IUPAC 2004 arithmetic by hand: n = 3 × 10 × 0.555/(10³ × 0.5 × 1 × 11100) = 3.000e-6 mol; Φ(365) = 1.26 (Lee & Seliger
		// 1964); f = 0.99 → q = 4.008e-8 einstein s⁻¹ (a narrow 365 nm LED: Φ_used within 1 % of 1.26 across its band)
		expect(r.id).toBeGreaterThan(0);
		expect(Math.abs(r.quantumYieldUsed - 1.26) / 1.26).toBeLessThan(0.01);
		expect(r.fractionAbsorbed).toBeCloseTo(0.99, 9);
		expect(Math.abs(r.photonFluxEinsteinPerS / 4.00834e-8 - 1)).toBeLessThan(0.01);
		const again = computeActinometry({ ...run(), vesselPathCm: 1 } as never, { lineNm: 365 });
		expect(again.ok && Math.abs(again.value.photonFluxEinsteinPerS / r.photonFluxEinsteinPerS - 1)).toBeLessThan(0.01);
	});

	it('the lamp answers its basis and history', async () => {
		const lamp = await lampToApi((await import('$lib/server/db/lamps').then((m) => m.findLamp(lampId)))!, member);
		expect(lamp.photonFluxBasis).toBe('actinometry');
		expect(lamp.photonFluxBasisLabel).toBe('actinometry, 2026-12-02, ferrioxalate, 1 mm fused silica, UV grade');
		expect(lamp.calibrations).toHaveLength(1);
		expect(lamp.calibrations[0].operator).toBe('R. Quill');
		expect(lamp.photonFluxEinsteinPerS).toBeCloseTo(lamp.calibrations[0].photonFluxEinsteinPerS, 20);
		expect((await calibrationsFor(viewer, String(lampId)))[0].vessel.thicknessMm).toBe(1);
	});

	it('the planner lets exactly the calibrated flux through the calibration wall (the wall applied once)', async () => {
		const [entry] = await lampsOnGrid(member, await callerOf(member), [lampId]);
		const mats = await listWallMaterials();
		const { wallTransmissionOnGrid } = await import('$lib/irradiation/walls');
		const t = wallTransmissionOnGrid(mats.find((x) => x.id === silica)!.model, 1, GRID.fromNm, GRID.stepNm, GRID.count);
		const cal = (await calibrationsFor(member, String(lampId)))[0].photonFluxEinsteinPerS;
		expect(transmittedPhotonFlux(entry.photonFluxPerNm, t, GRID.stepNm) / cal).toBeCloseTo(1, 9);
		expect(entry.basis).toBe('actinometry');
	});

	it.each([
		[{ irradiationTimeS: 0 }, 422, 'irradiationTimeS'],
		[{ irradiatedVolumeMl: -3 }, 422, 'irradiatedVolumeMl'],
		[{ deltaAbsorbance: 2.4 }, 422, 'deltaAbsorbance'],
		[{ absorbanceAtIrradiation: 0 }, 422, 'absorbanceAtIrradiation'],
		[{ finalVolumeMl: 0.3 }, 422, 'finalVolumeMl'],
		[{ concentrationM: 0.05 }, 422, 'concentrationM'],
		[{ deltaAbsorbance: 'lots' }, 400, 'deltaAbsorbance'],
		[{ vessel: { thicknessMm: 0, pathCm: 1 } }, 400, 'vessel.thicknessMm'],
		[{ measuredAt: 'yesterday-ish' }, 400, 'measuredAt']
	])('%o → %i naming %s, nothing stored', async (over, status, field) => {
		const before = await count();
		const o = over as Record<string, unknown>;
		const e = await failure(recordActinometry(member, run(o.vessel ? { ...o, vessel: { materialId: silica, ...(o.vessel as object) } } : o)));
		expect(e.status).toBe(status);
		expect(e.extra.field).toBe(field);
		expect(await count()).toBe(before);
	});

	it('viewers may not record a run; another group does not see the lamp', async () => {
		expect((await failure(recordActinometry(viewer, run()))).status).toBe(403);
		expect((await failure(recordActinometry(outsider, run()))).status).toBe(404);
	});
});

describe('radiometer reading as a second calibration kind', () => {
	it('optical power at the vessel → photon flux through the lamp’s spectrum and the wall', async () => {
		const r = await recordRadiometer(member, String(lampId), { kind: 'radiometer', opticalPowerW: 0.8, vessel: { materialId: boro, thicknessMm: 2 }, measuredAt: '2026-12-03' });
		// 0.8 W at ≈ 365 nm = 0.8 × 3.0512 µmol s⁻¹ (REFERENCE §4) = 2.441e-6 before the wall; 2 mm borosilicate 3.3 tubing
		// passes ≈ 0.985 × (1 − R)² ≈ 0.92 at 365 nm (REFERENCE §2.1, §2.3)
		expect(r.photonFluxEinsteinPerS / 2.441e-6).toBeGreaterThan(0.85);
		expect(r.photonFluxEinsteinPerS / 2.441e-6).toBeLessThan(0.97);
		const lamp = await lampToApi((await import('$lib/server/db/lamps').then((m) => m.findLamp(lampId)))!, member);
		expect(lamp.photonFluxBasis).toBe('radiometer');
		expect(lamp.calibrations.map((c) => c.method)).toEqual(['radiometer', 'actinometry']);
	});
});

describe('cautions come from what the lamp emits', () => {
	it('a 1.6 W 405 nm strip keeps its blue-light caution at coupling 0.5', () => {
		// IEC 62471 blue-light band 400–500 nm; the app's threshold is 1 W of optical power in that band (cautions.ts)
		const d = describeLamp({ type: 'led', peakNm: 405, fwhmNm: 14 }, 0.8, GRID, 1.6);
		expect(d.cautions.map((c) => c.code)).toContain('blue-light');
	});
});
