import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { membershipsOf, roleAtLeast } from '$lib/server/policy';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	const ms = await membershipsOf(locals.user?.id);
	const materials = await listWallMaterials(ms.map((m) => m.groupId));
	return {
		materials: materials.map((m) => ({
			id: m.id,
			slug: m.slug,
			name: m.name,
			source: m.source,
			status: m.status,
			notes: m.notes,
			refractiveIndex: m.refractiveIndex,
			typicalThicknessMm: m.typicalThicknessMm,
			model: m.model.model,
			own: m.groupId !== null
		})),
		canAdd: !!locals.user && (locals.user.siteRole === 'admin' || ms.some((m) => roleAtLeast(m.role, 'member')))
	};
};
