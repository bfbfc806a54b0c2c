import { json } from '@sveltejs/kit';
import { getWallMaterial } from '$lib/server/db/wallMaterials';
import { membershipsOf } from '$lib/server/policy';
import { apiHandler, notFound } from '$lib/server/http';
import { parseThicknessMm, wallTransmissionCurve } from '$lib/server/services/wallTransmission';
import type { RequestHandler } from './$types';

/** GET /api/materials/:id/transmission?thicknessMm= — anyone: `{ x, y, cutoff10Nm, cutoff50Nm, cutoff10Note, cutoff50Note, dataFromNm }` (y = total T, 0–1; a null cut-off has a note). */
export const GET: RequestHandler = apiHandler(async ({ params, url, locals }) => {
	const id = Number(params.id);
	const groupIds = (await membershipsOf(locals.user?.id)).map((m) => m.groupId);
	const material = Number.isInteger(id) && id > 0 ? await getWallMaterial(id, groupIds) : null;
	if (!material) throw notFound('No such wall material.');
	const thicknessMm = parseThicknessMm(url.searchParams.get('thicknessMm'), material);
	const curve = wallTransmissionCurve(material, thicknessMm);
	return json({ id: material.id, name: material.name, thicknessMm, source: material.source, status: material.status, ...curve });
});
