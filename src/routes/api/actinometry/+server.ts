import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { recordActinometry } from '$lib/server/services/lampCalibrations';
import type { RequestHandler } from './$types';

/** POST /api/actinometry — member+ of the lamp's group: computes a run and stores it as a calibration of the lamp (201). */
export const POST: RequestHandler = apiHandler(async ({ locals, request }) => json(await recordActinometry(locals, await readJson(request)), { status: 201 }));
