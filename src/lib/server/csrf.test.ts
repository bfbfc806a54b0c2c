import { describe, expect, it } from 'vitest';
import type { RequestEvent } from '@sveltejs/kit';
import { csrfGuard, sameSite } from './csrf';

const ok = new Response('ok');
async function run(method: string, headers: Record<string, string>, url = 'https://127.0.0.1:3000/api/spectra') {
	const request = new Request(url, { method, headers });
	const event = { request, url: new URL(url) } as unknown as RequestEvent;
	const res = await csrfGuard({ event, resolve: async () => ok });
	return res.status;
}

describe('cross-site request guard', () => {
	it('lets same-site browser posts and bearer-token scripts through', async () => {
		expect(await run('POST', { origin: 'http://127.0.0.1:3000', host: '127.0.0.1:3000' })).toBe(200);
		expect(await run('POST', { authorization: 'Bearer abc123', origin: 'https://evil.example' })).toBe(200);
		expect(await run('POST', {})).toBe(200); // no Origin: not a browser, no ambient credentials at risk
		expect(await run('GET', { origin: 'https://evil.example' })).toBe(200);
	});
	it('refuses posts from another site', async () => {
		expect(await run('POST', { origin: 'https://evil.example', host: '127.0.0.1:3000' })).toBe(403);
		expect(await run('DELETE', { 'sec-fetch-site': 'cross-site', host: '127.0.0.1:3000' })).toBe(403);
		expect(await run('POST', { origin: 'null', host: '127.0.0.1:3000' })).toBe(403);
	});
	it('ignores a client-supplied X-Forwarded-Host unless HOST_HEADER says a proxy sets it', async () => {
		const url = new URL('https://127.0.0.1:3000/api/spectra');
		const h = new Headers({ host: '127.0.0.1:3000', 'x-forwarded-host': 'evil.example' });
		expect(sameSite('https://evil.example', url, h, {})).toBe(false);
		expect(await run('POST', { origin: 'https://evil.example', host: '127.0.0.1:3000', 'x-forwarded-host': 'evil.example' })).toBe(403);
		expect(sameSite('https://app.lab.example.org', url, new Headers({ host: '10.0.0.5:3000', 'x-forwarded-host': 'app.lab.example.org' }), { HOST_HEADER: 'x-forwarded-host' })).toBe(true);
	});
});
