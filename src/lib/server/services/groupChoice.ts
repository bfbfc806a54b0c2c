/** Which group a new row (lamp, plan, material) goes to, checked before the body is validated. */
import { ApiError, forbidden, notFound } from '$lib/server/http';
import { membershipsOf, requireUser, roleAtLeast } from '$lib/server/policy';

/** 401 when anonymous; 403 unless the caller is a member or lead somewhere (admins pass). */
export async function requireMemberSomewhere(locals: App.Locals): Promise<void> {
	const user = requireUser(locals);
	if (user.siteRole === 'admin') return;
	const ms = await membershipsOf(user.id);
	if (!ms.some((m) => roleAtLeast(m.role, 'member'))) throw forbidden('This needs the member role in a group; viewers can read but not add.');
}

/** The caller's group where they hold member+ (their highest role first); 400 when they must name one (admins outside groups). */
export async function groupForNewRow(locals: App.Locals): Promise<number> {
	const user = requireUser(locals);
	const ms = (await membershipsOf(user.id)).filter((m) => roleAtLeast(m.role, 'member'));
	ms.sort((a, b) => (a.role === b.role ? a.groupId - b.groupId : a.role === 'lead' ? -1 : 1));
	if (ms[0]) return ms[0].groupId;
	throw new ApiError(400, 'invalid', 'groupId: name the group the new row belongs to.', { field: 'groupId' });
}

/**
 * Loads a row that belongs to one group by its route id: 401 anonymous, 404 when missing or in a group the caller
 * is not in (never revealing another group's rows); admins see every group.
 */
export async function loadGroupRow<T extends { groupId: number }>(locals: App.Locals, idParam: string | undefined, find: (id: number) => Promise<T | null>, what: string): Promise<T> {
	const user = requireUser(locals);
	const id = /^\d{1,10}$/.test(idParam ?? '') ? Number(idParam) : 0;
	const row = id ? await find(id) : null;
	if (!row) throw notFound(`No such ${what}.`);
	if (user.siteRole !== 'admin' && !(await membershipsOf(user.id)).some((m) => m.groupId === row.groupId)) throw notFound(`No such ${what}.`);
	return row;
}
