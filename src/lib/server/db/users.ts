/** Repository: `users`. E-mail addresses are stored trimmed and lower-cased. */
import type { Knex } from 'knex';
import { db } from './index';

export interface UserRecord {
	id: string;
	email: string;
	name: string;
	passwordHash: string;
	emailVerified: boolean;
	siteRole: 'admin' | 'user';
	createdAt: Date;
}

type Row = { id: string; email: string; name: string; password_hash: string; email_verified: number; site_role: 'admin' | 'user'; created_at: Date };
const toUser = (r: Row): UserRecord => ({
	id: r.id,
	email: r.email,
	name: r.name,
	passwordHash: r.password_hash,
	emailVerified: Boolean(r.email_verified),
	siteRole: r.site_role,
	createdAt: r.created_at
});

/** Normalises an e-mail address for storage and look-up. */
export const normaliseEmail = (email: string) => email.trim().toLowerCase();

/** The user with this e-mail, or null. */
export async function findUserByEmail(email: string, k: Knex = db()): Promise<UserRecord | null> {
	const r = await k('users').where({ email: normaliseEmail(email) }).first();
	return r ? toUser(r) : null;
}

/** The user with this id, or null. */
export async function findUserById(id: string, k: Knex = db()): Promise<UserRecord | null> {
	const r = await k('users').where({ id }).first();
	return r ? toUser(r) : null;
}

/** Inserts a user; `id` is chosen by the caller. */
export async function insertUser(u: { id: string; email: string; name: string; passwordHash: string; emailVerified?: boolean; siteRole?: 'admin' | 'user' }, k: Knex = db()): Promise<void> {
	await k('users').insert({
		id: u.id,
		email: normaliseEmail(u.email),
		name: u.name,
		password_hash: u.passwordHash,
		email_verified: u.emailVerified ?? false,
		site_role: u.siteRole ?? 'user'
	});
}

/** Replaces a user's password hash. */
export async function setPasswordHash(id: string, passwordHash: string, k: Knex = db()): Promise<void> {
	await k('users').where({ id }).update({ password_hash: passwordHash, updated_at: k.fn.now() });
}

/** Marks a user's e-mail as verified. */
export async function markEmailVerified(id: string, k: Knex = db()): Promise<void> {
	await k('users').where({ id }).update({ email_verified: true, updated_at: k.fn.now() });
}

/** All users for the admin page (no hashes), newest first. */
export async function listUsers(k: Knex = db()) {
	return k('users').select('id', 'email', 'name', 'site_role as siteRole', 'email_verified as emailVerified', 'created_at as createdAt').orderBy('created_at', 'desc').limit(500);
}
