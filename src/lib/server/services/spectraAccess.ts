/**
 * Who may see and change which spectrum, through policy.ts. A spectrum the caller may not read is a
 * 404 exactly like a missing one (never leak another group's private rows). Deleted spectra are
 * visible only to those who may restore them.
 */
import type { SessionUser } from '../auth/types';
import { notFound, forbidden } from '../http';
import { canReadRow, canWriteRow, membershipsOf, requireUser, type Membership } from '../policy';
import { findSpectrumById, type Reader, type SpectrumRow } from '../db/spectra';

export interface Caller {
	user: SessionUser;
	memberships: Membership[];
	reader: Reader;
}

/** The signed-in caller with memberships (401 otherwise). */
export async function callerOf(locals: App.Locals): Promise<Caller> {
	const user = requireUser(locals);
	const memberships = await membershipsOf(user.id);
	return { user, memberships, reader: { userId: user.id, isAdmin: user.siteRole === 'admin', groupIds: memberships.map((m) => m.groupId) } };
}

const policyRow = (r: SpectrumRow) => ({ ownerId: r.owner_id, groupId: Number(r.group_id), visibility: r.visibility });

/** Whether the caller may edit, delete and restore this row. */
export const canEditSpectrum = (c: Caller, r: SpectrumRow) => canWriteRow(c.user, c.memberships, policyRow(r));

/** Parses a route id; anything but a positive integer is a 404. */
export function spectrumIdOf(param: string | undefined): number {
	if (!param || !/^\d{1,10}$/.test(param)) throw notFound('No such spectrum.');
	return Number(param);
}

/** Loads a spectrum the caller may read (404 when missing, not visible, or deleted and not theirs to restore). */
export async function visibleSpectrum(locals: App.Locals, idParam: string | undefined): Promise<{ caller: Caller; row: SpectrumRow }> {
	const caller = await callerOf(locals);
	const row = await findSpectrumById(spectrumIdOf(idParam));
	if (!row || !canReadRow(caller.user, caller.memberships, policyRow(row))) throw notFound('No such spectrum.');
	if (row.deleted_at && !canEditSpectrum(caller, row)) throw notFound('No such spectrum.');
	return { caller, row };
}

/** Loads a spectrum the caller may change (404 as above; 403 when readable but not theirs to change). */
export async function writableSpectrum(locals: App.Locals, idParam: string | undefined): Promise<{ caller: Caller; row: SpectrumRow }> {
	const got = await visibleSpectrum(locals, idParam);
	if (!canEditSpectrum(got.caller, got.row)) throw forbidden('Only the owner of this spectrum or a lead of its group may change it.');
	return got;
}
