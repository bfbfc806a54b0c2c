/**
 * Library data you can trust, in the browser and over the API: longest-wavelength bands, cut-offs outside the data,
 * measured solvent spectra in the planner, exact CAS look-ups, reference status badges. Demo spectra are invented
 * (seeds/03_demo_spectra.ts); reference values and their sources: ../shared/REFERENCE.md and MANIFEST.md.
 */
import { expect, test } from '@playwright/test';
import { apiAs, signInAs } from './helpers/auth';

const shot = (name: string) => `test-results/${name}.png`;

test.describe('reference pages', () => {
	for (const width of [1366, 390]) {
		test(`solvents: status badges with explanations, exact CAS look-up, measured links (${width} px)`, async ({ page }) => {
			await page.setViewportSize({ width, height: 900 });
			await page.goto('/reference/solvents');
			const mecn = page.locator('tr[data-solvent="acetonitrile"]');
			// REFERENCE.md third check: acetonitrile 190 nm read in two published detector-maker tables → verified
			await expect(mecn.locator('[data-status]')).toHaveText('verified');
			await expect(mecn.locator('[data-status]')).toHaveAttribute('title', /read in the published source/);
			await expect(mecn.getByTestId('measured-link')).toContainText('Acetonitrile, neat (1 cm)');
			await page.screenshot({ path: shot(`reference-solvents-${width}`), fullPage: width === 1366 });
			const box = page.getByPlaceholder(/name, abbreviation or CAS/);
			await box.fill('75-05-8');
			await expect(page.locator('tbody tr')).toHaveCount(1);
			await expect(mecn).toBeVisible();
			// 999-99-9: 9×1+9×2+9×3+9×4+9×5 = 135 → check digit 5, so not a CAS number (never "close to" THF 109-99-9)
			await box.fill('999-99-9');
			await expect(page.getByRole('alert')).toContainText('check digit should be 5');
			await expect(page.locator('tr[data-solvent="tetrahydrofuran"]')).toHaveCount(0);
		});

		test(`materials: a crown-glass cut-off below its data range is "—" with the note (${width} px)`, async ({ page }) => {
			await page.setViewportSize({ width, height: 900 });
			await page.goto('/reference/materials?material=borosilicate-crown&thicknessMm=3&at=320');
			// MANIFEST: crown-glass k data start at 300 nm; internal T(1 mm, 300 nm) = 0.887 → T(3 mm) ≈ 64 % with Fresnel
			await expect(page.getByTestId('cutoff50')).toHaveText('—');
			await expect(page.getByText(/below the data range, T\(300 nm\) = 6\d %/).first()).toBeVisible();
			await expect(page.locator('[data-status]').first()).toHaveText('computed');
			await page.screenshot({ path: shot(`reference-materials-crown-${width}`), fullPage: width === 1366 });
		});
	}
});

test.describe('spectrum pages', () => {
	for (const width of [1366, 390]) {
		test(`an enone shows its n→π* band as the longest-wavelength band, beside λmax (${width} px)`, async ({ page, request }) => {
			await signInAs(page, 'member');
			await apiAs(request, 'member');
			const list = await (await request.get('/api/spectra?q=Morrow%20enone')).json();
			const enone = list.items.find((s: { name: string }) => s.name === 'Morrow enone');
			// invented demo band: n→π* 0–0 at 372 nm (ε 10–100 for n→π*, common practice); λmax is the π→π* band
			expect(Math.abs(enone.longestWavelengthBandNm - 372)).toBeLessThanOrEqual(2);
			expect(enone.lambdaMaxNm).toBeLessThan(260);
			await page.setViewportSize({ width, height: 900 });
			await page.goto(`/library/${enone.id}`);
			await expect(page.getByTestId('longest-band')).toContainText(/37\d\.\d nm, ε \d\d M⁻¹ cm⁻¹/);
			await page.screenshot({ path: shot(`spectrum-enone-${width}`), fullPage: width === 1366 });
			// the Library list and the Window finder's picker show the longest band beside λmax
			await page.goto('/library?q=Morrow%20enone');
			const row = page.getByTestId('library-table').locator('tr', { has: page.getByRole('link', { name: 'Morrow enone', exact: true }) });
			await expect(row.getByTestId('longest-band')).toHaveText(/^37\d\.\d$/);
			await page.goto('/window');
			await page.getByTestId('substrate-picker').fill('Morrow enone');
			await expect(page.getByRole('option', { name: /Morrow enone/ }).first()).toContainText(/λmax \d+ nm · longest band 37\d nm/);
		});
	}

	test('a neat solvent found by its CAS number: its saturated stretch is listed and the page says the planner uses it', async ({ page, request }) => {
		await signInAs(page, 'member');
		await apiAs(request, 'member');
		// CAS 67-64-1 = acetone (CAS Registry; check digit 6×7+7×6+6×5+4×4+… verified by the formula)
		const list = await (await request.get('/api/spectra?q=67-64-1')).json();
		expect(list.items.map((s: { name: string }) => s.name)).toEqual(['Acetone, neat (1 cm)']);
		const acetone = list.items[0];
		expect(acetone.excludedRanges.some((e: { reason: string }) => e.reason === 'saturated')).toBe(true);
		await page.setViewportSize({ width: 1366, height: 900 });
		await page.goto(`/library/${acetone.id}`);
		await expect(page.getByTestId('excluded-ranges')).toContainText('saturated');
		await expect(page.getByTestId('linked-solvents')).toContainText('Acetone');
		await page.screenshot({ path: shot('spectrum-acetone-neat-1366'), fullPage: true });
		expect((await request.get('/api/spectra?q=999-99-9')).status()).toBe(400);
	});
});

test.describe('API', () => {
	test('cut-offs outside the data are null with a note; silica and crown glass', async ({ request }) => {
		const materials = await (await request.get('/api/materials')).json();
		const crown = materials.find((m: { slug: string }) => m.slug === 'borosilicate-crown');
		const silica = materials.find((m: { slug: string }) => m.slug === 'fused-silica-uv-grade');
		const c = await (await request.get(`/api/materials/${crown.id}/transmission?thicknessMm=3`)).json();
		expect(c.cutoff10Nm).toBeNull();
		expect(c.cutoff50Nm).toBeNull();
		expect(c.cutoff50Note).toMatch(/^below the data range, T\(300 nm\) = /);
		// REFERENCE.md §2.3: UV-grade fused silica transmits below 190 nm — never "190"
		const s = await (await request.get(`/api/materials/${silica.id}/transmission?thicknessMm=2`)).json();
		expect(s.cutoff10Nm).toBeNull();
		expect(s.cutoff50Note).toMatch(/^below the data range/);
	});

	test('the planner answers which solvent curve it used: measured for the demo acetonitrile, edge model for methanol', async ({ request }) => {
		await apiAs(request, 'viewer');
		const spectra = await (await request.get('/api/spectra?q=Tidewater')).json();
		const cat = spectra.items.find((x: { name: string }) => x.name === 'Tidewater Blue (TWB-7)');
		const [mecn] = await (await request.get('/api/solvents?q=75-05-8')).json();
		const [meoh] = await (await request.get('/api/solvents?q=67-56-1')).json();
		const materials = await (await request.get('/api/materials')).json();
		const boro = materials.find((m: { slug: string }) => m.slug === 'borosilicate-3.3-tubing');
		const body = (id: number) => ({ substrate: { spectrumId: cat.id, concentrationM: 1e-4 }, solvent: { id }, wall: { materialId: boro.id, thicknessMm: 2 }, pathCm: 1 });
		const a = await (await request.post('/api/window', { data: body(mecn.id) })).json();
		expect(a.solvent).toMatchObject({ basis: 'measured', spectrumId: mecn.spectrumId, spectrumName: 'Acetonitrile, neat (1 cm)' });
		const b = await (await request.post('/api/window', { data: body(meoh.id) })).json();
		expect(b.solvent).toMatchObject({ basis: 'edge model', spectrumId: null });
	});
});
