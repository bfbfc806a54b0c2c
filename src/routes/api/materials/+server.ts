import { json } from '@sveltejs/kit';
import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { membershipsOf, requireUser } from '$lib/server/policy';
import { apiHandler, readJson } from '$lib/server/http';
import { addWallMaterialFromSpectrum } from '$lib/server/services/wallMaterials';
import type { RequestHandler } from './$types';

/** GET /api/materials — anyone: reference materials (+ the caller's groups' own). */
export const GET: RequestHandler = async ({ locals }) => {
	const groupIds = (await membershipsOf(locals.user?.id)).map((m) => m.groupId);
	const rows = await listWallMaterials(groupIds);
	return json(
		rows.map((m) => ({
			id: m.id,
			slug: m.slug,
			name: m.name,
			source: m.source,
			status: m.status,
			refractiveIndex: m.refractiveIndex,
			typicalThicknessMm: m.typicalThicknessMm,
			model: m.model.model,
			groupId: m.groupId,
			notes: m.notes
		}))
	);
};

/** POST /api/materials `{ name, spectrumId, thicknessMm, refractiveIndex? }` — member+: a wall from a measured transmission spectrum. */
export const POST: RequestHandler = apiHandler(async ({ locals, request }) => {
	requireUser(locals);
	const created = await addWallMaterialFromSpectrum(locals, await readJson(request));
	return json(created, { status: 201 });
});
