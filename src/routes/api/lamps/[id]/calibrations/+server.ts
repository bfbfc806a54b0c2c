import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { calibrationsFor, recordRadiometer } from '$lib/server/services/lampCalibrations';
import type { RequestHandler } from './$types';

/** GET /api/lamps/:id/calibrations — viewer+ of the lamp's group: the calibration history, newest first. */
export const GET: RequestHandler = apiHandler(async ({ locals, params }) => json(await calibrationsFor(locals, params.id)));

/** POST /api/lamps/:id/calibrations `{ kind: 'radiometer', opticalPowerW, vessel }` — member+: a power-meter reading (201). */
export const POST: RequestHandler = apiHandler(async ({ locals, params, request }) => json(await recordRadiometer(locals, params.id, await readJson(request)), { status: 201 }));
