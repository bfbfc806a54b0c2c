import { redirect } from '@sveltejs/kit';
import { membershipsOf, roleAtLeast } from '$lib/server/policy';
import { lampToApi, listLampsFor } from '$lib/server/services/lampsApi';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
	const lamps = await Promise.all((await listLampsFor(locals)).map((l) => lampToApi(l, locals)));
	const ms = await membershipsOf(locals.user.id);
	return { lamps, canAdd: locals.user.siteRole === 'admin' || ms.some((m) => roleAtLeast(m.role, 'member')) };
};
