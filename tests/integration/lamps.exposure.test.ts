/**
 * A lamp's stated exposure distance through the lamp service (real test database): stored, shown as the irradiance
 * there with its basis, turned into a caution; a radiometer reading without a distance is refused and writes nothing.
 * Geometry E = P/(πd²) on a Lambertian emitter's axis (common practice); invented demo lamp.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '$lib/server/db';
import { ApiError } from '$lib/server/http';
import { createLamp, lampToApi, patchLamp } from '$lib/server/services/lampsApi';
import { describeLamp, exposureOf, resolveLampModel, vesselPowerW } from '$lib/server/services/lamps';
import { cleanup, localsOf, makeGroup, makeUser } from './helpers/accounts';

let member: App.Locals;
let groupId: number;
beforeAll(async () => {
	const m = await makeUser();
	groupId = await makeGroup([[m, 'member']]);
	member = localsOf(m);
});
afterAll(async () => {
	await cleanup();
	await closeDb();
});
const failure = (p: Promise<unknown>) => p.then(() => { throw new Error('expected a failure'); }, (e) => e as ApiError);

describe('exposure at a stated distance', () => {
	it('a 1.6 W 405 nm strip at 30 cm: 1.6/(π·0.3²) = 5.66 W m⁻² (Lambertian model), in the lamp and its cautions', async () => {
		const lamp = await createLamp(member, { name: 'Exposure test strip 405', powerW: 1.6, couplingFactor: 0.5, exposureDistanceCm: 30, model: { type: 'led', peakNm: 405, fwhmNm: 14 }, groupId });
		expect(lamp.exposureDistanceCm).toBe(30);
		const api = await lampToApi(lamp, member);
		expect(api.exposure!.basis).toBe('lambertian-model');
		// the lamp's own emitted power (not the 0.8 W coupled into the vessel)
		expect(api.exposure!.irradianceWPerM2 / (1.6 / (Math.PI * 0.09))).toBeCloseTo(1, 3);
		const d = describeLamp(await resolveLampModel(lamp.model, member), vesselPowerW(lamp), undefined, lamp.powerW, exposureOf(lamp));
		const c = d.cautions.find((x) => x.code === 'exposure-at-distance')!;
		expect(c.text).toMatch(/^At 30 cm the lamp gives 5\.66 W m⁻²/);
		expect(d.cautions.some((x) => x.code === 'blue-light')).toBe(true);

		// a radiometer reading replaces the model; clearing the distance clears the caution
		const measured = await patchLamp(member, String(lamp.id), { exposureIrradianceWPerM2: 4.2, version: lamp.version });
		expect((await lampToApi(measured, member)).exposure!.irradianceWPerM2).toBe(4.2);
		const cleared = await patchLamp(member, String(lamp.id), { exposureDistanceCm: null, exposureIrradianceWPerM2: null, version: measured.version });
		expect((await lampToApi(cleared, member)).exposure).toBeNull();
	});

	it('bad input names the field and writes nothing', async () => {
		const before = Number((await db()('lamps').where({ group_id: groupId }).count('* as n'))[0].n);
		const noDistance = await failure(createLamp(member, { name: 'Exposure test no distance', powerW: 1, exposureIrradianceWPerM2: 3, model: { type: 'led', peakNm: 365, fwhmNm: 10 }, groupId }));
		expect(noDistance.status).toBe(400);
		expect(noDistance.extra?.field).toBe('exposureDistanceCm');
		const negative = await failure(createLamp(member, { name: 'Exposure test negative', powerW: 1, exposureDistanceCm: -5, model: { type: 'led', peakNm: 365, fwhmNm: 10 }, groupId }));
		expect(negative.status).toBe(400);
		expect(negative.extra?.field).toBe('exposureDistanceCm');
		expect(Number((await db()('lamps').where({ group_id: groupId }).count('* as n'))[0].n)).toBe(before);
	});
});
