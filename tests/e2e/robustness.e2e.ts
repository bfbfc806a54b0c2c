/**
 * Nothing a user sends takes the server down or leaks: decompression bombs, oversized bodies,
 * open-redirect `next` values, tokens minting tokens, and download names of any script.
 */
import { expect, test } from '@playwright/test';
import { apiAs, baseURL, bearerContext, signInAs } from './helpers/auth';

const origin = () => new URL(baseURL()).origin;

test('a 200-byte DUP bomb is refused with a 4xx and the server keeps answering', async ({ request }) => {
	await apiAs(request, 'member');
	// JCAMP-DX 4.24 DUP: "V" repeats the previous value 4 times, with digits after it 99,999,999 times.
	const bomb = ['##TITLE=bomb', '##JCAMP-DX=4.24', '##DATA TYPE=UV/VIS SPECTRUM', '##XUNITS=NANOMETERS', '##YUNITS=ABSORBANCE', '##FIRSTX=200', '##LASTX=800', '##NPOINTS=601', '##XFACTOR=1', '##YFACTOR=1', '##XYDATA=(X++(Y..Y))', '200 1V99999999', '##END='].join('\n');
	const r = await request.post('/api/spectra', { multipart: { file: { name: 'bomb.jdx', mimeType: 'chemical/x-jcamp-dx', buffer: Buffer.from(bomb) } }, headers: { origin: origin() } });
	expect([400, 413, 422]).toContain(r.status());
	expect((await r.json()).error.message).toContain('bomb.jdx');
	const health = await request.get('/api/health');
	expect(health.status()).toBe(200);
});

test('a body above the limit answers 413, not 400', async ({ request }) => {
	await apiAs(request, 'member');
	const big = Buffer.alloc(30 * 1024 * 1024, 0x41); // 30 MB, above BODY_SIZE_LIMIT (25M in the tests)
	const r = await request.post('/api/spectra', { multipart: { file: { name: 'big.csv', mimeType: 'text/csv', buffer: big } }, headers: { origin: origin() } });
	expect(r.status()).toBe(413);
	const j = await request.post('/api/window', { data: { junk: 'x'.repeat(30 * 1024 * 1024) }, headers: { origin: origin() } });
	expect(j.status()).toBe(413);
});

test('sign-in never redirects to another site, whatever `next` says', async ({ page }) => {
	await signInAs(page, 'member');
	for (const next of ['%2F%09%2Fevil.example%2F', '%2F%2Fevil.example', '%2F%5Cevil.example', 'https%3A%2F%2Fevil.example', '%2F%0A%2Fevil.example']) {
		const r = await page.request.get(`/signin?next=${next}`, { maxRedirects: 0 });
		expect(r.status()).toBe(303);
		const to = new URL(r.headers()['location'], baseURL());
		expect(to.origin).toBe(origin());
	}
});

test('a token cannot make tokens; a browser session can', async ({ request }) => {
	const viaToken = await bearerContext('member');
	const r = await viaToken.post('/api/tokens', { data: { name: 'child' } });
	expect(r.status()).toBe(403);
	await viaToken.dispose();
	await apiAs(request, 'member');
	const ok = await request.post('/api/tokens', { data: { name: 'from the browser' }, headers: { origin: origin() } });
	expect(ok.status()).toBe(201);
});

test('downloads of a file with an en dash, Greek, CJK and quotes in its name work (RFC 6266 filename*)', async ({ request }) => {
	await apiAs(request, 'member');
	const name = `photoswitch – αβ 光 "q" ${Date.now()}.csv`;
	const rows = ['nm,A', ...Array.from({ length: 60 }, (_, i) => `${350 + 5 * i},${(0.4 + 0.3 * Math.exp(-(((i - 30) / 8) ** 2)) + (Date.now() % 101) * 1e-6).toFixed(6)}`)];
	const up = await request.post('/api/spectra', { multipart: { file: { name, mimeType: 'text/csv', buffer: Buffer.from(rows.join('\n')) } }, headers: { origin: origin() } });
	expect(up.status(), await up.text()).toBe(201);
	const id = (await up.json()).items[0].id;
	for (const format of ['original', 'csv', 'jcamp']) {
		const r = await request.get(`/api/spectra/${id}/export?format=${format}`);
		if (r.status() === 400) continue; // a format this spectrum does not offer
		expect(r.status(), format).toBe(200);
		const cd = r.headers()['content-disposition'];
		expect(cd).toMatch(/^attachment;/);
		// The original keeps its name (non-ASCII → filename*); exports use an ASCII name built from the spectrum's.
		if (format === 'original') expect(decodeURIComponent(/filename\*=UTF-8''([^;]+)/.exec(cd)![1])).toBe(name);
	}
});
