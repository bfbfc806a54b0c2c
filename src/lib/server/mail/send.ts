/** Sends one message; failures are logged and reported as `false` so a flaky SMTP server never loses a write. */
import { mailFrom, mailTransport } from './transport';
import type { Mail } from './messages';

/** Sends `mail` to `to`. Resolves after the SMTP server accepted it (or failed). */
export async function sendMail(to: string, mail: Mail): Promise<boolean> {
	try {
		await mailTransport().sendMail({ from: mailFrom(), to, subject: mail.subject, text: mail.text });
		return true;
	} catch (e) {
		console.error(`[mail] could not send "${mail.subject}" to ${to}:`, (e as Error).message);
		return false;
	}
}

/**
 * The base URL for links in mail: PUBLIC_ORIGIN when set, else ORIGIN, else the request's origin.
 * adapter-node assumes https when ORIGIN is unset; on a loopback host (a local `node build`
 * without TLS) that is never right, so such links use http.
 */
export function linkBase(url: URL): string {
	const configured = process.env.PUBLIC_ORIGIN || process.env.ORIGIN;
	if (configured) return configured.replace(/\/$/, '');
	const loopback = ['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname);
	return loopback && url.protocol === 'https:' ? `http://${url.host}` : url.origin;
}
