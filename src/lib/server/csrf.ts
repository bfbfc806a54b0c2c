import type { Handle } from '@sveltejs/kit';

/**
 * Cross-site request forgery guard (replaces SvelteKit's built-in origin check, which also refused
 * scripts that POST multipart files with a bearer token and no Origin header).
 *
 * Browsers send `Origin` (and `Sec-Fetch-Site`) on every cross-site POST, so a state-changing request is
 * refused when either says it comes from another site. Requests authenticated by `Authorization: Bearer`
 * carry no ambient credentials and are not subject to CSRF. Extra trusted origins: env TRUSTED_ORIGINS
 * (comma-separated).
 */
/**
 * Whether a browser's Origin names this site: equal to the URL's origin, or (adapter-node assumes https
 * unless ORIGIN is set) the same host:port as the Host header. X-Forwarded-Host is believed only when the
 * deployment says a proxy sets it (adapter-node's HOST_HEADER=x-forwarded-host, which also makes it the
 * URL's host); a client-supplied X-Forwarded-Host is otherwise ignored.
 */
export function sameSite(origin: string, url: URL, headers: Headers, env: Record<string, string | undefined> = process.env): boolean {
	if (origin === url.origin) return true;
	let host: string;
	try {
		host = new URL(origin).host;
	} catch {
		return false;
	}
	const hostHeader = (env.HOST_HEADER ?? '').trim().toLowerCase();
	const trustedHost = hostHeader ? headers.get(hostHeader)?.split(',')[0].trim() : undefined;
	return host === (trustedHost || headers.get('host'));
}

export const csrfGuard: Handle = async ({ event, resolve }) => {
	const { request, url } = event;
	if (request.method === 'GET' || request.method === 'HEAD' || request.method === 'OPTIONS') return resolve(event);
	if (/^Bearer\s+\S/i.test(request.headers.get('authorization') ?? '')) return resolve(event);
	const origin = request.headers.get('origin');
	const site = request.headers.get('sec-fetch-site');
	const trusted = (process.env.TRUSTED_ORIGINS ?? '').split(',').map((s) => s.trim()).filter(Boolean);
	const crossOrigin = origin !== null && origin !== 'null' && !sameSite(origin, url, request.headers) && !trusted.includes(origin);
	const crossSite = site === 'cross-site' && !(origin && trusted.includes(origin));
	if (crossOrigin || crossSite || origin === 'null') {
		const message = `Cross-site ${request.method} requests are refused (origin ${origin ?? "unknown"}, this site ${url.origin}).`;
		if (url.pathname.startsWith('/api/')) {
			return new Response(JSON.stringify({ error: { code: 'cross_site', message } }), { status: 403, headers: { 'content-type': 'application/json' } });
		}
		return new Response(message, { status: 403, headers: { 'content-type': 'text/plain' } });
	}
	return resolve(event);
};
