import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { lampToApi, patchLamp, visibleLamp } from '$lib/server/services/lampsApi';
import type { RequestHandler } from './$types';

/** GET /api/lamps/:id — viewer+ of the lamp's group. */
export const GET: RequestHandler = apiHandler(async ({ locals, params }) => json(await lampToApi(await visibleLamp(locals, params.id), locals)));

/** PATCH /api/lamps/:id `{ ..., version? }` — member+ of the lamp's group; 409 on a stale version. */
export const PATCH: RequestHandler = apiHandler(async ({ locals, params, request }) => {
	const lamp = await patchLamp(locals, params.id, await readJson(request));
	return json(await lampToApi(lamp, locals));
});
