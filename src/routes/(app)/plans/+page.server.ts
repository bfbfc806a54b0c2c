import { asPage, pageUser } from '$lib/server/auth/guard';
import { groupsOfUser } from '$lib/server/db/groups';
import { listLamps } from '$lib/server/db/lamps';
import { membershipsOf } from '$lib/server/policy';
import { planToApi, plansFor } from '$lib/server/services/plans';
import type { PageServerLoad } from './$types';

/** The plans of the caller's groups, waiting-for-review first; filters by state, lamp and substrate (`?state=&lamp=&substrate=`). */
export const load: PageServerLoad = async (event) => {
	const user = pageUser(event);
	const q = event.url.searchParams;
	const filters = { state: q.get('state') ?? '', lamp: q.get('lamp') ?? '', substrate: q.get('substrate') ?? '' };
	const memberships = await membershipsOf(user.id);
	const [plans, all, lamps] = await Promise.all([
		asPage(event, () => plansFor(event.locals, filters)),
		plansFor(event.locals, {}),
		listLamps(memberships.map((m) => m.groupId))
	]);
	const ledGroups = memberships.filter((m) => m.role === 'lead').map((m) => m.groupId);
	const substrates = new Map<number, string>();
	for (const p of all) if (p.absorberSpectrumId) substrates.set(p.absorberSpectrumId, p.absorberName ?? `spectrum #${p.absorberSpectrumId}`);
	return {
		filters,
		isAdmin: user.siteRole === 'admin',
		plans: plans.map((p) => planToApi(p, false)),
		// Plans a lead of the group (or an admin) may act on now: submitted by someone else.
		waitingIds: plans.filter((p) => p.state === 'submitted' && p.ownerId !== user.id && (user.siteRole === 'admin' || ledGroups.includes(p.groupId))).map((p) => p.id),
		lamps: lamps.map((l) => ({ id: l.id, name: l.name })),
		substrates: [...substrates.entries()].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name)),
		groups: (await groupsOfUser(user.id)).map((g) => ({ id: g.id, name: g.name, slug: g.slug, role: g.role }))
	};
};
