import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { groupMatrix } from '$lib/server/services/matrix';
import type { RequestHandler } from './$types';

/** GET /api/groups/:id/matrix `?solvent=&wall=&thicknessMm=&pathCm=&concentrationM=` — viewer+ of the group: lamp × absorber matrix. */
export const GET: RequestHandler = apiHandler(async ({ locals, params, url }) => json(await groupMatrix(locals, params.id, Object.fromEntries(url.searchParams))));
