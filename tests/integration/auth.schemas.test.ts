/** Shared zod schemas: field-level messages, normalisation, no account hints. */
import { describe, expect, it } from 'vitest';
import { signUpSchema, signInSchema, resetSchema, fieldErrors } from '../../src/lib/schemas/auth';
import { createGroupSchema, inviteSchema, slugify } from '../../src/lib/schemas/group';

describe('account schemas', () => {
	it('normalise e-mail and name each bad field', () => {
		expect(signInSchema.parse({ email: '  Ana.Q@Lab.Example.org ', password: 'x' }).email).toBe('ana.q@lab.example.org');
		const r = signUpSchema.safeParse({ name: '', email: 'not-an-address', password: 'short' });
		expect(r.success).toBe(false);
		if (!r.success) expect(Object.keys(fieldErrors(r.error)).sort()).toEqual(['email', 'name', 'password']);
	});
	it('reset needs matching passwords', () => {
		const r = resetSchema.safeParse({ token: 'abcdefghijklmnop', password: 'long-enough-1', confirm: 'long-enough-2' });
		expect(r.success).toBe(false);
		if (!r.success) expect(fieldErrors(r.error).confirm).toBe('The two passwords differ.');
	});
});

describe('group schemas', () => {
	it('accept the three roles only', () => {
		expect(inviteSchema.safeParse({ email: 'joel.venter@lab.example.org', role: 'member' }).success).toBe(true);
		expect(inviteSchema.safeParse({ email: 'joel.venter@lab.example.org', role: 'owner' }).success).toBe(false);
	});
	it('derive slugs', () => {
		expect(slugify('Harbourlight Photochemistry Group')).toBe('harbourlight-photochemistry-group');
		expect(slugify('Ångström Lab (2)')).toBe('angstrom-lab-2');
		expect(createGroupSchema.safeParse({ name: 'ab' }).success).toBe(false);
		expect(createGroupSchema.safeParse({ name: 'Flow Lab', slug: 'Bad Slug!' }).success).toBe(false);
	});
});
