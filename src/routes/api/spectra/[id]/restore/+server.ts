/** POST /api/spectra/:id/restore — undoes a soft delete (owner or lead). */
import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { setSpectrumDeleted } from '$lib/server/services/spectraEdit';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = apiHandler(async ({ locals, params }) => json(await setSpectrumDeleted(locals, params.id, false)));
