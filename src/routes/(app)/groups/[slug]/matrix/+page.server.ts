import { DEFAULT_WINDOW_THRESHOLDS } from '$lib/irradiation/window';
import { asPage, pageUser } from '$lib/server/auth/guard';
import { listSolvents } from '$lib/server/db/solvents';
import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { requireGroupBySlug } from '$lib/server/policy';
import { groupMatrix } from '$lib/server/services/matrix';
import type { PageServerLoad } from './$types';

/** The group's lamp × absorber matrix under the conditions in the query (viewer+ of the group; outsiders 404). */
export const load: PageServerLoad = async (event) => {
	pageUser(event);
	const { group } = await asPage(event, () => requireGroupBySlug(event.locals, event.params.slug, 'viewer'));
	const query = Object.fromEntries(event.url.searchParams);
	const [matrix, solvents, materials] = await Promise.all([
		asPage(event, () => groupMatrix(event.locals, String(group.id), query)).catch((e) => {
			// Bad conditions: show the form with the message instead of an error page.
			if (e?.status === 400 || e?.status === 422) return { problem: e.body?.message ?? 'These conditions cannot be computed.' };
			throw e;
		}),
		listSolvents(),
		listWallMaterials([group.id])
	]);
	return {
		group,
		query,
		matrix: 'problem' in matrix ? null : matrix,
		problem: 'problem' in matrix ? matrix.problem : null,
		solvents: solvents.map((s) => ({ id: s.id, name: s.name })),
		materials: materials.map((m) => ({ id: m.id, name: m.name })),
		defaultThresholds: { ...DEFAULT_WINDOW_THRESHOLDS }
	};
};
