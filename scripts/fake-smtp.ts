/**
 * Local fake SMTP server for development and tests: accepts every message on
 * 127.0.0.1:SMTP_PORT (default 2525), without TLS or authentication, and stores it in the
 * `outbox` table of the database named by the same env as knexfile.ts. Never for production.
 *
 *   npx tsx scripts/fake-smtp.ts        (stops cleanly on SIGTERM / SIGINT)
 */
import { SMTPServer } from 'smtp-server';
import knexFactory from 'knex';
import { knexConfig } from '../knexfile';

const port = Number(process.env.SMTP_PORT ?? 2525);
const knex = knexFactory(knexConfig(process.env));

/** Decodes RFC 2047 encoded words in a header (=?utf-8?Q?...?= / =?utf-8?B?...?=). */
function decodeHeader(v: string): string {
	return v.replace(/=\?([^?]+)\?([QqBb])\?([^?]*)\?=\s*/g, (_m, _cs, enc: string, text: string) =>
		enc.toUpperCase() === 'B' ? Buffer.from(text, 'base64').toString('utf8') : decodeQP(text.replace(/_/g, ' '))
	);
}

/** Decodes quoted-printable text (soft line breaks and =XX bytes) as UTF-8. */
function decodeQP(s: string): string {
	const bytes = s.replace(/=\r?\n/g, '').replace(/=([0-9A-Fa-f]{2})/g, (_m, h: string) => `%${h}`);
	try {
		return decodeURIComponent(bytes.replace(/%(?![0-9A-Fa-f]{2})/g, '%25'));
	} catch {
		return bytes;
	}
}

/** Splits a raw message into headers and a decoded text body (single-part or first text/plain part). */
function parseMessage(raw: string): { headers: Record<string, string>; text: string } {
	const split = raw.search(/\r?\n\r?\n/);
	const head = split < 0 ? raw : raw.slice(0, split);
	let body = split < 0 ? '' : raw.slice(split).replace(/^\r?\n\r?\n/, '');
	const headers: Record<string, string> = {};
	for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
		const i = line.indexOf(':');
		if (i > 0) headers[line.slice(0, i).trim().toLowerCase()] = line.slice(i + 1).trim();
	}
	const boundary = /boundary="?([^";]+)"?/i.exec(headers['content-type'] ?? '')?.[1];
	if (boundary) {
		const part = body.split(`--${boundary}`).find((p) => /content-type:\s*text\/plain/i.test(p));
		if (part) return { headers, text: parseMessage(part.replace(/^\r?\n/, '')).text };
	}
	const cte = (headers['content-transfer-encoding'] ?? '').toLowerCase();
	if (cte === 'base64') body = Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
	else if (cte === 'quoted-printable') body = decodeQP(body);
	return { headers, text: body.replace(/\r\n/g, '\n').trimEnd() };
}

const server = new SMTPServer({
	authOptional: true,
	disableReverseLookup: true,
	disabledCommands: ['STARTTLS', 'AUTH'],
	banner: 'Windowsill local mail catcher',
	size: 5 * 1024 * 1024,
	onData(stream, session, callback) {
		const chunks: Buffer[] = [];
		stream.on('data', (c: Buffer) => chunks.push(c));
		stream.on('end', async () => {
			try {
				const { headers, text } = parseMessage(Buffer.concat(chunks).toString('utf8'));
				const to = session.envelope.rcptTo.map((r) => r.address).join(', ');
				const links = [...new Set(text.match(/https?:\/\/[^\s<>"]+/g) ?? [])];
				await knex('outbox').insert({
					mail_from: (session.envelope.mailFrom ? session.envelope.mailFrom.address : '').slice(0, 254),
					mail_to: to,
					subject: decodeHeader(headers.subject ?? '').slice(0, 255),
					body_text: text,
					links: JSON.stringify(links)
				});
				callback();
			} catch (e) {
				console.error('[fake-smtp] could not store a message:', (e as Error).message);
				callback(new Error('451 could not store the message'));
			}
		});
	}
});

server.on('error', (e) => console.error('[fake-smtp]', e.message));
server.listen(port, '127.0.0.1', () => console.log(`[fake-smtp] listening on 127.0.0.1:${port}, storing into outbox of ${process.env.DB_NAME ?? 'windowsill'}`));

let stopping = false;
async function stop() {
	if (stopping) return;
	stopping = true;
	await new Promise<void>((resolve) => server.close(() => resolve()));
	await knex.destroy();
	process.exit(0);
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
