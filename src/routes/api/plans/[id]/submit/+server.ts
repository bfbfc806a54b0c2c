import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { mailContext, readOptionalJson } from '$lib/server/services/planHttp';
import { submitPlan } from '$lib/server/services/planReview';
import { planToApi } from '$lib/server/services/plans';
import type { RequestHandler } from './$types';

/** POST /api/plans/:id/submit `{ version?, comment? }` — the author, while draft or returned; mails the group's leads. 409 wrong state / stale version. */
export const POST: RequestHandler = apiHandler(async ({ locals, params, request, url }) => json(planToApi(await submitPlan(locals, params.id, await readOptionalJson(request), mailContext(url)), false)));
