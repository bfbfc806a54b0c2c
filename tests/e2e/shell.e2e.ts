import { expect, test } from '@playwright/test';

test('the home page states the job and shows the section navigation', async ({ page }) => {
	const errors: string[] = [];
	page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
	const response = await page.goto('/');
	expect(response?.status()).toBe(200);
	await expect(page.getByRole('heading', { level: 1, name: 'Windowsill' })).toBeVisible();
	const nav = page.getByRole('navigation', { name: 'Sections' });
	for (const label of ['Library', 'Window finder', 'Plans', 'Lamps', 'Reference']) {
		await expect(nav.getByRole('link', { name: label })).toBeVisible();
	}
	// Security headers from hooks.server.ts and a CSP the page passes (no violations logged).
	const headers = response!.headers();
	expect(headers['x-content-type-options']).toBe('nosniff');
	expect(headers['referrer-policy']).toBeTruthy();
	expect(headers['content-security-policy']).toContain("default-src 'self'");
	expect(errors.filter((e) => /Content Security Policy/i.test(e))).toEqual([]);
	await page.screenshot({ path: 'test-results/home.png', fullPage: true });
});

test('GET /api/health answers { ok: true, db: "up" }', async ({ request }) => {
	const res = await request.get('/api/health');
	expect(res.status()).toBe(200);
	expect(await res.json()).toEqual({ ok: true, db: 'up' });
});
