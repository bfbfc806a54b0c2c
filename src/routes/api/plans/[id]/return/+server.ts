import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { planToApi, reviewPlan } from '$lib/server/services/plans';
import type { RequestHandler } from './$types';

/** POST /api/plans/:id/return — a lead of the group (comment required). */
export const POST: RequestHandler = apiHandler(async ({ locals, params, request }) => {
	const body = await request.json().catch(() => ({}));
	return json(planToApi(await reviewPlan(locals, params.id, body, 'returned'), false));
});
