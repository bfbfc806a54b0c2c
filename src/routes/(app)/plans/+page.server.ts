import { redirect } from '@sveltejs/kit';
import { planToApi, plansFor } from '$lib/server/services/plans';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
	return { plans: (await plansFor(locals)).map((p) => planToApi(p, false)) };
};
