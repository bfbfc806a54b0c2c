/**
 * Response compression: coding negotiation as RFC 9110 §12.5.3 describes Accept-Encoding (q-values,
 * q=0 refuses, "*" stands for any other coding), and bodies that node:zlib decodes back byte for byte.
 */
import { describe, expect, it } from 'vitest';
import zlib from 'node:zlib';
import { chooseEncoding, compressResponse } from '../../src/lib/server/compression';

const big = JSON.stringify({ items: Array.from({ length: 400 }, (_, i) => ({ id: i, name: `Invented dye ${i}`, lambdaMaxNm: 400 + (i % 200) })) });

describe('Accept-Encoding negotiation (RFC 9110 §12.5.3)', () => {
	it.each([
		['gzip, deflate, br', 'br'],
		['gzip', 'gzip'],
		['br;q=0, gzip', 'gzip'],
		['gzip;q=0.5, br;q=0.4', 'gzip'],
		['identity', null],
		['*', 'br'],
		['*;q=0', null],
		['', null]
	])('%s → %s', (header, want) => expect(chooseEncoding(header || null)).toBe(want));
});

describe('compressResponse', () => {
	const req = (enc: string, method = 'GET') => new Request('http://x/api/spectra', { method, headers: { 'accept-encoding': enc } });
	const res = (body: string, type = 'application/json') => new Response(body, { headers: { 'content-type': type, 'content-length': String(Buffer.byteLength(body)) } });

	it('br and gzip bodies decode to the original JSON; Vary and no length', async () => {
		for (const [enc, decode] of [['br', zlib.brotliDecompressSync], ['gzip', zlib.gunzipSync]] as const) {
			const out = compressResponse(req(enc), res(big));
			expect(out.headers.get('content-encoding')).toBe(enc);
			expect(out.headers.get('vary')).toMatch(/accept-encoding/i);
			expect(out.headers.get('content-length')).toBeNull();
			const bytes = Buffer.from(await out.arrayBuffer());
			expect(bytes.byteLength).toBeLessThan(big.length / 3);
			expect(decode(bytes).toString('utf8')).toBe(big);
		}
	});
	it('leaves small bodies, HEAD, downloads, binary types and refusals alone', async () => {
		expect(compressResponse(req('br'), res('{"ok":true}')).headers.get('content-encoding')).toBeNull();
		expect(compressResponse(req('br', 'HEAD'), res(big)).headers.get('content-encoding')).toBeNull();
		expect(compressResponse(req('br'), res(big, 'application/octet-stream')).headers.get('content-encoding')).toBeNull();
		const dl = new Response(big, { headers: { 'content-type': 'text/csv', 'content-disposition': 'attachment; filename="a.csv"' } });
		expect(compressResponse(req('br'), dl).headers.get('content-encoding')).toBeNull();
		const plain = compressResponse(req('identity'), res(big));
		expect(plain.headers.get('content-encoding')).toBeNull();
		expect(await plain.text()).toBe(big);
	});
	it('keeps several Set-Cookie headers', () => {
		const r = new Response(big, { headers: { 'content-type': 'text/html' } });
		r.headers.append('set-cookie', 'a=1; Path=/');
		r.headers.append('set-cookie', 'b=2; Path=/');
		expect(compressResponse(req('gzip'), r).headers.getSetCookie()).toEqual(['a=1; Path=/', 'b=2; Path=/']);
	});
});
