import { error, fail, redirect } from '@sveltejs/kit';
import { ApiError } from '$lib/server/http';
import { membershipsOf, roleAtLeast } from '$lib/server/policy';
import { planToApi, reviewPlan, submitPlan, visiblePlan } from '$lib/server/services/plans';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, params, url }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
	try {
		const plan = await visiblePlan(locals, params.id);
		const role = (await membershipsOf(locals.user.id)).find((m) => m.groupId === plan.groupId)?.role;
		return {
			plan: planToApi(plan),
			isAuthor: plan.ownerId === locals.user.id,
			isReviewer: locals.user.siteRole === 'admin' || roleAtLeast(role, 'lead')
		};
	} catch (e) {
		if (e instanceof ApiError) error(e.status, e.message);
		throw e;
	}
};

async function act(locals: App.Locals, url: URL, fn: () => Promise<unknown>) {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
	try {
		await fn();
		return { done: true };
	} catch (e) {
		if (e instanceof ApiError) return fail(e.status, { message: e.message });
		throw e;
	}
}

export const actions: Actions = {
	submit: async ({ locals, params, url }) => act(locals, url, () => submitPlan(locals, params.id, {})),
	approve: async ({ locals, params, request, url }) => act(locals, url, async () => reviewPlan(locals, params.id, { comment: String((await request.formData()).get('comment') ?? '') || undefined }, 'approved')),
	return: async ({ locals, params, request, url }) => act(locals, url, async () => reviewPlan(locals, params.id, { comment: String((await request.formData()).get('comment') ?? '') || undefined }, 'returned'))
};
