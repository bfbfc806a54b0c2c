import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { createPlan, planToApi, plansFor } from '$lib/server/services/plans';
import type { RequestHandler } from './$types';

/** GET /api/plans — viewer+: the plans of the caller's groups (without results). */
export const GET: RequestHandler = apiHandler(async ({ locals }) => json((await plansFor(locals)).map((p) => planToApi(p, false))));

/** POST /api/plans `{ title, inputs }` — member+: a draft plan; results are recomputed on the server. */
export const POST: RequestHandler = apiHandler(async ({ locals, request }) => json(planToApi(await createPlan(locals, await readJson(request))), { status: 201 }));
