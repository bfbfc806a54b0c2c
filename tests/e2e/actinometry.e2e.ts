import { expect, test } from '@playwright/test';
import { apiAs, signInAs } from './helpers/auth';
import { windowLink } from './helpers/windowLinks';

const today = new Date().toISOString().slice(0, 10);

test.describe('lamps as measured: actinometry', () => {
	test('a member records a ferrioxalate run from the lamp page; basis, history and the Window finder follow', async ({ page, request }) => {
		test.setTimeout(180_000); // two Window computations and page loads on a shared 2-core machine
		const api = await apiAs(request, 'member');
		const name = `Story LED 365 ${Date.now()}`;
		// invented lamp: 1 W nameplate, coupling guessed at 0.5 — the model basis the run will replace
		const lamp = await (await api.post('/api/lamps', { data: { name, powerW: 1, couplingFactor: 0.5, model: { type: 'led', peakNm: 365, fwhmNm: 10 } } })).json();
		expect(lamp.photonFluxBasis).toBe('model');
		const materials: { id: number; name: string }[] = await (await api.get('/api/materials')).json();
		const silica = materials.find((m) => m.name === 'Fused silica, UV grade')!;
		const enone = (await (await api.get('/api/spectra?q=Morrow%20enone')).json()).items[0];
		const windowBody = { substrate: { spectrumId: enone.id, concentrationM: 0.5 }, solvent: { id: 1 }, wall: { materialId: silica.id, thicknessMm: 1 }, pathCm: 1, lamps: [lamp.id] };
		const before = (await (await api.post('/api/window', { data: windowBody })).json()).lamps[0];

		// the Window finder before the run (stable label/role selectors only)
		await signInAs(page, 'member');
		// a shared link with these inputs (the page renders its answer on the server)
		const link = windowLink({ s: enone.id, c: 0.5, solv: 1, wall: silica.id, d: 1, l: 1, lamps: lamp.id });
		await page.goto(link);
		const row = page.locator(`li.lamp-row[data-lamp-id="${lamp.id}"]`);
		await expect(row).toContainText('model');
		const rowBefore = (await row.textContent()) ?? '';

		// record the run from the lamp page
		await page.goto(`/lamps/${lamp.id}`);
		await expect(page.getByTestId('flux-basis')).toContainText('no calibration');
		await page.getByRole('link', { name: 'Record an actinometry run' }).click();
		await page.getByLabel('Actinometer and strength').selectOption({ label: 'potassium ferrioxalate, 0.006 M (Φ tabulated 253.7–436 nm)' });
		await page.getByLabel('Irradiation time (s)').fill('60');
		await page.getByLabel('Irradiated volume V₁ (mL)').fill('3');
		await page.getByLabel('Aliquot taken V₂ (mL)').fill('0.5');
		await page.getByLabel('Volume after complexation V₃ (mL)').fill('10');
		await page.getByLabel(/ΔA at 510 nm/).fill('0.555');
		await page.getByLabel(/absorbance at the irradiation wavelength/).fill('2');
		await page.getByLabel('Vessel wall').selectOption({ label: 'Fused silica, UV grade' });
		await page.getByLabel('Wall thickness (mm)').fill('1');
		await page.getByLabel('Inner path (cm)').fill('1');
		await page.getByLabel('Operator').first().fill('R. Quill');
		await page.getByRole('button', { name: 'Compute and store the run' }).click();
		// IUPAC 2004 arithmetic: n = 3 × 10 × 0.555/(10³ × 0.5 × 11100) = 3.0e-6 mol, Φ(365) = 1.26 (Lee & Seliger 1964),
		// f = 0.99, t = 60 s → q = 4.008e-8 einstein s⁻¹ = 0.04008 µmol s⁻¹ (a 10 nm LED: Φ within 1 %)
		await expect(page.getByTestId('actinometry-flux')).toHaveText(/^0\.040\d+ µmol s⁻¹$/);
		for (const [w, h] of [[1366, 900], [390, 844]]) {
			await page.setViewportSize({ width: w, height: h });
			await page.screenshot({ path: `test-results/actinometry-${w}.png`, fullPage: true });
		}
		await page.setViewportSize({ width: 1366, height: 900 });
		await page.getByRole('link', { name: /Back to the lamp/ }).click();

		// the lamp's basis and history
		await expect(page.getByTestId('flux-basis')).toHaveText(`actinometry, ${today}, ferrioxalate, 1 mm fused silica, UV grade`);
		await expect(page.getByTestId('calibration-history').locator('tbody tr')).toHaveCount(1);
		await expect(page.getByRole('img', { name: /Calibration history/ })).toBeVisible();
		for (const [w, h] of [[1366, 900], [390, 844]]) {
			await page.setViewportSize({ width: w, height: h });
			await page.screenshot({ path: `test-results/lamp-calibrated-${w}.png`, fullPage: true });
		}
		await page.setViewportSize({ width: 1366, height: 900 });

		// the Window finder's numbers change accordingly
		const after = (await (await api.post('/api/window', { data: windowBody })).json()).lamps[0];
		expect(after.photonFluxBasis).toBe('actinometry');
		// same wall as the calibration: the photons entering the solution are the calibrated flux (the wall applied once)
		expect(after.incidentPhotonFluxEinsteinPerS * (1 - after.shares.wall) / 4.008e-8).toBeGreaterThan(0.99);
		expect(after.incidentPhotonFluxEinsteinPerS * (1 - after.shares.wall) / 4.008e-8).toBeLessThan(1.01);
		expect(after.absorbedPhotonFluxEinsteinPerS).not.toBeCloseTo(before.absorbedPhotonFluxEinsteinPerS, 12);
		await page.goto(link);
		await expect(row).toContainText('actinometry');
		await expect(row).not.toHaveText(rowBefore);

		const history = await (await api.get(`/api/lamps/${lamp.id}/calibrations`)).json();
		expect(history[0]).toMatchObject({ method: 'actinometry', actinometer: 'ferrioxalate', operator: 'R. Quill' });
	});

	test('bad runs name the field and store nothing', async ({ request }) => {
		const api = await apiAs(request, 'member');
		const lamps = await (await api.get('/api/lamps')).json();
		const lampId = (lamps.items ?? lamps)[0].id;
		const n = (await (await api.get(`/api/lamps/${lampId}/calibrations`)).json()).length;
		const base = { lampId, actinometer: 'ferrioxalate', concentrationM: 0.006, irradiatedVolumeMl: 3, aliquotVolumeMl: 0.5, finalVolumeMl: 10, deltaAbsorbance: 0.5, irradiationTimeS: 60, vessel: { materialId: 1, thicknessMm: 1, pathCm: 1 } };
		for (const [over, field] of [[{ irradiationTimeS: 0 }, 'irradiationTimeS'], [{ deltaAbsorbance: 3 }, 'deltaAbsorbance'], [{ finalVolumeMl: 0.1 }, 'finalVolumeMl']] as const) {
			const r = await api.post('/api/actinometry', { data: { ...base, ...over } });
			expect(r.status()).toBe(422);
			expect((await r.json()).error.field).toBe(field);
		}
		expect((await (await api.get(`/api/lamps/${lampId}/calibrations`)).json()).length).toBe(n);
		const list = await (await api.get('/api/actinometers')).json();
		expect(list.map((a: { id: string }) => a.id)).toEqual(['ferrioxalate', 'reinecke']);
	});
});

test.describe('lamp from a raw-count emission file', () => {
	test('the preview removes the dark floor by default and offers to keep it; no UV-C caution', async ({ page }) => {
		test.setTimeout(120_000);
		await signInAs(page, 'member');
		const { readFileSync } = await import('node:fs');
		const { resolve } = await import('node:path');
		// ../shared/external/emission/led-405nm-spectrometer-raw-counts.txt (aphalo/photobiologyLEDs, GPL ≥ 2; MANIFEST.md):
		// raw counts without dark subtraction, median baseline 4525 counts, peak 61870 counts at 408.32 nm
		const file = readFileSync(resolve(process.cwd(), '../shared/external/emission/led-405nm-spectrometer-raw-counts.txt'));
		const spectrumName = `Raw-count 405 nm LED ${Date.now()}`;
		const up = await page.request.post('/api/spectra', {
			multipart: { file: { name: 'led-405nm-spectrometer-raw-counts.txt', mimeType: 'text/plain', buffer: file }, metadata: JSON.stringify({ kind: 'emission', yUnit: 'counts', xUnit: 'nm', name: spectrumName }) }
		});
		// the same file may already be in the group's Library (another story uploads it): then use that spectrum
		expect([201, 409]).toContain(up.status());
		const upBody = await up.json();
		const id: number = up.status() === 201 ? upBody.items[0].id : upBody.error.existingId;
		const pickName: string = up.status() === 201 ? spectrumName : (await (await page.request.get(`/api/spectra/${id}`)).json()).name;
		await page.goto('/lamps/new');
		await page.getByLabel('Name').fill(`Strip from raw counts ${Date.now()}`);
		await page.getByLabel('Emission model').selectOption('spectrum');
		await page.getByLabel('Optical power (W)').fill('1.6');
		// the emission spectrum is chosen with the Library picker (a combobox that searches as one types)
		await page.getByTestId('lamp-spectrum-choice').fill(pickName);
		await page.getByRole('option', { name: new RegExp(pickName.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')) }).first().click();
		expect(id).toBeGreaterThan(0);
		await page.getByRole('button', { name: 'Preview' }).click();
		const preview = page.getByRole('region', { name: 'Preview' });
		await expect(preview.getByTestId('preview-emission')).toContainText('dark floor');
		await expect(preview.getByTestId('preview-emission')).toContainText('removed');
		await expect(preview.locator('[data-caution="uv-c"]')).toHaveCount(0);
		await expect(preview.locator('[data-caution="blue-light"]')).toHaveCount(1);
		await page.screenshot({ path: 'test-results/lamp-preview-raw-counts-1366.png', fullPage: true });
		await page.getByLabel('Dark floor (raw detector counts)').selectOption('keep');
		await page.getByRole('button', { name: 'Preview' }).click();
		await expect(preview.getByTestId('preview-emission')).toContainText('kept and counted as light');
		await expect(preview.locator('[data-caution="uv-c"]')).toHaveCount(1);
	});
});
