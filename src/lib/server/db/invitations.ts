/** Repository: `invitations` (token stored as SHA-256). */
import type { Knex } from 'knex';
import { db } from './index';
import type { GroupRole } from '../policy';

export interface InvitationRecord {
	id: number;
	groupId: number;
	email: string;
	role: GroupRole;
	expiresAt: Date;
	acceptedAt: Date | null;
}

/** Inserts an invitation; returns its id. */
export async function insertInvitation(i: { groupId: number; email: string; role: GroupRole; tokenHash: string; invitedBy: string; expiresAt: Date }, k: Knex = db()): Promise<number> {
	const [id] = await k('invitations').insert({ group_id: i.groupId, email: i.email, role: i.role, token_hash: i.tokenHash, invited_by: i.invitedBy, expires_at: i.expiresAt });
	return Number(id);
}

/** The invitation with this token hash, or null (used or expired ones included; the caller checks). */
export async function findInvitationByHash(tokenHash: string, k: Knex = db()): Promise<InvitationRecord | null> {
	const r = await k('invitations').where({ token_hash: tokenHash }).first();
	return r ? { id: Number(r.id), groupId: Number(r.group_id), email: r.email, role: r.role, expiresAt: new Date(r.expires_at), acceptedAt: r.accepted_at ? new Date(r.accepted_at) : null } : null;
}

/**
 * Marks an invitation accepted if it is still open. Returns false when someone else used it
 * first (the conditional update is the single-use guarantee).
 */
export async function claimInvitation(id: number, userId: string, k: Knex = db()): Promise<boolean> {
	const n = await k('invitations').where({ id }).whereNull('accepted_at').where('expires_at', '>', new Date()).update({ accepted_at: new Date(), accepted_by: userId });
	return n === 1;
}

/** Open (not accepted, not expired) invitations of a group. */
export async function openInvitations(groupId: number, k: Knex = db()) {
	return k('invitations').where({ group_id: groupId }).whereNull('accepted_at').where('expires_at', '>', new Date()).select('id', 'email', 'role', 'expires_at as expiresAt').orderBy('created_at', 'desc');
}
