import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { requireUser } from '$lib/server/policy';
import { groupsOfUser } from '$lib/server/db/groups';
import type { RequestHandler } from './$types';

/** GET /api/me — the caller, their groups with role, and their site role. */
export const GET: RequestHandler = apiHandler(async ({ locals }) => {
	const user = requireUser(locals);
	const groups = await groupsOfUser(user.id);
	return json({
		user: { id: user.id, email: user.email, name: user.name, siteRole: user.siteRole, emailVerified: user.emailVerified },
		siteRole: user.siteRole,
		groups: groups.map((g) => ({ id: g.id, name: g.name, slug: g.slug, role: g.role })),
		via: locals.session?.via
	}, { headers: { 'cache-control': 'no-store' } });
});
