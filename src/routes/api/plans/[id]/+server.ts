import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { patchPlan, planToApi, visiblePlan } from '$lib/server/services/plans';
import type { RequestHandler } from './$types';

/** GET /api/plans/:id — viewer+ of the plan's group. */
export const GET: RequestHandler = apiHandler(async ({ locals, params }) => json(planToApi(await visiblePlan(locals, params.id))));

/** PATCH /api/plans/:id `{ title?, inputs?, version? }` — the author, while draft or returned. */
export const PATCH: RequestHandler = apiHandler(async ({ locals, params, request }) => json(planToApi(await patchPlan(locals, params.id, await readJson(request)))));
