/**
 * Accounts against the real MariaDB test database: password storage, one-time links,
 * invitations, group rules and throttling.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { db, closeDb } from '../../src/lib/server/db';
import { closeAuthPool } from '../../src/lib/server/auth/session';
import { hashPassword, verifyPassword } from '../../src/lib/server/auth/password';
import { resetPassword, verifyEmail, changePassword } from '../../src/lib/server/auth/account';
import { acceptInvitation, changeMemberRole, removeFromGroup, signUpFromInvitation } from '../../src/lib/server/auth/membership';
import { insertLink } from '../../src/lib/server/db/authLinks';
import { insertInvitation } from '../../src/lib/server/db/invitations';
import { roleIn } from '../../src/lib/server/db/groups';
import { findUserById } from '../../src/lib/server/db/users';
import { hashSecret, randomSecret } from '../../src/lib/server/auth/tokens';
import { LIMITS, consume, clear } from '../../src/lib/server/auth/rate-limit';
import { checkCredentials } from '../../src/lib/server/auth/signin';
import { authenticateBearer, createApiToken } from '../../src/lib/server/auth/api-tokens';
import { revokeApiToken } from '../../src/lib/server/db/apiTokens';
import { requireGroupBySlug } from '../../src/lib/server/policy';
import { cleanup, localsOf, makeGroup, makeUser } from './helpers/accounts';

afterAll(async () => {
	await cleanup();
	await closeAuthPool();
	await closeDb();
});

const hourAgo = () => new Date(Date.now() - 3600_000);
const inAnHour = () => new Date(Date.now() + 3600_000);

describe('passwords', () => {
	it('stores argon2id PHC strings with at least m=19456 KiB, t=2, p=1', async () => {
		// Parameters: OWASP Password Storage Cheat Sheet, argon2id minimum configuration.
		const h = await hashPassword('a long bench passphrase');
		expect(h.startsWith('$argon2id$')).toBe(true);
		expect(h).toMatch(/\$m=19456,t=2,p=1\$/);
		expect(await verifyPassword(h, 'a long bench passphrase')).toBe(true);
		expect(await verifyPassword(h, 'A long bench passphrase')).toBe(false);
	});
	it('the row in users holds an argon2id hash, never the password', async () => {
		const u = await makeUser('row-check-password');
		const row = await db()('users').where({ id: u.id }).first('password_hash');
		expect(row.password_hash.startsWith('$argon2id$')).toBe(true);
		expect(row.password_hash).not.toContain('row-check-password');
	});
	it('changing the password needs the current one', async () => {
		const u = await makeUser('first-password-1');
		expect(await changePassword(u.id, 'wrong-one-here', 'second-password-2')).toBe(false);
		expect(await changePassword(u.id, 'first-password-1', 'second-password-2')).toBe(true);
		expect(await verifyPassword((await findUserById(u.id))!.passwordHash, 'second-password-2')).toBe(true);
	});
});

describe('password reset links', () => {
	it('are stored hashed, work once, and change the password', async () => {
		const u = await makeUser();
		const token = randomSecret();
		await insertLink('password_resets', { userId: u.id, tokenHash: hashSecret(token), expiresAt: inAnHour() });
		expect(await db()('password_resets').where({ token_hash: token }).first()).toBeUndefined();
		expect(await resetPassword(token, 'brand-new-password')).toBe(u.id);
		expect(await resetPassword(token, 'another-new-password')).toBeNull();
		expect(await verifyPassword((await findUserById(u.id))!.passwordHash, 'brand-new-password')).toBe(true);
	});
	it('expire', async () => {
		const u = await makeUser();
		const token = randomSecret();
		await insertLink('password_resets', { userId: u.id, tokenHash: hashSecret(token), expiresAt: hourAgo() });
		expect(await resetPassword(token, 'brand-new-password')).toBeNull();
		expect(await verifyPassword((await findUserById(u.id))!.passwordHash, u.password)).toBe(true);
	});
	it('a successful reset also voids the other open reset links', async () => {
		const u = await makeUser();
		const [a, b] = [randomSecret(), randomSecret()];
		for (const t of [a, b]) await insertLink('password_resets', { userId: u.id, tokenHash: hashSecret(t), expiresAt: inAnHour() });
		expect(await resetPassword(a, 'brand-new-password')).toBe(u.id);
		expect(await resetPassword(b, 'other-new-password')).toBeNull();
	});
});

describe('e-mail verification links', () => {
	it('verify once', async () => {
		const u = await makeUser();
		await db()('users').where({ id: u.id }).update({ email_verified: false });
		const token = randomSecret();
		await insertLink('email_verifications', { userId: u.id, email: u.email, tokenHash: hashSecret(token), expiresAt: inAnHour() });
		expect(await verifyEmail(token)).toBe(u.id);
		expect((await findUserById(u.id))!.emailVerified).toBe(true);
		expect(await verifyEmail(token)).toBeNull();
	});
});

describe('invitations', () => {
	it('a used invitation cannot be reused', async () => {
		const lead = await makeUser();
		const invitee = await makeUser();
		const other = await makeUser();
		const groupId = await makeGroup([[lead, 'lead']]);
		const token = randomSecret();
		await insertInvitation({ groupId, email: invitee.email, role: 'viewer', tokenHash: hashSecret(token), invitedBy: lead.id, expiresAt: inAnHour() });
		// Someone else cannot take it.
		await expect(acceptInvitation(other, token)).rejects.toMatchObject({ status: 403 });
		await acceptInvitation(invitee, token);
		expect(await roleIn(groupId, invitee.id)).toBe('viewer');
		await expect(acceptInvitation(invitee, token)).rejects.toMatchObject({ status: 404 });
		await expect(signUpFromInvitation(token, { name: 'Late Comer', password: 'late-comer-password' })).rejects.toMatchObject({ status: 404 });
	});
	it('an expired invitation does nothing', async () => {
		const lead = await makeUser();
		const invitee = await makeUser();
		const groupId = await makeGroup([[lead, 'lead']]);
		const token = randomSecret();
		await insertInvitation({ groupId, email: invitee.email, role: 'member', tokenHash: hashSecret(token), invitedBy: lead.id, expiresAt: hourAgo() });
		await expect(acceptInvitation(invitee, token)).rejects.toMatchObject({ status: 404 });
		expect(await roleIn(groupId, invitee.id)).toBeNull();
	});
});

describe('group rules', () => {
	it('a group never loses its last lead', async () => {
		const lead = await makeUser();
		const member = await makeUser();
		const groupId = await makeGroup([[lead, 'lead'], [member, 'member']]);
		await expect(changeMemberRole(lead, groupId, lead.id, 'member', 'http://127.0.0.1')).rejects.toMatchObject({ status: 409 });
		await expect(removeFromGroup(lead, groupId, lead.id)).rejects.toMatchObject({ status: 409 });
		await changeMemberRole(lead, groupId, member.id, 'lead', 'http://127.0.0.1');
		await removeFromGroup(lead, groupId, lead.id);
		expect(await roleIn(groupId, lead.id)).toBeNull();
	});
	it('requireGroupBySlug: 401 anonymous, 404 non-member, 403 too low, passes admins', async () => {
		const lead = await makeUser();
		const viewer = await makeUser();
		const stranger = await makeUser();
		const admin = await makeUser(undefined, 'admin');
		const groupId = await makeGroup([[lead, 'lead'], [viewer, 'viewer']]);
		const { slug } = await db()('groups').where({ id: groupId }).first('slug');
		await expect(requireGroupBySlug(localsOf(null), slug, 'viewer')).rejects.toMatchObject({ status: 401 });
		await expect(requireGroupBySlug(localsOf(stranger), slug, 'viewer')).rejects.toMatchObject({ status: 404 });
		await expect(requireGroupBySlug(localsOf(viewer), slug, 'member')).rejects.toMatchObject({ status: 403 });
		expect((await requireGroupBySlug(localsOf(lead), slug, 'lead')).role).toBe('lead');
		expect((await requireGroupBySlug(localsOf(admin), slug, 'lead')).role).toBe('admin');
	});
});

describe('throttling', () => {
	it('counts in MariaDB and opens again after a clear', async () => {
		const bucket = `test:${Date.now()}`;
		const limit = { max: 2, windowS: 60 };
		expect((await consume(bucket, limit)).retryAfterS).toBe(0);
		expect((await consume(bucket, limit)).retryAfterS).toBe(0);
		const third = await consume(bucket, limit);
		expect(third.retryAfterS).toBeGreaterThan(0);
		expect(third.retryAfterS).toBeLessThanOrEqual(60);
		await clear(bucket);
		expect((await consume(bucket, limit)).retryAfterS).toBe(0);
		await clear(bucket);
	});
	it('an attacker at another address never locks the owner out (per account-and-address counters)', async () => {
		const u = await makeUser('the-right-password');
		const attacker = `test-attacker-${u.id}`;
		const owner = `test-owner-${u.id}`;
		for (let i = 0; i < LIMITS.signinAccount.max; i++) expect((await checkCredentials(u.email, 'nope-nope-nope', attacker)).ok).toBe(false);
		// The attacker's address is now backing off for this account…
		expect(await checkCredentials(u.email, 'the-right-password', attacker)).toMatchObject({ ok: false, reason: 'throttled' });
		// …but the owner, at their own address, signs in at once.
		const r = await checkCredentials(u.email, 'the-right-password', owner);
		expect(r.ok).toBe(true);
	});
	it('a known browser signs in even from the attacked address, and gets its own counter', async () => {
		const u = await makeUser('the-right-password');
		const shared = `test-proxy-${u.id}`;
		const first = await checkCredentials(u.email, 'the-right-password', `test-home-${u.id}`);
		expect(first.ok).toBe(true);
		const device = first.ok ? first.deviceToken : '';
		for (let i = 0; i < LIMITS.signinAccount.max + 2; i++) await checkCredentials(u.email, 'nope-nope-nope', shared);
		expect(await checkCredentials(u.email, 'the-right-password', shared)).toMatchObject({ ok: false, reason: 'throttled' });
		expect((await checkCredentials(u.email, 'the-right-password', shared, device)).ok).toBe(true);
	});
	it('backs off exponentially from the last failure instead of locking for the whole window', async () => {
		const bucket = `test-backoff:${Date.now()}`;
		const limit = { max: 2, windowS: 900, backoffS: 30 };
		await consume(bucket, limit);
		await consume(bucket, limit);
		const wait = (await consume(bucket, limit)).retryAfterS;
		expect(wait).toBeGreaterThan(0);
		expect(wait).toBeLessThanOrEqual(30); // 30 s · 2^0, not 900 s
		await clear(bucket);
	});
	it('limits per address only for accounts that do not exist (one proxy for a whole institute stays usable)', async () => {
		const u = await makeUser('the-right-password');
		const proxy = `test-institute-${u.id}`;
		const before = LIMITS.signinIp.max;
		(LIMITS.signinIp as { max: number }).max = 3;
		try {
			for (let i = 0; i < 3; i++) await checkCredentials(`nobody-${i}-${u.id}@lab.example.org`, 'whatever-123', proxy);
			expect(await checkCredentials(`nobody-9-${u.id}@lab.example.org`, 'whatever-123', proxy)).toMatchObject({ reason: 'throttled' });
			// A real member behind the same proxy is not affected.
			expect((await checkCredentials(u.email, 'the-right-password', proxy)).ok).toBe(true);
		} finally {
			(LIMITS.signinIp as { max: number }).max = before;
			await clear(`signin-ip:${proxy}`);
		}
	});
});

describe('API tokens', () => {
	it('are stored hashed, resolve to the owner, and stop working when revoked', async () => {
		const u = await makeUser();
		const { id, token } = await createApiToken(u.id, 'integration');
		const row = await db()('api_tokens').where({ id }).first();
		expect(row.token_hash).toBe(hashSecret(token));
		expect(JSON.stringify(row)).not.toContain(token);
		const found = await authenticateBearer(token);
		expect(found?.user.id).toBe(u.id);
		expect(found?.session.via).toBe('token');
		expect((await db()('api_tokens').where({ id }).first()).last_used_at).not.toBeNull();
		expect(await revokeApiToken(u.id, id)).toBe(true);
		expect(await authenticateBearer(token)).toBeNull();
	});
	it('a password change or reset revokes every token of the user', async () => {
		const u = await makeUser('old-password-123');
		const a = await createApiToken(u.id, 'before change');
		expect(await changePassword(u.id, 'old-password-123', 'new-password-456')).toBe(true);
		expect(await authenticateBearer(a.token)).toBeNull();
		const b = await createApiToken(u.id, 'before reset');
		const secret = randomSecret();
		await insertLink('password_resets', { userId: u.id, tokenHash: hashSecret(secret), expiresAt: inAnHour() });
		expect(await resetPassword(secret, 'newer-password-789')).toBe(u.id);
		expect(await authenticateBearer(b.token)).toBeNull();
	});
});
