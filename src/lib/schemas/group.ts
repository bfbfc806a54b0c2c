/** Zod schemas for group management, shared by form actions and any /api route. */
import { z } from 'zod';
import { emailField } from './auth';

export const groupRoleField = z.enum(['lead', 'member', 'viewer'], { error: 'Choose lead, member or viewer.' });

/** Creating a group; the slug is derived from the name unless given. */
export const createGroupSchema = z.object({
	name: z.string({ error: 'Name the group.' }).trim().min(3, 'Use at least 3 characters.').max(120, 'At most 120 characters.'),
	slug: z
		.string()
		.trim()
		.toLowerCase()
		.max(60, 'At most 60 characters.')
		.regex(/^([a-z0-9]+(-[a-z0-9]+)*)?$/, 'Use lowercase letters, digits and single hyphens.')
		.optional()
		.default(''),
	description: z.string().trim().max(2000, 'At most 2000 characters.').optional().default('')
});

/** Inviting someone by e-mail. */
export const inviteSchema = z.object({ email: emailField, role: groupRoleField });

/** Changing a member's role. */
export const changeRoleSchema = z.object({ userId: z.string().trim().min(1, 'Choose a member.').max(40), role: groupRoleField });

/** Removing a member. */
export const removeMemberSchema = z.object({ userId: z.string().trim().min(1, 'Choose a member.').max(40) });

/** Leaving a group needs an explicit confirmation box. */
export const leaveSchema = z.object({ confirm: z.literal('yes', { error: 'Tick the box to confirm you want to leave.' }) });

/** A URL-safe slug from a group name. */
export function slugify(name: string): string {
	return name
		.normalize('NFKD')
		.replace(/[\u0300-\u036f]/g, '')
		.toLowerCase()
		.replace(/[^a-z0-9]+/g, '-')
		.replace(/^-+|-+$/g, '')
		.slice(0, 60);
}
