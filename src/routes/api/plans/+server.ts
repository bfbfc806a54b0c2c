import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { createPlan, planToApi, plansFor } from '$lib/server/services/plans';
import type { RequestHandler } from './$types';

/** GET /api/plans `?state=&lamp=&substrate=` — viewer+: the plans of the caller's groups (without results), waiting ones first. */
export const GET: RequestHandler = apiHandler(async ({ locals, url }) => json((await plansFor(locals, url.searchParams)).map((p) => planToApi(p, false))));

/**
 * POST /api/plans `{ title, inputs, decision?, idempotencyKey?, groupId?, query? }` — member+: a draft plan; the numbers
 * are recomputed on the server. 201 when created; 200 with the same plan when the idempotency key was used before.
 */
export const POST: RequestHandler = apiHandler(async ({ locals, request }) => {
	const { plan, created } = await createPlan(locals, await readJson(request));
	return json(planToApi(plan), { status: created ? 201 : 200 });
});
