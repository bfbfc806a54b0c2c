/** Repository of `spectrum_revisions`: what changed in a spectrum's metadata, by whom, at which version. */
import type { Knex } from 'knex';
import { db } from './index';

export type RevisionAction = 'create' | 'edit' | 'delete' | 'restore';

export interface RevisionRow {
	id: number;
	spectrum_id: number;
	version: number;
	action: RevisionAction;
	user_id: string | null;
	user_name?: string | null;
	changes: string | null;
	created_at: Date;
}

/** Records one revision (inside the caller's transaction). */
export async function insertRevision(
	trx: Knex | Knex.Transaction,
	r: { spectrumId: number; version: number; action: RevisionAction; userId: string | null; changes?: Record<string, { from: unknown; to: unknown }> | null }
): Promise<void> {
	await trx('spectrum_revisions').insert({
		spectrum_id: r.spectrumId,
		version: r.version,
		action: r.action,
		user_id: r.userId,
		changes: r.changes ? JSON.stringify(r.changes) : null
	});
}

/** The revisions of one spectrum, newest first, with the author's name. */
export async function listRevisions(spectrumId: number, conn: Knex = db()): Promise<RevisionRow[]> {
	return conn('spectrum_revisions as r')
		.leftJoin('users as u', 'u.id', 'r.user_id')
		.where('r.spectrum_id', spectrumId)
		.orderBy('r.id', 'desc')
		.select('r.*', 'u.name as user_name');
}
