/** Pure group-management rules added to the policy module. */
import { describe, expect, it } from 'vitest';
import { canCreateGroup, canManageMembers, leadProblem } from '../../src/lib/server/policy';

const user = (emailVerified: boolean, siteRole: 'admin' | 'user' = 'user') => ({ id: 'u', email: 'ana.quibell@lab.example.org', name: 'Ana', siteRole, emailVerified });

describe('group-management rules', () => {
	it('only leads and admins manage members', () => {
		expect(canManageMembers('lead')).toBe(true);
		expect(canManageMembers('admin')).toBe(true);
		expect(canManageMembers('member')).toBe(false);
		expect(canManageMembers('viewer')).toBe(false);
		expect(canManageMembers(null)).toBe(false);
	});
	it('never leaves a group without a lead', () => {
		expect(leadProblem('lead', 'member', 1)).not.toBeNull();
		expect(leadProblem('lead', null, 1)).not.toBeNull();
		expect(leadProblem('lead', 'member', 2)).toBeNull();
		expect(leadProblem('member', null, 1)).toBeNull();
		expect(leadProblem('lead', 'lead', 1)).toBeNull();
	});
	it('unverified accounts cannot start groups (admins can)', () => {
		expect(canCreateGroup(null)).toBe(false);
		expect(canCreateGroup(user(false))).toBe(false);
		expect(canCreateGroup(user(true))).toBe(true);
		expect(canCreateGroup(user(false, 'admin'))).toBe(true);
	});
});
