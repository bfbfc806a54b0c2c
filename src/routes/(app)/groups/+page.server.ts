import { fail, redirect } from '@sveltejs/kit';
import { createGroupSchema, slugify } from '$lib/schemas/group';
import { fieldErrors } from '$lib/schemas/auth';
import { createGroup } from '$lib/server/auth/membership';
import { groupsOfUser } from '$lib/server/db/groups';
import { canCreateGroup } from '$lib/server/policy';
import { ApiError } from '$lib/server/http';
import { pageUser } from '$lib/server/auth/guard';
import { keep, readForm, errorsOf } from '$lib/server/auth/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = pageUser(event);
	return { groups: await groupsOfUser(user.id), canCreate: canCreateGroup(user) };
};

export const actions: Actions = {
	create: async (event) => {
		const user = pageUser(event);
		const v = await readForm(event.request);
		if (!canCreateGroup(user)) return fail(403, { ...keep(v, 'name', 'slug', 'description'), errors: errorsOf('form', 'Confirm your e-mail address before starting a group.') });
		const parsed = createGroupSchema.safeParse(v);
		if (!parsed.success) return fail(400, { ...keep(v, 'name', 'slug', 'description'), errors: fieldErrors(parsed.error) });
		const slug = parsed.data.slug || slugify(parsed.data.name);
		if (!slug) return fail(400, { ...keep(v, 'name', 'slug', 'description'), errors: errorsOf('slug', 'Choose a short name with letters or digits.') });
		try {
			await createGroup(user, { ...parsed.data, slug });
		} catch (e) {
			if (e instanceof ApiError) return fail(e.status, { ...keep(v, 'name', 'slug', 'description'), errors: errorsOf(e.extra.field ?? 'form', e.message) });
			throw e;
		}
		redirect(303, `/groups/${slug}`);
	}
};
