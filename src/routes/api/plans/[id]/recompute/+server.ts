import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { readOptionalJson } from '$lib/server/services/planHttp';
import { recomputePlan } from '$lib/server/services/planRecompute';
import { planToApi } from '$lib/server/services/plans';
import type { RequestHandler } from './$types';

/**
 * POST /api/plans/:id/recompute `{ save?, version? }` — the author or a lead: `{ changes: [{ field, before, after }] }` with
 * today's reference data and calibrations; stores a new revision only with `{ save: true, version }`.
 */
export const POST: RequestHandler = apiHandler(async ({ locals, params, request }) => {
	const out = await recomputePlan(locals, params.id, await readOptionalJson(request));
	return json({ changes: out.changes, saved: out.saved, ...(out.saved ? { revision: out.revision, plan: planToApi(out.plan, false) } : {}) });
});
