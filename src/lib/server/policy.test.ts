import { describe, expect, it } from 'vitest';
import { canReadRow, canWriteRow, roleAtLeast } from './policy';
import type { SessionUser } from './auth/types';

const u = (id: string, siteRole: 'admin' | 'user' = 'user'): SessionUser => ({ id, email: `${id}@lab.example.org`, name: id, siteRole, emailVerified: true });

describe('policy rules', () => {
	it('orders roles viewer < member < lead', () => {
		expect(roleAtLeast('viewer', 'member')).toBe(false);
		expect(roleAtLeast('member', 'member')).toBe(true);
		expect(roleAtLeast('lead', 'viewer')).toBe(true);
		expect(roleAtLeast(null, 'viewer')).toBe(false);
	});
	it('hides another group’s private and group rows, shows public ones to signed-in users only', () => {
		const row = { ownerId: 'a', groupId: 1 };
		expect(canReadRow(u('b'), [{ groupId: 2, role: 'lead' }], { ...row, visibility: 'private' })).toBe(false);
		expect(canReadRow(u('b'), [{ groupId: 2, role: 'lead' }], { ...row, visibility: 'group' })).toBe(false);
		expect(canReadRow(u('b'), [{ groupId: 1, role: 'viewer' }], { ...row, visibility: 'group' })).toBe(true);
		expect(canReadRow(u('b'), [], { ...row, visibility: 'public' })).toBe(true);
		expect(canReadRow(null, [], { ...row, visibility: 'public' })).toBe(false);
		expect(canReadRow(u('z', 'admin'), [], { ...row, visibility: 'private' })).toBe(true);
	});
	it('lets owners (member+) and leads write, not viewers', () => {
		const row = { ownerId: 'a', groupId: 1 };
		expect(canWriteRow(u('a'), [{ groupId: 1, role: 'member' }], row)).toBe(true);
		expect(canWriteRow(u('a'), [{ groupId: 1, role: 'viewer' }], row)).toBe(false);
		expect(canWriteRow(u('b'), [{ groupId: 1, role: 'member' }], row)).toBe(false);
		expect(canWriteRow(u('b'), [{ groupId: 1, role: 'lead' }], row)).toBe(true);
	});
});
