/**
 * Group membership orchestration: create, invite, accept, change role, remove, leave.
 * Callers check roles through the policy module first; the rules that depend on the data
 * (never leave a group without a lead, invitation e-mail must match) are enforced here
 * inside the same transaction as the write.
 */
import { db } from '../db';
import { addMember, findGroupById, groupNameTaken, insertGroup, leadCount, removeMember, roleIn, setRole } from '../db/groups';
import { claimInvitation, findInvitationByHash, insertInvitation, type InvitationRecord } from '../db/invitations';
import { findUserByEmail, findUserById, insertUser, markEmailVerified } from '../db/users';
import { audit } from '../db/audit';
import { ApiError } from '../http';
import { leadProblem, type GroupRole } from '../policy';
import { invitationMail, roleChangedMail } from '../mail/messages';
import { sendMail } from '../mail/send';
import { LIMITS, consume } from './rate-limit';
import { LIFETIME_MS, fromNow, hashSecret, randomSecret } from './tokens';
import { hashPassword } from './password';
import { newUserId } from './account';
import type { SessionUser } from './types';

/** Creates a group with the creator as lead; 409 when the name or slug is taken. Returns the slug. */
export async function createGroup(user: SessionUser, input: { name: string; slug: string; description: string }): Promise<string> {
	return db().transaction(async (trx) => {
		if (await groupNameTaken(input.name, input.slug, trx)) throw new ApiError(409, 'duplicate', 'A group with this name or short name exists already.', { field: 'name' });
		const id = await insertGroup({ name: input.name, slug: input.slug, description: input.description || null, createdBy: user.id }, trx);
		await addMember(id, user.id, 'lead', trx);
		await audit({ actorId: user.id, action: 'group.create', groupId: id }, trx);
		return input.slug;
	});
}

/** Invites an address to a group (rate-limited per address, 429 when over). Mails the link. */
export async function inviteToGroup(actor: SessionUser, groupId: number, email: string, role: GroupRole, base: string): Promise<void> {
	const group = await findGroupById(groupId);
	if (!group) throw new ApiError(404, 'not_found', 'No such group.');
	const existing = await findUserByEmail(email);
	if (existing && (await roleIn(groupId, existing.id))) throw new ApiError(409, 'duplicate', 'This person is already a member.', { field: 'email' });
	const { retryAfterS } = await consume(`invite:${email}`, LIMITS.invitePerAddress);
	if (retryAfterS) throw new ApiError(429, 'throttled', 'Too many invitations to this address; try again later.', { field: 'email', retryAfterS });
	const token = randomSecret();
	await insertInvitation({ groupId, email, role, tokenHash: hashSecret(token), invitedBy: actor.id, expiresAt: fromNow(LIFETIME_MS.invitation) });
	await audit({ actorId: actor.id, action: 'group.invite', target: email, groupId, details: { role } });
	await sendMail(email, invitationMail(group.name, actor.name, role, `${base}/invite/${token}`));
}

/** An invitation that can still be used, or null (unknown, used or expired). */
export async function openInvitation(token: string): Promise<(InvitationRecord & { groupName: string; groupSlug: string }) | null> {
	const inv = await findInvitationByHash(hashSecret(token));
	if (!inv || inv.acceptedAt || inv.expiresAt.getTime() <= Date.now()) return null;
	const group = await findGroupById(inv.groupId);
	return group ? { ...inv, groupName: group.name, groupSlug: group.slug } : null;
}

/** A signed-in user accepts; the invitation's address must be theirs. Returns the group slug. */
export async function acceptInvitation(user: SessionUser, token: string): Promise<string> {
	const inv = await openInvitation(token);
	if (!inv) throw new ApiError(404, 'not_found', 'This invitation is unknown, used or expired.');
	if (inv.email !== user.email) throw new ApiError(403, 'forbidden', 'This invitation was sent to a different address. Sign in with that address.');
	await db().transaction(async (trx) => {
		if (!(await claimInvitation(inv.id, user.id, trx))) throw new ApiError(404, 'not_found', 'This invitation is unknown, used or expired.');
		await addMember(inv.groupId, user.id, inv.role, trx);
		await markEmailVerified(user.id, trx);
		await audit({ actorId: user.id, action: 'group.join', groupId: inv.groupId, details: { role: inv.role } }, trx);
	});
	return inv.groupSlug;
}

/** Creates an account from an invitation (address proven by the link) and joins the group. */
export async function signUpFromInvitation(token: string, input: { name: string; password: string }): Promise<{ userId: string; slug: string }> {
	const inv = await openInvitation(token);
	if (!inv) throw new ApiError(404, 'not_found', 'This invitation is unknown, used or expired.');
	if (await findUserByEmail(inv.email)) throw new ApiError(409, 'duplicate', 'Could not create an account for this invitation. If you already have one, sign in to accept.');
	const passwordHash = await hashPassword(input.password);
	const userId = newUserId();
	await db().transaction(async (trx) => {
		await insertUser({ id: userId, email: inv.email, name: input.name, passwordHash, emailVerified: true }, trx);
		if (!(await claimInvitation(inv.id, userId, trx))) throw new ApiError(404, 'not_found', 'This invitation is unknown, used or expired.');
		await addMember(inv.groupId, userId, inv.role, trx);
		await audit({ actorId: userId, action: 'signup.invited', groupId: inv.groupId, details: { role: inv.role } }, trx);
	});
	return { userId, slug: inv.groupSlug };
}

/** Changes a member's role (the caller is a lead or admin) and mails them a notice. */
export async function changeMemberRole(actor: SessionUser, groupId: number, userId: string, role: GroupRole, base: string): Promise<void> {
	const before = await db().transaction(async (trx) => {
		const current = await roleIn(groupId, userId, trx);
		if (!current) throw new ApiError(404, 'not_found', 'No such member.', { field: 'userId' });
		const problem = leadProblem(current, role, await leadCount(groupId, trx));
		if (problem) throw new ApiError(409, 'last_lead', problem, { field: 'role' });
		await setRole(groupId, userId, role, trx);
		await audit({ actorId: actor.id, action: 'group.role', target: userId, groupId, details: { from: current, to: role } }, trx);
		return current;
	});
	const [member, group] = await Promise.all([findUserById(userId), findGroupById(groupId)]);
	if (member && group && before !== role) await sendMail(member.email, roleChangedMail(group.name, before, role, `${base}/groups/${group.slug}`));
}

/** Removes a member (caller is a lead or admin) or lets a member leave (`actor.id === userId`). */
export async function removeFromGroup(actor: SessionUser, groupId: number, userId: string): Promise<void> {
	await db().transaction(async (trx) => {
		const current = await roleIn(groupId, userId, trx);
		if (!current) throw new ApiError(404, 'not_found', 'No such member.', { field: 'userId' });
		const problem = leadProblem(current, null, await leadCount(groupId, trx));
		if (problem) throw new ApiError(409, 'last_lead', problem);
		await removeMember(groupId, userId, trx);
		await audit({ actorId: actor.id, action: actor.id === userId ? 'group.leave' : 'group.remove', target: userId, groupId }, trx);
	});
}
