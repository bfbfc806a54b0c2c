/**
 * Delimited-text uploads in a browser: a kinetics table read one spectrum per row (layout shown), a multi-column
 * table with an axis repeat, a %T column and a constant column (select none / only absorbance-like, read again —
 * the typed name stays), and an optical-constants table refused with its reason. Screenshots at 1366 and 390 px:
 * test-results/upload-csv-*.png. Tables are invented here (an invented dye series); the n, k file is the shared one.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { expect, test } from '@playwright/test';
import { signInAs } from './helpers/auth';

const run = Date.now().toString(36);
const wl = Array.from({ length: 211 }, (_, i) => 300 + 2 * i);
const band = (nm: number, c: number, w: number) => Math.exp(-(((nm - c) / w) ** 2) / 2);
const kinetics = () => {
	const rows = [['Time (s)', ...wl].join(',')];
	for (let k = 0; k < 35; k++) rows.push([30 * k, ...wl.map((nm) => (0.8 * Math.exp((-30 * k) / 300) * band(nm, 470, 30) + 0.01).toFixed(4))].join(','));
	return { name: `dye-fade-kinetics-${run}.csv`, mimeType: 'text/csv', buffer: Buffer.from(rows.join('\n')) };
};
const multi = () => {
	const head = ['Wavelength (nm)', 'Wavenumber (cm-1)', 'A 10 µM', 'A 20 µM', 'A 40 µM', 'A 80 µM', '%T filter', 'Concentration (M)'];
	const rows = wl.map((nm) => [nm, (1e7 / nm).toFixed(3), ...[1, 2, 4, 8].map((f) => (0.05 * f * band(nm, 450, 35) + 0.003).toFixed(4)), (90 - 80 * band(nm, 320, 15)).toFixed(2), '2.5e-5'].join(','));
	return { name: `dye-dilution-${run}.csv`, mimeType: 'text/csv', buffer: Buffer.from([`Sample: invented dye D-7, run ${run}`, head.join(','), ...rows].join('\n')) };
};
const nk = () => ({ name: `glass-nk-${run}.csv`, mimeType: 'text/csv', buffer: readFileSync(path.resolve(process.cwd(), '../shared/external/csv-variety/optical-constants-n-k-not-a-spectrum.csv')) });

test('kinetics per row, column selection, re-read keeps typed metadata, n, k refused; 1366 and 390 px', async ({ page }) => {
	await signInAs(page, 'member');
	await page.setViewportSize({ width: 1366, height: 900 });
	await page.goto('/library/upload');
	await expect(page.getByTestId('drop-zone')).toHaveAttribute('data-hydrated', 'true');
	await page.getByTestId('file-input').setInputFiles([kinetics(), multi(), nk()]);
	const k = page.locator(`[data-file="dye-fade-kinetics-${run}.csv"]`);
	const m = page.locator(`[data-file="dye-dilution-${run}.csv"]`);
	const n = page.locator(`[data-file="glass-nk-${run}.csv"]`);
	await expect(k.getByTestId('upload-status')).toHaveText('ready', { timeout: 30_000 });
	await expect(m.getByTestId('upload-status')).toHaveText('ready', { timeout: 30_000 });
	await expect(n.getByTestId('upload-status')).toHaveText('error', { timeout: 30_000 });

	await expect(k.getByTestId('layout-choice')).toContainText('One spectrum per row');
	await expect(k.getByTestId('series-summary')).toContainText('35 spectra, times 0–1020 s');
	await expect(m.getByTestId('layout-choice')).toContainText('One spectrum per column');
	await expect(n.getByTestId('upload-error')).toContainText('optical constants');

	// 5 spectra read by default (4 absorbance + the %T column); the wavenumber axis and the constant are offered unticked
	await expect(m.getByTestId('preview-spectrum')).toHaveCount(5);
	await expect(m.locator('input[name=columns][value="1"]')).toBeDisabled();
	await expect(m.locator('input[name=columns][value="7"]')).not.toBeChecked();
	await m.locator('input[name=name]').fill(`Dilution series typed ${run}`);
	await m.locator('input[name=solvent]').fill('acetonitrile');
	await m.getByTestId('select-none').click();
	await expect(m.locator('input[name=columns]:checked')).toHaveCount(0);
	await m.getByTestId('select-all').click();
	await expect(m.locator('input[name=columns]:checked')).toHaveCount(6);
	await m.getByTestId('select-absorbance').click();
	await expect(m.locator('input[name=columns]:checked')).toHaveCount(4);
	await m.getByTestId('reread').click();
	await expect(m.getByTestId('upload-status')).toHaveText('ready');
	await expect(m.getByTestId('preview-spectrum')).toHaveCount(4);
	await expect(m.locator('input[name=name]')).toHaveValue(`Dilution series typed ${run}`);
	await expect(m.locator('input[name=solvent]')).toHaveValue('acetonitrile');

	// the n, k table is offered as a wall material instead
	await n.getByTestId('wall-from-nk').locator('input').first().fill(`Soda-lime sheet e2e ${run}`);
	await n.getByRole('button', { name: 'Add as a wall material' }).click();
	await expect(n.getByRole('status')).toContainText(`Added Soda-lime sheet e2e ${run} (146 wavelengths`);
	await page.screenshot({ path: 'test-results/upload-csv-1366.png', fullPage: true });

	await page.setViewportSize({ width: 390, height: 844 });
	await page.screenshot({ path: 'test-results/upload-csv-390.png', fullPage: true });
	await m.locator('fieldset').screenshot({ path: 'test-results/upload-csv-390-columns.png' });
	await k.locator('fieldset').screenshot({ path: 'test-results/upload-csv-390-rows.png' });
	await n.screenshot({ path: 'test-results/upload-csv-390-nk.png' });
	await m.locator('button[type=submit]').click();
	await expect(m.getByTestId('upload-status')).toHaveText('saved', { timeout: 30_000 });
	await expect(m.getByText(`Dilution series typed ${run} — A 10 µM`)).toBeVisible();
});

test('lamp from a measured spectrum and wall from a measured spectrum pick it with the search combobox', async ({ page }) => {
	await signInAs(page, 'member');
	await page.setViewportSize({ width: 1366, height: 900 });
	await page.goto('/lamps/new');
	await page.locator('select[name=modelType]').selectOption('spectrum');
	const lamp = page.getByTestId('lamp-spectrum-choice');
	await lamp.click();
	await expect(page.getByRole('listbox')).toBeVisible();
	const first = page.getByRole('listbox').getByRole('option').first();
	const label = (await first.locator('span').first().textContent())!.trim();
	await lamp.press('ArrowDown');
	await lamp.press('ArrowUp');
	await lamp.press('Enter');
	await expect(page.getByTestId('lamp-spectrum-choice')).toHaveValue(label);
	expect(Number(await page.locator('input[type=hidden][name=spectrumId]').inputValue())).toBeGreaterThan(0);
	await page.screenshot({ path: 'test-results/upload-csv-lamp-picker.png', fullPage: true });
	await page.goto('/reference/materials');
	await page.getByText('Add your own wall from a measured transmission spectrum').click();
	await page.getByTestId('wall-spectrum-choice').fill('tubing wall');
	await expect(page.getByRole('listbox').getByRole('option').first()).toContainText('tubing wall');
	await page.screenshot({ path: 'test-results/upload-csv-wall-picker.png', fullPage: true });
	await page.getByRole('listbox').getByRole('option').first().click();
	await expect(page.getByTestId('wall-spectrum-choice')).toHaveValue(/tubing wall/);
});

test('a wall from optical constants: a refractive-index YAML file is added and chosen; an n-only file is refused in plain words', async ({ page }) => {
	await signInAs(page, 'member');
	// ../shared/external/materials (polyanskiy/refractiveindex.info-database, CC0; MANIFEST.md)
	const dir = path.resolve(process.cwd(), '../shared/external/materials');
	const name = `Our borosilicate 3.3 sheet ${Date.now().toString(36)}`;
	await page.goto('/reference/materials');
	await page.getByText('Add your own wall from optical constants (n, k)').click();
	const form = page.getByTestId('nk-form');
	await form.getByLabel('Name').fill('Fused silica, n only');
	await page.getByTestId('nk-file').setInputFiles(path.join(dir, 'fused-silica-n-malitson-1965.yml'));
	await form.getByRole('button', { name: 'Add material' }).click();
	await expect(page.getByTestId('nk-message')).toContainText('refractive index n only, no extinction coefficient k');
	await form.getByLabel('Name').fill(name);
	await form.getByLabel('Typical thickness (mm)').fill('1');
	await page.getByTestId('nk-file').setInputFiles(path.join(dir, 'borosilicate-3.3-float-sheet-nk.yml'));
	await form.getByRole('button', { name: 'Add material' }).click();
	// MANIFEST.md: n(589.3 nm) = 1.47143
	await expect(page.getByTestId('nk-message')).toContainText(`Added “${name}”`);
	await expect(page.getByTestId('nk-message')).toContainText('n = 1.4714');
	await expect(page.locator('select[name=material] option:checked')).toContainText(name);
	// MANIFEST.md: internal T(1 mm, 300 nm) = 0.894; with the two faces' reflection (1 − R)², R = ((n − 1)/(n + 1))², n = 1.47143: 0.830
	await expect(page.getByTestId('transmission-sentence')).toContainText(/^At 300 nm, 1\.0 mm our borosilicate 3\.3 sheet \w+ transmits 8[23](\.\d)? ?%/);
	await expect(page.getByTestId('transmission-sentence')).not.toContainText('updating');
	await expect(page.getByTestId('transmission-basis')).toContainText('flat slab at normal incidence, from tabulated k');
	await page.screenshot({ path: 'test-results/materials-nk-added.png', fullPage: true });
});
