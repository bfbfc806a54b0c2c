/** Which group a new row (lamp, plan, material) goes to, checked before the body is validated. */
import { ApiError, forbidden } from '$lib/server/http';
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
