/**
 * Integration-test helpers: throwaway users and groups in the real test database, removed again
 * by `cleanup()`. Addresses use lab.example.org (zod 4 rejects toy domains).
 */
import { db } from '../../../src/lib/server/db';
import { insertUser } from '../../../src/lib/server/db/users';
import { addMember, insertGroup } from '../../../src/lib/server/db/groups';
import { hashPassword } from '../../../src/lib/server/auth/password';
import type { SessionUser } from '../../../src/lib/server/auth/types';
import type { GroupRole } from '../../../src/lib/server/policy';

const made = { users: [] as string[], groups: [] as number[] };
const tag = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;
let n = 0;

/** Creates a verified user; returns it as the session layer would. */
export async function makeUser(password = 'integration-pass-123', siteRole: 'admin' | 'user' = 'user'): Promise<SessionUser & { password: string }> {
	const id = `it-${tag}-${++n}`;
	const email = `it.${tag}.${n}@lab.example.org`;
	await insertUser({ id, email, name: `Test User ${n}`, passwordHash: await hashPassword(password), emailVerified: true, siteRole });
	made.users.push(id);
	return { id, email, name: `Test User ${n}`, siteRole, emailVerified: true, password };
}

/** Creates a group with the given members. */
export async function makeGroup(members: [SessionUser, GroupRole][]): Promise<number> {
	const slug = `it-${tag}-g${++n}`;
	const id = await insertGroup({ name: `Integration group ${slug}`, slug, createdBy: members[0]?.[0].id ?? '' });
	made.groups.push(id);
	for (const [u, role] of members) await addMember(id, u.id, role);
	return id;
}

/** Locals for a user (for policy calls). */
export const localsOf = (user: SessionUser | null): App.Locals => ({ user, session: user ? { id: 's', expiresAt: new Date(Date.now() + 3600_000), via: 'cookie' } : null });

/** Removes everything this file created. */
export async function cleanup(): Promise<void> {
	if (made.groups.length) await db()('groups').whereIn('id', made.groups).del();
	if (made.users.length) await db()('users').whereIn('id', made.users).del();
	await db()('auth_throttle').where('bucket', 'like', `%${tag}%`).del();
}
