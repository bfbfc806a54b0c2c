/** Repository: `outbox` — mail captured by the local fake SMTP server (development and tests). */
import type { Knex } from 'knex';
import { db } from './index';

export interface OutboxMessage {
	id: number;
	from: string;
	to: string;
	subject: string;
	text: string;
	links: string[];
	receivedAt: Date;
}

/** Stores one received message. */
export async function insertOutbox(m: { from: string; to: string; subject: string; text: string; links: string[] }, k: Knex = db()): Promise<void> {
	await k('outbox').insert({ mail_from: m.from.slice(0, 254), mail_to: m.to, subject: m.subject.slice(0, 255), body_text: m.text, links: JSON.stringify(m.links) });
}

/** Newest messages first, optionally only those to an address. */
export async function listOutbox(opts: { to?: string; limit?: number } = {}, k: Knex = db()): Promise<OutboxMessage[]> {
	const q = k('outbox').orderBy('id', 'desc').limit(opts.limit ?? 100);
	if (opts.to) q.where('mail_to', 'like', `%${opts.to.replace(/[%_\\]/g, '\\$&')}%`);
	const rows = await q;
	return rows.map((r) => ({ id: Number(r.id), from: r.mail_from, to: r.mail_to, subject: r.subject, text: r.body_text, links: JSON.parse(r.links || '[]'), receivedAt: r.received_at }));
}
