/**
 * The one policy module: who may see and change what. Every page action and /api route asks
 * here on the server (hidden buttons are not security). Pure rules first, DB look-ups below.
 */
import { db } from './db';
import { ApiError, forbidden, notSignedIn } from './http';
import type { SessionUser } from './auth/types';

export type GroupRole = 'lead' | 'member' | 'viewer';
export type Visibility = 'private' | 'group' | 'public';

const rank: Record<GroupRole, number> = { viewer: 1, member: 2, lead: 3 };

/** True when `role` is at least `min` (viewer < member < lead). */
export function roleAtLeast(role: GroupRole | null | undefined, min: GroupRole): boolean {
	return !!role && rank[role] >= rank[min];
}

export interface Membership {
	groupId: number;
	role: GroupRole;
}

/** Whether a user may read a row with this owner, group and visibility. Admins read everything. */
export function canReadRow(
	user: SessionUser | null,
	memberships: Membership[],
	row: { ownerId: string | null; groupId: number | null; visibility: Visibility }
): boolean {
	if (!user) return false;
	if (user.siteRole === 'admin') return true;
	if (row.ownerId === user.id) return true;
	if (row.visibility === 'public') return true;
	if (row.visibility === 'group') return memberships.some((m) => m.groupId === row.groupId);
	return false;
}

/** Whether a user may change a row: its owner (if still a member+ of its group), a lead of its group, or an admin. */
export function canWriteRow(user: SessionUser | null, memberships: Membership[], row: { ownerId: string | null; groupId: number | null }): boolean {
	if (!user) return false;
	if (user.siteRole === 'admin') return true;
	const m = memberships.find((x) => x.groupId === row.groupId);
	if (row.ownerId === user.id) return roleAtLeast(m?.role, 'member') || row.groupId === null;
	return roleAtLeast(m?.role, 'lead');
}

/** The caller's memberships (empty for anonymous users). */
export async function membershipsOf(userId: string | null | undefined): Promise<Membership[]> {
	if (!userId) return [];
	const rows = await db()('memberships').where({ user_id: userId }).select('group_id', 'role');
	return rows.map((r: { group_id: number; role: GroupRole }) => ({ groupId: Number(r.group_id), role: r.role }));
}

/** Throws 401 unless signed in; returns the user. */
export function requireUser(locals: App.Locals): SessionUser {
	if (!locals.user) throw notSignedIn();
	return locals.user;
}

/** Throws 401/403 unless the user holds at least `min` in `groupId` (admins pass). Returns the role. */
export async function requireGroupRole(locals: App.Locals, groupId: number, min: GroupRole): Promise<GroupRole | 'admin'> {
	const user = requireUser(locals);
	if (user.siteRole === 'admin') return 'admin';
	const m = (await membershipsOf(user.id)).find((x) => x.groupId === groupId);
	if (!m) throw new ApiError(404, 'not_found', 'No such group.');
	if (!roleAtLeast(m.role, min)) throw forbidden(`This needs the ${min} role in the group; you are ${m.role}.`);
	return m.role;
}

/**
 * The group a signed-in user acts in when a request names none: their first group where
 * they hold at least `min`. Throws 403 when they hold it nowhere.
 */
export async function defaultGroupFor(locals: App.Locals, min: GroupRole): Promise<{ groupId: number; role: GroupRole | 'admin' }> {
	const user = requireUser(locals);
	const ms = await membershipsOf(user.id);
	const best = ms.filter((m) => roleAtLeast(m.role, min)).sort((a, b) => rank[b.role] - rank[a.role])[0];
	if (best) return { groupId: best.groupId, role: best.role };
	if (user.siteRole === 'admin' && ms[0]) return { groupId: ms[0].groupId, role: 'admin' };
	throw forbidden(`This needs the ${min} role in a group.`);
}
