import { asPage, pageUser } from '$lib/server/auth/guard';
import { groupsOfUser, listGroups } from '$lib/server/db/groups';
import { auditFor, auditToApi } from '$lib/server/services/auditLog';
import type { PageServerLoad } from './$types';

/** The audit log: a lead sees the groups they lead (or one, `?groupId=`), an admin every group. Others get 403. */
export const load: PageServerLoad = async (event) => {
	const user = pageUser(event);
	const q = Object.fromEntries(event.url.searchParams);
	const entries = await asPage(event, () => auditFor(event.locals, { limit: '100', ...q }));
	const groups = user.siteRole === 'admin' ? (await listGroups()).map((g) => ({ id: g.id, name: g.name })) : (await groupsOfUser(user.id)).filter((g) => g.role === 'lead').map((g) => ({ id: g.id, name: g.name }));
	return { entries: entries.map(auditToApi), groups, groupId: q.groupId ?? '', isAdmin: user.siteRole === 'admin' };
};
