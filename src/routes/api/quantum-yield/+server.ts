import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { requireUser } from '$lib/server/policy';
import { computeQuantumYieldFor } from '$lib/server/services/quantumYield';
import type { RequestHandler } from './$types';

/**
 * POST /api/quantum-yield — viewer+: Φ from an irradiation series with its standard error and residuals; with
 * `save: true` (member+ of the reactant's group) it is stored on the reactant's spectrum → 201.
 */
export const POST: RequestHandler = apiHandler(async ({ locals, request }) => {
	requireUser(locals);
	const out = await computeQuantumYieldFor(locals, await readJson(request));
	return json(out, { status: out.saved ? 201 : 200 });
});
