import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { planToApi, submitPlan } from '$lib/server/services/plans';
import type { RequestHandler } from './$types';

/** POST /api/plans/:id/submit — the author. */
export const POST: RequestHandler = apiHandler(async ({ locals, params, request }) => {
	const body = await request.json().catch(() => ({}));
	return json(planToApi(await submitPlan(locals, params.id, body), false));
});
