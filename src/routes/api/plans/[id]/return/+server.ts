import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { mailContext, readOptionalJson } from '$lib/server/services/planHttp';
import { reviewPlan } from '$lib/server/services/planReview';
import { planToApi } from '$lib/server/services/plans';
import type { RequestHandler } from './$types';

/** POST /api/plans/:id/return `{ comment, version? }` — a lead of the group other than the author, or an admin; mails the author. 409 unless submitted. */
export const POST: RequestHandler = apiHandler(async ({ locals, params, request, url }) => json(planToApi(await reviewPlan(locals, params.id, await readOptionalJson(request), 'returned', mailContext(url)), false)));
