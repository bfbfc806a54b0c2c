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

// ---- Group management rules (accounts feature) -------------------------------------------

/** Who may invite, change roles and remove members: the group's leads (and site admins). */
export function canManageMembers(role: GroupRole | 'admin' | null | undefined): boolean {
	return role === 'admin' || role === 'lead';
}

/** Only verified accounts (or admins) may create groups. */
export function canCreateGroup(user: SessionUser | null): boolean {
	return !!user && (user.emailVerified || user.siteRole === 'admin');
}

/**
 * Why a membership change would leave the group without a lead, or null when it is fine.
 * `leads` is the current number of leads; `targetRole` the member's role before the change;
 * `newRole` null means the member leaves or is removed.
 */
export function leadProblem(targetRole: GroupRole, newRole: GroupRole | null, leads: number): string | null {
	if (targetRole === 'lead' && newRole !== 'lead' && leads <= 1) return 'A group needs at least one lead: make someone else lead first.';
	return null;
}

/** Throws 403 unless the caller is a site admin. */
export function requireAdmin(locals: App.Locals): SessionUser {
	const user = requireUser(locals);
	if (user.siteRole !== 'admin') throw forbidden('Only site admins may do this.');
	return user;
}

/**
 * The group with this slug and the caller's role in it, requiring at least `min`.
 * 401 anonymous, 404 when the group does not exist or the caller is not in it (no leak), 403 below `min`.
 */
export async function requireGroupBySlug(locals: App.Locals, slug: string, min: GroupRole): Promise<{ group: { id: number; name: string; slug: string; description: string | null }; role: GroupRole | 'admin' }> {
	requireUser(locals);
	const row = await db()('groups').where({ slug }).first('id', 'name', 'slug', 'description');
	if (!row) throw new ApiError(404, 'not_found', 'No such group.');
	const group = { ...row, id: Number(row.id) };
	const role = await requireGroupRole(locals, group.id, min);
	return { group, role };
}
