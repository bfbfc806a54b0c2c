import { listUsers } from '$lib/server/db/users';
import { listGroups } from '$lib/server/db/groups';
import { requireAdmin } from '$lib/server/policy';
import { asPage, pageUser } from '$lib/server/auth/guard';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	pageUser(event);
	await asPage(event, () => requireAdmin(event.locals));
	const [users, groups] = await Promise.all([listUsers(), listGroups()]);
	return { users, groups: groups };
};
