import { expect, test } from '@playwright/test';
import { apiAs, signInAs } from './helpers/auth';

test.describe('the group’s lamps', () => {
	test('a member adds a 365 nm LED and sees its photon flux, plot and UV-A caution', async ({ page }) => {
		await signInAs(page, 'member');
		await page.goto('/lamps');
		await page.getByRole('link', { name: 'Add a lamp' }).click();
		const name = `Test LED 365 ${Date.now()}`;
		await page.getByLabel('Name').fill(name);
		await page.getByLabel('Emission model').selectOption('led');
		await page.getByLabel('Optical power (W)').fill('1');
		await page.getByLabel('Peak (nm)').fill('365');
		await page.getByLabel('FWHM (nm)').fill('10');
		await page.getByLabel('Where people work: distance from the lamp (cm)').fill('50');
		await page.getByRole('button', { name: 'Save lamp' }).click();
		await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();
		// CODATA 2018: 1 W at 365 nm = 3.0512 µmol s⁻¹ (REFERENCE.md §4); a 10 nm wide Gaussian LED shifts it by < 0.1 %
		await expect(page.getByTestId('photon-flux')).toHaveText(/^3\.05\d* µmol s⁻¹$/);
		await expect(page.locator('[data-caution="uv-a"]')).toBeVisible();
		await expect(page.locator('[data-caution="uv-c"]')).toHaveCount(0);
		await expect(page.locator('[data-caution="consult-safety-officer"]')).toContainText('safety officer');
		// 1 W on a Lambertian emitter's axis at 50 cm: E = 1/(π·0.5²) = 1.27 W m⁻² (common practice geometry)
		await expect(page.getByTestId('exposure-irradiance')).toContainText('1.27 W m⁻²');
		await expect(page.locator('[data-caution="exposure-at-distance"]')).toContainText('At 50 cm the lamp gives 1.27 W m⁻² (model: Lambertian emitter');
		await expect(page.locator('[data-caution="exposure-at-distance"]')).toContainText('below the 10 W m⁻² limit for long exposures');
		await page.screenshot({ path: 'test-results/lamp-detail.png', fullPage: true });
	});

	test('a low-pressure mercury lamp carries the UV-C caution', async ({ page }) => {
		await signInAs(page, 'lead');
		await page.goto('/lamps');
		await page.getByRole('link', { name: 'Low-pressure mercury pencil (ozone-free)' }).click();
		await expect(page.locator('[data-caution="uv-c"]')).toBeVisible();
		// an ozone-free envelope removes the 185 nm line: no ozone note (REFERENCE.md §7)
		await expect(page.locator('[data-caution="ozone"]')).toHaveCount(0);
		await page.screenshot({ path: 'test-results/lamps-mercury.png', fullPage: true });
	});
});

test.describe('/api/lamps', () => {
	test('create, read, conflict and validation', async ({ request }) => {
		await apiAs(request, 'member');
		const created = await request.post('/api/lamps', { data: { name: `API LED 450 ${Date.now()}`, powerW: 1, model: { type: 'led', peakNm: 450, fwhmNm: 0.5 } } });
		expect(created.status()).toBe(201);
		const lamp = await created.json();
		expect(lamp.peakNm).toBe(450);
		// CODATA 2018: 1 W at 450 nm = 3.7617 µmol s⁻¹ (REFERENCE.md §4); a 0.5 nm line is effectively monochromatic
		expect(lamp.photonFluxEinsteinPerS * 1e6).toBeCloseTo(3.7617, 3);
		expect((await request.get(`/api/lamps/${lamp.id}`)).status()).toBe(200);
		const first = await request.patch(`/api/lamps/${lamp.id}`, { data: { powerW: 2, version: lamp.version } });
		expect(first.status()).toBe(200);
		const stale = await request.patch(`/api/lamps/${lamp.id}`, { data: { powerW: 3, version: lamp.version } });
		expect(stale.status()).toBe(409);
		const bad = await request.post('/api/lamps', { data: { name: 'Bad LED', powerW: -1, model: { type: 'led', peakNm: 450, fwhmNm: 20 } } });
		expect(bad.status()).toBe(400);
		expect((await bad.json()).error.field).toBe('powerW');
		const badModel = await request.post('/api/lamps', { data: { name: 'Bad model', powerW: 1, model: { type: 'led', peakNm: 450 } } });
		expect(badModel.status()).toBe(400);
		expect((await badModel.json()).error.field).toBe('model.fwhmNm');
	});

	test('viewers read but cannot add; other groups see a 404', async ({ playwright, baseURL }) => {
		const viewer = await apiAs(await playwright.request.newContext({ baseURL }), 'viewer');
		const list = await (await viewer.get('/api/lamps')).json();
		expect(list.length).toBeGreaterThan(0);
		expect((await viewer.post('/api/lamps', { data: { name: 'Viewer lamp', powerW: 1, model: { type: 'laser', lineNm: 532 } } })).status()).toBe(403);
		const outsider = await apiAs(await playwright.request.newContext({ baseURL }), 'outsider');
		expect((await outsider.get(`/api/lamps/${list[0].id}`)).status()).toBe(404);
		await viewer.dispose();
		await outsider.dispose();
	});
});
