/**
 * Two stateless app servers on one database behave as one: an upload through one server is found
 * through the other at once (no per-process cache may hide it), and a session made on one is valid
 * on the other. Starts a second `node <BUILD_DIR>` on its own port beside Playwright's server.
 */
import { expect, request as playwrightRequest, test } from '@playwright/test';
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import { baseURL, DEMO_PASSWORD, DEMO_USERS } from './helpers/auth';

const buildDir = process.env.BUILD_DIR ?? 'build';
const secondPort = Number(process.env.E2E_SECOND_PORT ?? Number(new URL(baseURL()).port || 4173) + 7);
const second = `http://127.0.0.1:${secondPort}`;
let server: ChildProcess | null = null;
let serverLog = '';

async function waitForHealth(url: string, ms = 30_000) {
	const until = Date.now() + ms;
	while (Date.now() < until) {
		try {
			const r = await fetch(`${url}/api/health`);
			if (r.ok) return;
		} catch {
			/* not listening yet */
		}
		if (server?.exitCode != null) throw new Error(`second server exited: ${serverLog.slice(-2000)}`);
		await new Promise((r) => setTimeout(r, 200));
	}
	throw new Error(`second server did not answer on ${url}: ${serverLog.slice(-2000)}`);
}

test.describe('two app servers on one database', () => {
	test.skip(!existsSync(buildDir), `no build in ${buildDir}`);

	test.beforeAll(async () => {
		server = spawn(process.execPath, [buildDir], {
			env: { ...process.env, HOST: '127.0.0.1', PORT: String(secondPort), ORIGIN: second, PUBLIC_ORIGIN: second, BODY_SIZE_LIMIT: process.env.BODY_SIZE_LIMIT ?? '25M' },
			stdio: ['ignore', 'pipe', 'pipe']
		});
		server.stdout?.on('data', (d) => (serverLog += String(d)));
		server.stderr?.on('data', (d) => (serverLog += String(d)));
		await waitForHealth(second);
	});

	test.afterAll(async () => {
		server?.kill('SIGTERM');
		server = null;
	});

	test('an upload through one server is found through the other at once', async () => {
		const a = await playwrightRequest.newContext({ baseURL: baseURL() });
		const b = await playwrightRequest.newContext({ baseURL: second });
		try {
			// A session made on server A is valid on server B (sessions live in the database).
			const signin = await a.post('/api/auth/signin', { data: { email: DEMO_USERS.member, password: DEMO_PASSWORD } });
			expect(signin.status()).toBe(200);
			const cookies = await a.storageState();
			await b.dispose();
			const b2 = await playwrightRequest.newContext({
				baseURL: second,
				storageState: { cookies: cookies.cookies.map((c) => ({ ...c, domain: '127.0.0.1' })), origins: [] }
			});

			const unique = `two-servers check ${Date.now()}`;
			// Invented spectrum (demo only): one smooth band at 412 nm.
			const rows = ['wavelength_nm,absorbance'];
			const amp = 0.8 + (Date.now() % 997) * 1e-4; // new bytes every run (the Library refuses duplicate files)
			for (let nm = 300; nm <= 600; nm += 2) rows.push(`${nm},${(amp * Math.exp(-(((nm - 412) / 25) ** 2)) + 0.01).toFixed(6)}`);
			const up = await a.post('/api/spectra', {
				multipart: {
					file: { name: `${unique}.csv`, mimeType: 'text/csv', buffer: Buffer.from(rows.join('\n')) },
					metadata: JSON.stringify({ name: unique, kind: 'absorption', part: 'substrate' })
				},
				headers: { origin: new URL(baseURL()).origin }
			});
			expect(up.status(), await up.text()).toBe(201);
			const id = (await up.json()).items[0].id;

			const one = await b2.get(`/api/spectra/${id}`);
			expect(one.status()).toBe(200);
			expect((await one.json()).name).toBe(unique);
			const found = await b2.get(`/api/spectra?q=${encodeURIComponent(unique)}&limit=5`);
			expect(found.status()).toBe(200);
			expect((await found.json()).items.map((s: { id: number }) => s.id)).toContain(id);
			const absorbs = await b2.get(`/api/spectra?absorbsAt=412&minAbsorbance=0.5&limit=200`);
			expect((await absorbs.json()).items.map((s: { id: number }) => s.id)).toContain(id);

			// Deleted through B: marked deleted through A at once, and no longer found by search there.
			const del = await b2.delete(`/api/spectra/${id}`, { headers: { origin: second } });
			expect(del.status()).toBeLessThan(300);
			expect((await (await a.get(`/api/spectra/${id}`)).json()).deletedAt).not.toBeNull();
			const after = await a.get(`/api/spectra?q=${encodeURIComponent(unique)}&limit=5`);
			expect((await after.json()).items.map((s: { id: number }) => s.id)).not.toContain(id);
			await b2.dispose();
		} finally {
			await a.dispose();
		}
	});
});
