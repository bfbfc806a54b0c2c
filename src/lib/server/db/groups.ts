/** Repository: `groups` and `memberships`. */
import type { Knex } from 'knex';
import { db } from './index';
import type { GroupRole } from '../policy';

export interface GroupRecord {
	id: number;
	name: string;
	slug: string;
	description: string | null;
}

/** A group by slug, or null. */
export async function findGroupBySlug(slug: string, k: Knex = db()): Promise<GroupRecord | null> {
	const r = await k('groups').where({ slug }).first('id', 'name', 'slug', 'description');
	return r ? { ...r, id: Number(r.id) } : null;
}

/** A group by id, or null. */
export async function findGroupById(id: number, k: Knex = db()): Promise<GroupRecord | null> {
	const r = await k('groups').where({ id }).first('id', 'name', 'slug', 'description');
	return r ? { ...r, id: Number(r.id) } : null;
}

/** Inserts a group; returns its id. */
export async function insertGroup(g: { name: string; slug: string; description?: string | null; createdBy: string }, k: Knex = db()): Promise<number> {
	const [id] = await k('groups').insert({ name: g.name, slug: g.slug, description: g.description ?? null, created_by: g.createdBy });
	return Number(id);
}

/** True when a group with this name or slug exists. */
export async function groupNameTaken(name: string, slug: string, k: Knex = db()): Promise<boolean> {
	return !!(await k('groups').where({ name }).orWhere({ slug }).first('id'));
}

/** Groups a user belongs to, with their role. */
export async function groupsOfUser(userId: string, k: Knex = db()): Promise<(GroupRecord & { role: GroupRole })[]> {
	const rows = await k('memberships as m').join('groups as g', 'g.id', 'm.group_id').where('m.user_id', userId).select('g.id', 'g.name', 'g.slug', 'g.description', 'm.role').orderBy('g.name');
	return rows.map((r) => ({ ...r, id: Number(r.id) }));
}

/** Members of a group with name, e-mail and role. */
export async function membersOf(groupId: number, k: Knex = db()): Promise<{ userId: string; name: string; email: string; role: GroupRole; since: Date }[]> {
	return k('memberships as m').join('users as u', 'u.id', 'm.user_id').where('m.group_id', groupId).select('u.id as userId', 'u.name', 'u.email', 'm.role', 'm.created_at as since').orderBy('u.name');
}

/** One member's role, or null when not a member. */
export async function roleIn(groupId: number, userId: string, k: Knex = db()): Promise<GroupRole | null> {
	const r = await k('memberships').where({ group_id: groupId, user_id: userId }).first('role');
	return r?.role ?? null;
}

/** Number of leads in a group. */
export async function leadCount(groupId: number, k: Knex = db()): Promise<number> {
	const r = await k('memberships').where({ group_id: groupId, role: 'lead' }).count({ n: '*' }).first();
	return Number(r?.n ?? 0);
}

/** Adds a member (or keeps the existing row untouched). */
export async function addMember(groupId: number, userId: string, role: GroupRole, k: Knex = db()): Promise<void> {
	await k('memberships').insert({ group_id: groupId, user_id: userId, role }).onConflict(['group_id', 'user_id']).ignore();
}

/** Sets a member's role. */
export async function setRole(groupId: number, userId: string, role: GroupRole, k: Knex = db()): Promise<void> {
	await k('memberships').where({ group_id: groupId, user_id: userId }).update({ role });
}

/** Removes a member. */
export async function removeMember(groupId: number, userId: string, k: Knex = db()): Promise<void> {
	await k('memberships').where({ group_id: groupId, user_id: userId }).del();
}

/** All groups with member counts, for the admin page. */
export async function listGroups(k: Knex = db()): Promise<{ id: number; name: string; slug: string; members: number }[]> {
	const rows = (await k('groups as g')
		.leftJoin('memberships as m', 'm.group_id', 'g.id')
		.groupBy('g.id', 'g.name', 'g.slug')
		.select('g.id', 'g.name', 'g.slug')
		.count({ members: 'm.user_id' })
		.orderBy('g.name')) as unknown as { id: number; name: string; slug: string; members: number | string }[];
	return rows.map((r) => ({ id: Number(r.id), name: r.name, slug: r.slug, members: Number(r.members) }));
}
