import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { createLamp, lampToApi, listLampsFor } from '$lib/server/services/lampsApi';
import type { RequestHandler } from './$types';

/** GET /api/lamps — viewer+: the lamps of the caller's groups. */
export const GET: RequestHandler = apiHandler(async ({ locals }) => {
	const lamps = await listLampsFor(locals);
	return json(await Promise.all(lamps.map((l) => lampToApi(l, locals))));
});

/** POST /api/lamps `{ name, powerW, model, couplingFactor?, distanceNote?, exposureDistanceCm?, exposureIrradianceWPerM2?, notes?, groupId? }` — member+. */
export const POST: RequestHandler = apiHandler(async ({ locals, request }) => {
	const lamp = await createLamp(locals, await readJson(request));
	return json(await lampToApi(lamp, locals), { status: 201 });
});
