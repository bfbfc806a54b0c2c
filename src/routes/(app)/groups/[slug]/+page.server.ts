import { fail, redirect } from '@sveltejs/kit';
import { changeRoleSchema, inviteSchema, leaveSchema, removeMemberSchema } from '$lib/schemas/group';
import { fieldErrors } from '$lib/schemas/auth';
import { changeMemberRole, inviteToGroup, removeFromGroup } from '$lib/server/auth/membership';
import { membersOf } from '$lib/server/db/groups';
import { openInvitations } from '$lib/server/db/invitations';
import { canManageMembers, requireGroupBySlug, type GroupRole } from '$lib/server/policy';
import { ApiError } from '$lib/server/http';
import { asPage, pageUser } from '$lib/server/auth/guard';
import { keep, readForm, errorsOf } from '$lib/server/auth/forms';
import { linkBase } from '$lib/server/mail/send';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = pageUser(event);
	const { group, role } = await asPage(event, () => requireGroupBySlug(event.locals, event.params.slug, 'viewer'));
	const manage = canManageMembers(role);
	return { group, role, manage, me: user.id, members: await membersOf(group.id), invitations: manage ? await openInvitations(group.id) : [] };
};

/** Signed in, group visible, at least `min`: the order every action checks in, before reading the form. */
async function gate(event: RequestEvent, min: GroupRole) {
	const user = pageUser(event);
	const { group } = await asPage(event, () => requireGroupBySlug(event.locals, event.params.slug, min));
	return { user, group, v: await readForm(event.request) };
}

/** Maps a service ApiError to `fail` with the field it names. */
function failFrom(e: unknown, action: string, values: Record<string, string> = {}) {
	if (!(e instanceof ApiError)) throw e;
	return fail(e.status, { action, ...values, errors: errorsOf(e.extra.field ?? 'form', e.message) });
}

export const actions: Actions = {
	invite: async (event) => {
		const { user, group, v } = await gate(event, 'lead');
		const parsed = inviteSchema.safeParse(v);
		if (!parsed.success) return fail(400, { action: 'invite', ...keep(v, 'email', 'role'), errors: fieldErrors(parsed.error) });
		try {
			await inviteToGroup(user, group.id, parsed.data.email, parsed.data.role, linkBase(event.url));
		} catch (e) {
			return failFrom(e, 'invite', keep(v, 'email', 'role'));
		}
		return { action: 'invite', invited: parsed.data.email };
	},
	changeRole: async (event) => {
		const { user, group, v } = await gate(event, 'lead');
		const parsed = changeRoleSchema.safeParse(v);
		if (!parsed.success) return fail(400, { action: 'changeRole', errors: fieldErrors(parsed.error) });
		try {
			await changeMemberRole(user, group.id, parsed.data.userId, parsed.data.role, linkBase(event.url));
		} catch (e) {
			return failFrom(e, 'changeRole');
		}
		return { action: 'changeRole', done: true };
	},
	remove: async (event) => {
		const { user, group, v } = await gate(event, 'lead');
		const parsed = removeMemberSchema.safeParse(v);
		if (!parsed.success) return fail(400, { action: 'remove', errors: fieldErrors(parsed.error) });
		try {
			await removeFromGroup(user, group.id, parsed.data.userId);
		} catch (e) {
			return failFrom(e, 'remove');
		}
		return { action: 'remove', done: true };
	},
	leave: async (event) => {
		const { user, group, v } = await gate(event, 'viewer');
		const parsed = leaveSchema.safeParse(v);
		if (!parsed.success) return fail(400, { action: 'leave', errors: fieldErrors(parsed.error) });
		try {
			await removeFromGroup(user, group.id, user.id);
		} catch (e) {
			return failFrom(e, 'leave');
		}
		redirect(303, '/groups');
	}
};
