import { readFileSync } from 'node:fs';
import path from 'node:path';
import { expect, test, type APIRequestContext } from '@playwright/test';
import { apiAs, baseURL } from './helpers/auth';

test.describe('reference look-ups', () => {
	test('a newcomer finds acetonitrile’s cut-off by typing "aceto", with its source', async ({ page }) => {
		await page.goto('/reference/solvents');
		await page.getByPlaceholder(/name, abbreviation or CAS/).fill('aceto');
		const row = page.locator('tr[data-solvent="acetonitrile"]');
		await expect(row).toBeVisible();
		// common practice (supplier guide, REFERENCE.md §1): acetonitrile cut-off 190 nm
		await expect(row.locator('td').nth(1)).toHaveText('190');
		await expect(row).toContainText('solvent-supplier high-purity solvent guide');
		await page.getByLabel('My wavelength (nm)').fill('254');
		await page.getByLabel('Path (cm)').fill('1');
		// edge model: A(254) = 10^((190 − 254)/10) ≈ 4e-7 → T = 99.99991 %, shown as "> 99.9 %" (the site formatter never rounds up to 100 %)
		await expect(row.locator('td').nth(2)).toHaveText('> 99.9 %');
		await page.screenshot({ path: 'test-results/reference-solvents.png', fullPage: true });
	});

	test('a chemist sets 2 mm borosilicate 3.3 tubing and reads the transmission at 300 nm', async ({ page }) => {
		await page.goto('/reference/materials');
		await page.getByLabel('Material').selectOption({ label: 'Borosilicate 3.3 glass, laboratory tubing and flasks' });
		await page.getByLabel('Thickness (mm)').fill('2');
		await page.getByLabel('Read at (nm)').fill('300');
		const sentence = page.getByTestId('transmission-sentence');
		// REFERENCE.md §2.3 [computed]: internal T(2 mm, 300 nm) = 0.30; with (1 − R)² ≈ 0.93 for n ≈ 1.47 → ≈ 28 %
		await expect(sentence).toHaveText(/At 300 nm, 2\.0 mm borosilicate 3\.3 glass, laboratory tubing and flasks transmits 2[6-9] %\./);
		await expect(page.getByText(/Source: refractiveindex\.info database/)).toBeVisible();
		await page.screenshot({ path: 'test-results/reference-materials.png', fullPage: true });
	});
});

test.describe('reference API', () => {
	test('GET /api/solvents?q= answers the API.md shape with sources', async ({ request }) => {
		const res = await request.get('/api/solvents?q=aceto');
		expect(res.status()).toBe(200);
		const list = await res.json();
		const mecn = list.find((s: { name: string }) => s.name === 'Acetonitrile');
		expect(mecn).toMatchObject({ cutoffNm: 190 });
		expect(typeof mecn.id).toBe('number');
		expect(mecn.source).toBeTruthy();
		const all = await (await request.get('/api/solvents')).json();
		expect(all.length).toBeGreaterThanOrEqual(35);
	});

	test('GET /api/materials/:id/transmission follows the thickness and refuses bad input', async ({ request }) => {
		const materials = await (await request.get('/api/materials')).json();
		for (const m of materials) expect(m.source).toBeTruthy();
		const silica = materials.find((m: { slug: string }) => m.slug === 'fused-silica-uv-grade');
		const tubing = materials.find((m: { slug: string }) => m.slug === 'borosilicate-3.3-tubing');
		const thin = await (await request.get(`/api/materials/${tubing.id}/transmission?thicknessMm=1`)).json();
		const thick = await (await request.get(`/api/materials/${tubing.id}/transmission?thicknessMm=3`)).json();
		const at = (c: { x: number[]; y: number[] }, nm: number) => c.y[c.x.indexOf(nm)];
		// Beer–Lambert: the internal part scales as T_int(d) = T_int(d₀)^(d/d₀); the Fresnel factor stays
		const n = tubing.refractiveIndex;
		const fresnel = (1 - ((n - 1) / (n + 1)) ** 2) ** 2;
		expect(at(thick, 300) / fresnel).toBeCloseTo((at(thin, 300) / fresnel) ** 3, 3);
		// common practice: ordinary borosilicate walls block most light below ≈ 280 nm and pass 365 nm
		expect(at(thick, 270)).toBeLessThan(0.1);
		expect(at(thin, 365)).toBeGreaterThan(0.85);
		expect(thick.cutoff10Nm).toBeGreaterThan(thin.cutoff10Nm);
		// fused silica, UV grade: MANIFEST internal T(1 mm, 254 nm) = 0.9988; total ≈ 0.93 after two faces
		const silica1 = await (await request.get(`/api/materials/${silica.id}/transmission?thicknessMm=1`)).json();
		expect(at(silica1, 254)).toBeGreaterThan(0.9);
		expect((await request.get(`/api/materials/${tubing.id}/transmission?thicknessMm=abc`)).status()).toBe(400);
		expect((await request.get(`/api/materials/${tubing.id}/transmission?thicknessMm=-2`)).status()).toBe(422);
		expect((await request.get('/api/materials/999999/transmission')).status()).toBe(404);
	});
});

test.describe('the group’s own wall and lamp from measured files', () => {
	const external = (p: string) => readFileSync(path.resolve(process.cwd(), '../shared/external', p));
	/** Uploads a file as the member (or finds it again when an earlier run stored it: 409 names it). */
	async function upload(request: APIRequestContext, file: string, metadata: object): Promise<number> {
		const r = await request.post('/api/spectra', {
			multipart: { file: { name: path.basename(file), mimeType: 'text/plain', buffer: external(file) }, metadata: JSON.stringify(metadata) },
			headers: { origin: baseURL() }
		});
		const body = await r.json();
		if (r.status() === 409) return body.error.existingId;
		expect(r.status(), JSON.stringify(body)).toBe(201);
		return body.items[0].id;
	}

	test('a wall material from a measured %T curve scales with thickness (Beer–Lambert with Fresnel)', async ({ request }) => {
		await apiAs(request, 'member');
		// glass Petri dish %T, aphalo/photobiologyFilters (MANIFEST): %T(300) = 9.01, %T(365) = 89.21
		const id = await upload(request, 'transmission/glass-petri-dish.csv', { kind: 'transmission', part: 'wall', visibility: 'group' });
		const created = await request.post('/api/materials', { data: { name: `Petri dish glass ${Date.now()}`, spectrumId: id, thicknessMm: 1.5, refractiveIndex: 1.52 } });
		expect(created.status()).toBe(201);
		const m = await created.json();
		const at = (c: { x: number[]; y: number[] }, nm: number) => c.y[c.x.indexOf(nm)];
		const same = await (await request.get(`/api/materials/${m.id}/transmission?thicknessMm=1.5`)).json();
		const double = await (await request.get(`/api/materials/${m.id}/transmission?thicknessMm=3`)).json();
		// at its own thickness the measured curve comes back (MANIFEST: %T(300) = 9.01)
		expect(at(same, 300)).toBeCloseTo(0.0901, 3);
		// PRODUCT.md: T(d) = (1 − R)²·(T₀/(1 − R)²)^(d/d₀), R = ((n − 1)/(n + 1))², worked by hand for n = 1.52, d = 2·d₀
		const fresnel = (1 - ((1.52 - 1) / (1.52 + 1)) ** 2) ** 2;
		expect(at(double, 300)).toBeCloseTo(fresnel * (0.0901 / fresnel) ** 2, 4);
		expect(at(double, 365)).toBeCloseTo(fresnel * (0.8921 / fresnel) ** 2, 3);
		// a spectrum that is not a transmission spectrum is refused with the field named
		const wrong = await request.post('/api/materials', { data: { name: 'not a wall', spectrumId: 1, thicknessMm: 1 } });
		expect(wrong.status()).toBe(422);
		expect((await wrong.json()).error.field).toBe('spectrumId');
	});

	test('a lamp from a measured emission spectrum peaks where the file does', async ({ request }) => {
		await apiAs(request, 'member');
		// LED 405 nm spectrometer export, aphalo/photobiologyLEDs (MANIFEST): peak 61870 counts at 408.32 nm
		const id = await upload(request, 'emission/led-405nm-spectrometer-raw-counts.txt', { kind: 'emission', part: 'lamp', visibility: 'group' });
		const r = await request.post('/api/lamps', { data: { name: `Measured 405 LED ${Date.now()}`, powerW: 0.5, model: { type: 'spectrum', spectrumId: id } } });
		expect(r.status()).toBe(201);
		const lamp = await r.json();
		// the file's raw counts carry a baseline; the peak still sits at 408.3 nm (± one 0.5 nm grid step)
		expect(Math.abs(lamp.peakNm - 408.32)).toBeLessThanOrEqual(0.5);
		expect(lamp.photonFluxEinsteinPerS).toBeGreaterThan(0);
		// MANIFEST: raw counts, no dark subtraction (median baseline 4525 of 61870 counts) — the floor is removed by
		// default for raw counts (issue: a dark floor is not light) and the lamp says so
		expect(lamp.emission.floor.removed).toBe(true);
		expect(lamp.emission.floor.level).toBeGreaterThan(0);
	});
});
