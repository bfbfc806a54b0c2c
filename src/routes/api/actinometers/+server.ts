import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { actinometersToApi } from '$lib/server/services/lampCalibrations';
import type { RequestHandler } from './$types';

/** GET /api/actinometers — anyone: the actinometers the app computes, with Φ(λ) tables, read-outs and sources. */
export const GET: RequestHandler = apiHandler(async () => json(actinometersToApi()));
