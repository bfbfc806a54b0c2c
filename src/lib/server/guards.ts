/**
 * Request guards that keep one bad request, a slow database or a huge body from taking the
 * server down or hanging it (see src/hooks.server.ts):
 *
 * - `bodyLimitGuard`: a body whose Content-Length is above BODY_SIZE_LIMIT answers 413 at once
 *   (adapter-node's own limit errors the stream later; routes map that to 413 too, see http.ts).
 * - `outageGuard`: database outages, statement timeouts and pool exhaustion answer 503 with
 *   Retry-After and a plain message, on pages and API; a request still unanswered after its
 *   deadline (REQUEST_DEADLINE_S, default 25 s; uploads 60 s) answers 503 as well, so a frozen
 *   database cannot hang every request for as long as it is frozen.
 */
import type { Handle, RequestEvent } from '@sveltejs/kit';
import { OUTAGE_MESSAGE, isDatabaseOutage, retryAfterSeconds } from './db/outage';

/** BODY_SIZE_LIMIT as adapter-node reads it ("25M", "512K", bytes, or Infinity), in bytes. */
export function bodySizeLimitBytes(env: Record<string, string | undefined> = process.env): number {
	const raw = (env.BODY_SIZE_LIMIT ?? '512K').trim();
	if (/^infinity$/i.test(raw)) return Infinity;
	const m = /^(\d+(?:\.\d+)?)\s*([KMG]?)B?$/i.exec(raw);
	if (!m) return 512 * 1024;
	const mult = { '': 1, K: 1024, M: 1024 ** 2, G: 1024 ** 3 }[m[2].toUpperCase() as '' | 'K' | 'M' | 'G'];
	return Number(m[1]) * mult;
}

const isApi = (e: RequestEvent) => e.url.pathname.startsWith('/api/');

function plain(event: RequestEvent, status: number, code: string, message: string, headers: Record<string, string> = {}): Response {
	if (isApi(event))
		return new Response(JSON.stringify({ error: { code, message } }), { status, headers: { 'content-type': 'application/json', 'cache-control': 'no-store', ...headers } });
	const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Windowsill — ${status}</title></head><body style="font-family: system-ui, sans-serif; max-width: 40rem; margin: 4rem auto; padding: 0 1rem; line-height: 1.5"><h1 style="font-size: 1.25rem">${status === 503 ? 'Windowsill is briefly unavailable' : 'The request was too large'}</h1><p>${message}</p><p><a href="">Try again</a></p></body></html>`;
	return new Response(html, { status, headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store', ...headers } });
}

export const bodyLimitGuard: Handle = async ({ event, resolve }) => {
	const length = Number(event.request.headers.get('content-length') ?? NaN);
	const limit = bodySizeLimitBytes();
	if (Number.isFinite(length) && length > limit) {
		const mb = (n: number) => `${(n / 1048576).toFixed(1)} MB`;
		return plain(event, 413, 'too_large', `The request body (${mb(length)}) is above the ${mb(limit)} limit.`);
	}
	return resolve(event);
};

/** Marks the event when handleError saw a database outage; the guard then answers 503. */
export function markOutage(event: RequestEvent, error: unknown): boolean {
	if (!isDatabaseOutage(error)) return false;
	(event.locals as { dbOutage?: boolean }).dbOutage = true;
	return true;
}

const deadlineMs = (event: RequestEvent) => {
	const upload = event.request.method === 'POST' && (/^\/api\/spectra\/?$/.test(event.url.pathname) || event.url.pathname.startsWith('/library/upload'));
	const n = Number(upload ? (process.env.UPLOAD_DEADLINE_S ?? 60) : (process.env.REQUEST_DEADLINE_S ?? 25));
	return (Number.isFinite(n) && n > 0 ? n : 25) * 1000;
};

export const outageGuard: Handle = async ({ event, resolve }) => {
	const retry = { 'retry-after': String(retryAfterSeconds()) };
	let timer: ReturnType<typeof setTimeout> | undefined;
	const deadline = new Promise<'deadline'>((r) => (timer = setTimeout(() => r('deadline'), deadlineMs(event))));
	try {
		const result = await Promise.race([resolve(event), deadline]);
		if (result === 'deadline') return plain(event, 503, 'timeout', 'The server could not answer in time (the database may be overloaded). Please try again in a few seconds.', retry);
		if ((event.locals as { dbOutage?: boolean }).dbOutage && result.status >= 500) return plain(event, 503, 'db_unavailable', OUTAGE_MESSAGE, retry);
		if (result.status === 503 && !result.headers.has('retry-after')) {
			const headers = new Headers(result.headers);
			headers.set('retry-after', retry['retry-after']);
			return new Response(result.body, { status: 503, statusText: result.statusText, headers });
		}
		return result;
	} catch (e) {
		if (isDatabaseOutage(e)) return plain(event, 503, 'db_unavailable', OUTAGE_MESSAGE, retry);
		throw e;
	} finally {
		clearTimeout(timer);
	}
};

/** Shortens request data in log lines (whole uploads must never reach the logs). */
export function truncateForLog(v: unknown, max = 500): string {
	let s: string;
	if (v instanceof Error) s = `${v.name}: ${v.message}${v.stack ? `\n${v.stack.split('\n').slice(1, 8).join('\n')}` : ''}`;
	else if (typeof v === 'string') s = v;
	else {
		try {
			s = JSON.stringify(v, (_k, val) => (val instanceof Uint8Array || (val && typeof val === 'object' && (val as { type?: string }).type === 'Buffer') ? `[${(val as Uint8Array).length ?? '?'} bytes]` : val));
		} catch {
			s = String(v);
		}
	}
	// SQL errors from mysql2 carry the statement with its (hex-encoded) values: keep only the head.
	return s.length > max ? `${s.slice(0, max)}… [${s.length - max} more characters]` : s;
}
