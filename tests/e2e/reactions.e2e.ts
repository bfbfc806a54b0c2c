import { expect, test } from '@playwright/test';
import { apiAs, signInAs } from './helpers/auth';

/** Demo spectra and walls by name (invented demo scenario). */
async function ids(request: import('@playwright/test').APIRequestContext) {
	const find = async (q: string, name: string) => {
		const r = await (await request.get(`/api/spectra?q=${encodeURIComponent(q)}&limit=50`)).json();
		const s = r.items.find((x: { name: string }) => x.name === name);
		expect(s, name).toBeTruthy();
		return s.id as number;
	};
	const solvents = await (await request.get('/api/solvents?q=acetonitrile')).json();
	const methanol = await (await request.get('/api/solvents?q=methanol')).json();
	const materials = await (await request.get('/api/materials')).json();
	return {
		find,
		acetonitrile: solvents[0].id as number,
		methanol: methanol[0].id as number,
		boro: materials.find((m: { slug: string }) => m.slug === 'borosilicate-3.3-tubing').id as number,
		silica: materials.find((m: { slug: string }) => m.slug === 'fused-silica-uv-grade').id as number
	};
}

test.describe('POST /api/window reaction modes (API, as a chemist)', () => {
	test('a blue photoredox mixture ranks the 450 nm LED first; an E/Z pair shows its PSS and 90 % not reachable', async ({ request }) => {
		await apiAs(request, 'viewer');
		const k = await ids(request);
		const aryl = await k.find('Calder', 'Calder aryl bromide');
		const blue = await k.find('Tidewater', 'Tidewater Blue (TWB-7)');
		// with a dihydropyridine reductant (absorbs up to ≈ 400 nm), as a photoredox run is set up (invented demo spectra)
		const reductant = await k.find('Tarrow', 'Tarrow dihydropyridine');
		const base = { substrate: { spectrumId: aryl, concentrationM: 0.05 }, others: [{ spectrumId: reductant, concentrationM: 0.1 }], solvent: { id: k.acetonitrile }, wall: { materialId: k.boro, thicknessMm: 2 }, pathCm: 1, quantumYield: 0.5, volumeL: 0.005 };
		const pc = await (await request.post('/api/window', { data: { ...base, reaction: { type: 'photocatalytic', photocatalyst: { spectrumId: blue, concentrationM: 0.001 } } } })).json();
		expect(pc.lamps[0].name).toMatch(/450/);
		expect(pc.lamps[0].absorbedByIntendedEinsteinPerS).toBeGreaterThan(0);
		expect(pc.wallTransmissionAtBandMaximum.wavelengthNm).toBeGreaterThan(440);
		expect(pc.explanation[0]).toMatch(/^At its band maximum \(\d+(\.5)? nm\) the wall passes \d+ %/);
		// the old way (catalyst as a competitor in direct mode) does not put the blue LED first
		const old = await (await request.post('/api/window', { data: { ...base, others: [...base.others, { spectrumId: blue, concentrationM: 0.001 }] } })).json();
		expect(old.lamps[0].name).not.toMatch(/450/);

		const e = await k.find('Dunmore', 'Dunmore cinnamate');
		const z = await k.find('Dunmore', 'Dunmore cinnamate (Z isomer)');
		const rev = await (await request.post('/api/window', { data: { ...base, substrate: { spectrumId: e, concentrationM: 1e-4 }, solvent: { id: k.methanol }, wall: { materialId: k.silica, thicknessMm: 1 }, quantumYield: 0.3, reaction: { type: 'reversible', product: { spectrumId: z }, quantumYieldBack: 0.3 } } })).json();
		const limited = rev.lamps.filter((l: { photostationaryProductFraction: number | null; timeTo90PctS: number | null }) => l.photostationaryProductFraction !== null && l.photostationaryProductFraction < 0.9);
		expect(limited.length).toBeGreaterThan(0);
		expect(limited[0].timeTo90PctS).toBeNull();
		expect(limited[0].unreachableReason).toMatch(/photostationary state holds/);
		expect(rev.photostationaryCurve.wavelengthNm.length).toBeGreaterThan(10);

		const bad = async (patch: object, status: number, field: string) => {
			const r = await request.post('/api/window', { data: { ...base, ...patch } });
			expect(r.status(), JSON.stringify(patch)).toBe(status);
			expect((await r.json()).error.field).toBe(field);
		};
		await bad({ quantumYield: 0 }, 422, 'quantumYield');
		await bad({ quantumYield: 20000 }, 422, 'quantumYield');
		await bad({ vessel: { shape: 'cylinder', innerDiameterCm: -1 } }, 422, 'vessel.innerDiameterCm');
		await bad({ vessel: { shape: 'annulus', innerDiameterCm: 4, outerDiameterCm: 3 } }, 422, 'vessel.outerDiameterCm');
		await bad({ reaction: { type: 'reversible', quantumYieldBack: 0.2 } }, 400, 'reaction.product');
	});
});

/** A rows-per-wavelength CSV with one absorbance column per time (invented series: first-order decay, τ = 120 s). */
function seriesCsv(nonce: number) {
	const times = [0, 30, 60, 120, 180, 240, 360, 480];
	const eps = (x: number) => 5200 * Math.exp(-0.5 * ((x - 362) / 38) ** 2);
	const rows = [['wavelength (nm)', ...times.map((t) => `t = ${t} s`)].join(',')];
	for (let x = 260; x <= 600; x++) rows.push([x, ...times.map((t) => (eps(x) * 1.2e-4 * Math.exp(-t / 120) + (x === 260 ? nonce * 1e-9 : 0)).toPrecision(7))].join(','));
	const molar = ['wavelength (nm),epsilon (M-1 cm-1)'];
	for (let x = 260; x <= 600; x++) molar.push(`${x},${(eps(x) + (x === 260 ? nonce * 1e-6 : 0)).toPrecision(8)}`);
	return { series: rows.join('\n') + '\n', molar: molar.join('\n') + '\n' };
}

test.describe('Quantum yield from a series (Library)', () => {
	test('upload a series, compute Φ, store it, and the API offers it on the reactant', async ({ page }) => {
		await signInAs(page, 'member');
		await page.goto('/library');
		const origin = new URL(page.url()).origin;
		const nonce = Date.now() % 100000;
		const { series, molar } = seriesCsv(nonce);
		const up = async (name: string, text: string, metadata: object) => {
			const r = await page.request.post('/api/spectra', { multipart: { file: { name, mimeType: 'text/csv', buffer: Buffer.from(text) }, metadata: JSON.stringify(metadata) }, headers: { origin } });
			expect(r.status(), await r.text()).toBe(201);
			return (await r.json()).items;
		};
		const reactant = (await up(`e2e-qy-reactant-${nonce}.csv`, molar, { name: `Brackwater enol ether ${nonce}`, part: 'substrate', yUnit: 'epsilon' }))[0];
		const items = await up(`e2e-qy-series-${nonce}.csv`, series, { part: 'substrate', yUnit: 'absorbance', pathCm: 1 });
		expect(items).toHaveLength(8);

		await page.getByTestId('quantum-yield-link').click();
		await expect(page.getByRole('heading', { level: 1 })).toHaveText('Quantum yield from an irradiation series');
		const option = page.getByTestId('qy-series').locator('option', { hasText: `e2e-qy-series-${nonce}` });
		await page.getByTestId('qy-series').selectOption({ label: (await option.textContent())!.trim() });
		// times come from the column headers, the cell path from the upload's metadata (pathCm: 1)
		await expect(page.getByTestId('qy-times').locator('input').nth(3)).toHaveValue('120');
		await expect(page.getByTestId('qy-path')).toHaveValue('1');
		await expect(page.getByText('as stated in the upload')).toBeVisible();
		// take the last spectrum out and add it back with the Library picker (a series can be edited)
		const last = items[7];
		const esc = (t: string) => t.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
		await page.getByTestId('qy-times').getByRole('button', { name: /remove .*480 s/ }).click();
		await expect(page.getByTestId('qy-times').locator('tbody tr')).toHaveCount(7);
		await page.getByTestId('qy-add').click();
		await page.getByTestId('qy-add').fill(last.name);
		await page.getByRole('option', { name: new RegExp(`^${esc(last.name)}`) }).first().click();
		await expect(page.getByTestId('qy-times').locator('tbody tr')).toHaveCount(8);
		await expect(page.getByTestId('qy-times').locator('input').nth(7)).toHaveValue('480');
		// the reactant is found by searching the Library as one types (the page never carries the whole Library)
		await page.getByTestId('qy-reactant').click();
		await page.getByTestId('qy-reactant').fill(`Brackwater enol ether ${nonce}`);
		const pick = page.getByRole('option', { name: new RegExp(`Brackwater enol ether ${nonce}`) }).first();
		await expect(pick).toContainText(/longest band 36\d nm/);
		await pick.click();
		await expect(page.getByTestId('qy-reactant')).toHaveValue(reactant.name);
		// a measured absorbance spectrum is no reactant: the field says why
		await page.getByTestId('qy-product').click();
		await page.getByTestId('qy-product').fill(items[0].name);
		await page.getByRole('option', { name: new RegExp(`^${esc(items[0].name)}`) }).first().click();
		await expect(page.getByText('the fit needs the molar spectrum')).toBeVisible();
		// the product is optional: emptying the field un-picks it
		await page.getByTestId('qy-product').fill('');
		await page.getByTestId('qy-product').press('Escape');
		await expect(page.getByText('the fit needs the molar spectrum')).toHaveCount(0);
		await page.getByTestId('qy-lamp').selectOption({ label: 'Bench LED 365 (array A)' });
		await page.getByTestId('qy-wall').selectOption({ label: 'Fused silica, UV grade' });
		await page.getByTestId('qy-compute').click();
		await expect(page.getByTestId('qy-phi')).toContainText(/Φ = [\d.e+-]+ ± [\d.e+-]+/);
		await expect(page.getByTestId('qy-result')).toContainText('Φ rests on the lamp model');
		await expect(page.getByTestId('qy-methods')).toContainText(`The quantum yield of ${reactant.name} was determined from 8 UV–vis absorption spectra`);
		await expect(page.getByTestId('qy-residuals').locator('tbody tr')).toHaveCount(8);
		await page.setViewportSize({ width: 1366, height: 900 });
		await page.screenshot({ path: 'test-results/quantum-yield-1366.png', fullPage: true });
		await page.setViewportSize({ width: 390, height: 844 });
		await page.screenshot({ path: 'test-results/quantum-yield-390.png', fullPage: true });
		await page.setViewportSize({ width: 1366, height: 900 });
		await page.getByTestId('qy-save').click();
		await expect(page.getByTestId('qy-saved')).toContainText('the Window finder offers it');

		const detail = await (await page.request.get(`/api/spectra/${reactant.id}`)).json();
		expect(detail.measuredQuantumYields).toHaveLength(1);
		expect(detail.measuredQuantumYields[0].quantumYield).toBeGreaterThan(0);
		expect(detail.measuredQuantumYields[0].lampName).toBe('Bench LED 365 (array A)');

		// the Window finder offers the stored Φ for this substrate and fills it in on request
		const stored = detail.measuredQuantumYields[0];
		await page.goto(`/window?s=${reactant.id}`);
		const offer = page.getByTestId('measured-phi');
		// house number style (src/lib/format.ts formatSig): small values as "5.77 × 10⁻⁴"
		await expect(offer).toContainText(/Measured Φ = [\d.]+( × 10[⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+)? ± [\d.]+( × 10[⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+)?/);
		await expect(offer).toContainText('Bench LED 365 (array A)');
		await expect(offer).toContainText('irradiation series');
		await offer.getByRole('button').first().click();
		await expect(page.locator('input[name="quantumYield"]')).toHaveValue(String(Number(stored.quantumYield.toPrecision(3))));
		await expect(offer).toContainText('Φ filled in from this measurement');
		await page.screenshot({ path: 'test-results/window-measured-phi-1366.png', fullPage: true });
		await page.setViewportSize({ width: 390, height: 844 });
		await page.screenshot({ path: 'test-results/window-measured-phi-390.png', fullPage: true });
		await page.setViewportSize({ width: 1366, height: 900 });

		// bad input over HTTP: times not increasing → 400 naming the field
		const bad = await page.request.post('/api/quantum-yield', { data: { spectrumIds: items.map((i: { id: number }) => i.id), timesS: [0, 30, 30, 120, 180, 240, 360, 480], lampId: 1, reactant: { spectrumId: reactant.id }, volumeL: 0.003, pathCm: 1, wall: { materialId: 1, thicknessMm: 1 } }, headers: { origin } });
		expect(bad.status()).toBe(400);
		expect((await bad.json()).error.field).toBe('timesS[2]');
	});
});
