import { expect, test, type Page } from '@playwright/test';
import { apiAs, signInAs } from './helpers/auth';

async function pickSubstrate(page: Page, typed: string, name: string) {
	await page.getByTestId('substrate-picker').click();
	await page.getByTestId('substrate-picker').fill(typed);
	await page.getByRole('option', { name: new RegExp(name) }).click();
}

test.describe('Window finder, as a chemist', () => {
	test('choose a substrate, switch the wall, share the link, save a plan', async ({ page, context }) => {
		await signInAs(page, 'member');
		await page.goto('/window');
		// Pinewick ester (invented demo substrate) absorbs only below ≈ 290 nm
		await pickSubstrate(page, 'pinewik', 'Pinewick ester');
		await page.getByLabel('Substrate concentration (mol L⁻¹)').fill('0.002');
		await page.locator('select[name="solvent"]').selectOption({ label: 'Acetonitrile (cut-off 190 nm)' });
		await page.getByLabel('Wall material').selectOption({ label: 'Fused silica, UV grade' });
		await page.getByLabel('Wall thickness (mm)').fill('2');
		await page.getByLabel('Volume (mL)').fill('10');
		const windows = page.getByTestId('windows');
		await expect(page.getByTestId('answer')).toHaveAttribute('data-stale', 'false');
		// common practice: fused silica passes UV-C, so a UV-C absorber has a window
		await expect(windows).toContainText(/\d+(\.5)?–\d+(\.5)? nm/);
		const silicaWindows = (await windows.textContent()) ?? '';
		const silicaFirstLamp = (await page.getByTestId('lamp-table').locator('li').first().textContent()) ?? '';
		await page.screenshot({ path: 'test-results/window-fused-silica.png', fullPage: true });

		// common practice: 2 mm borosilicate 3.3 blocks below ≈ 280 nm — no window left
		await page.getByLabel('Wall material').selectOption({ label: 'Borosilicate 3.3 glass, laboratory tubing and flasks' });
		await expect(windows).toContainText('no usable window');
		await expect(page.getByTestId('answer')).toHaveAttribute('data-stale', 'false');
		await expect(page.getByTestId('lamp-table').locator('li').first()).not.toHaveText(silicaFirstLamp);
		// sensitised route: catalysts whose stored triplet energy exceeds the substrate's (238 kJ mol⁻¹, invented demo
		// value) by the default 10 kJ mol⁻¹ margin are suggested; Tidewater Blue (232 kJ mol⁻¹) is not
		const suggestions = page.getByTestId('sensitiser-suggestions');
		await expect(suggestions).toContainText('Saltmarsh ketone sensitiser');
		await expect(suggestions).not.toContainText('Tidewater Blue');
		await page.screenshot({ path: 'test-results/window-borosilicate.png', fullPage: true });

		// back to silica, then share the link into a fresh page: same result
		await page.getByLabel('Wall material').selectOption({ label: 'Fused silica, UV grade' });
		await expect(windows).toHaveText(silicaWindows);
		await page.waitForURL(/wall=/);
		await expect.poll(() => new URL(page.url()).searchParams.get('wall')).not.toBeNull();
		const shared = page.url();
		const other = await context.newPage();
		await other.goto(shared);
		await expect(other.getByTestId('windows')).toHaveText(silicaWindows);
		await expect(other.getByTestId('lamp-table').locator('li').first()).toHaveText(silicaFirstLamp);

		// save as a draft irradiation plan
		await page.getByLabel('Plan title').fill('Pinewick ester under UV-C through silica');
		await page.getByRole('button', { name: 'Save as irradiation plan' }).click();
		await page.getByTestId('save-bar').getByRole('status').getByRole('link').click();
		await expect(page.getByRole('heading', { level: 1, name: 'Pinewick ester under UV-C through silica' })).toBeVisible();
		await expect(page.getByTestId('plan-state')).toHaveText(/^draft$/i);
		await page.screenshot({ path: 'test-results/window-plan.png', fullPage: true });
	});
});

test.describe('POST /api/window', () => {
	test('answers windows, lamps and cautions, and names the field of bad input', async ({ request }) => {
		await apiAs(request, 'viewer');
		const spectra = await (await request.get('/api/spectra?q=Morrow%20enone')).json();
		const enone = spectra.items.find((s: { name: string }) => s.name === 'Morrow enone');
		const solvents = await (await request.get('/api/solvents?q=dichloromethane')).json();
		const materials = await (await request.get('/api/materials')).json();
		const boro = materials.find((m: { slug: string }) => m.slug === 'borosilicate-3.3-tubing');
		const body = { substrate: { spectrumId: enone.id, concentrationM: 0.01 }, solvent: { id: solvents[0].id }, wall: { materialId: boro.id, thicknessMm: 2 }, pathCm: 1, quantumYield: 0.3, volumeL: 0.01 };
		const res = await request.post('/api/window', { data: body });
		expect(res.status()).toBe(200);
		const out = await res.json();
		expect(out.windows.length).toBeGreaterThan(0);
		expect(out.lamps.length).toBeGreaterThan(0);
		for (const l of out.lamps) {
			expect(typeof l.id).toBe('number');
			expect(l.absorbedPhotonFluxEinsteinPerS).toBeGreaterThanOrEqual(0);
			expect(l.selectivity).toBeGreaterThanOrEqual(0);
			expect('timeTo90PctS' in l).toBe(true);
		}
		// ranked by absorbed substrate photon flux
		const flux = out.lamps.map((l: { absorbedPhotonFluxEinsteinPerS: number }) => l.absorbedPhotonFluxEinsteinPerS);
		expect([...flux].sort((a, b) => b - a)).toEqual(flux);
		expect(out.cautions.at(-1).code).toBe('consult-safety-officer');

		const bad = async (patch: object, status: number, field: string) => {
			const r = await request.post('/api/window', { data: { ...body, ...patch } });
			expect(r.status(), JSON.stringify(patch)).toBe(status);
			expect((await r.json()).error.field).toBe(field);
		};
		await bad({ substrate: { spectrumId: enone.id, concentrationM: -1 } }, 422, 'substrate.concentrationM');
		await bad({ pathCm: 0 }, 422, 'pathCm');
		await bad({ solvent: { id: 999999 } }, 422, 'solvent.id');
		await bad({ lamps: [999999] }, 422, 'lamps[0]');
		await bad({ pathCm: 'one' }, 400, 'pathCm');
		const hidden = await request.post('/api/window', { data: { ...body, substrate: { spectrumId: 999999, concentrationM: 0.01 } } });
		expect(hidden.status()).toBe(404);
	});
});
