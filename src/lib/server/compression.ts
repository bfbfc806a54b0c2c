/**
 * Response compression for HTML, JSON and other text answers (brotli preferred, then gzip, as the
 * client's Accept-Encoding allows; q=0 refuses a coding). Streams through node:zlib with a flush
 * after every chunk, so streamed page data still arrives as it is produced. Small bodies (< 1 KiB),
 * HEAD requests, already encoded bodies, downloads and binary types pass unchanged. Static assets
 * are precompressed at build time by adapter-node (svelte.config.js `precompress`).
 * Pages never echo secrets (sessions are cookies, CSRF is an origin check), so compressing them
 * does not expose tokens to length-based guessing.
 */
import { Readable } from 'node:stream';
import zlib from 'node:zlib';
import type { Handle } from '@sveltejs/kit';

const COMPRESSIBLE = /^(text\/(html|plain|csv|css|javascript)|application\/(json|javascript|xml)|image\/svg\+xml)\b/i;
const MIN_BYTES = 1024;

/** The coding to use for an Accept-Encoding header: 'br', 'gzip' or null. */
export function chooseEncoding(accept: string | null): 'br' | 'gzip' | null {
	if (!accept) return null;
	const q = new Map<string, number>();
	for (const part of accept.split(',')) {
		const [name, ...params] = part.trim().toLowerCase().split(';');
		if (!name) continue;
		const qp = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
		const v = qp ? Number(qp.slice(2)) : 1;
		q.set(name, Number.isFinite(v) ? v : 0);
	}
	const of = (c: string) => q.get(c) ?? (q.has('*') ? q.get('*')! : 0);
	const br = of('br');
	const gz = of('gzip');
	if (br > 0 && br >= gz) return 'br';
	if (gz > 0) return 'gzip';
	return null;
}

/** The response compressed for this request, or the response itself when it should not be. */
export function compressResponse(request: Request, response: Response): Response {
	if (request.method === 'HEAD' || !response.body || response.status < 200 || response.status === 204 || response.status === 206 || response.status === 304) return response;
	const h = response.headers;
	if (h.has('content-encoding') || /no-transform/i.test(h.get('cache-control') ?? '') || /attachment/i.test(h.get('content-disposition') ?? '')) return response;
	if (!COMPRESSIBLE.test(h.get('content-type') ?? '')) return response;
	const length = h.get('content-length');
	if (length !== null && Number(length) < MIN_BYTES) return response;
	const headers = new Headers(h);
	headers.append('vary', 'Accept-Encoding');
	const coding = chooseEncoding(request.headers.get('accept-encoding'));
	if (!coding) return new Response(response.body, { status: response.status, statusText: response.statusText, headers });
	const z =
		coding === 'br'
			? zlib.createBrotliCompress({ flush: zlib.constants.BROTLI_OPERATION_FLUSH, params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 4 } })
			: zlib.createGzip({ level: 6, flush: zlib.constants.Z_SYNC_FLUSH });
	const source = Readable.fromWeb(response.body as import('node:stream/web').ReadableStream);
	source.on('error', (e) => z.destroy(e));
	const body = Readable.toWeb(source.pipe(z)) as unknown as ReadableStream;
	headers.delete('content-length');
	headers.set('content-encoding', coding);
	return new Response(body, { status: response.status, statusText: response.statusText, headers });
}

/** Handle: compresses what the rest of the chain answers (put it first in `sequence`). */
export const compressionHandle: Handle = async ({ event, resolve }) => compressResponse(event.request, await resolve(event));
