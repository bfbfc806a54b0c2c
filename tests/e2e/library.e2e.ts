/**
 * The Library in a browser (demo accounts and demo spectra seeded): upload three files at once with
 * progress, fix metadata, fuzzy search, "absorbs at 450 nm", overlay, CSV export; a viewer sees no
 * upload button and gets 403 from the API. Screenshots: test-results/library-*.png.
 * Uploaded files are small invented fixtures (fixtures/library/); each run renames them with a run
 * id so a re-run is not refused as a duplicate.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { expect, test } from '@playwright/test';
import { bearerContext, signInAs } from './helpers/auth';

const run = Date.now().toString(36);
const fixture = (name: string) => readFileSync(path.resolve(process.cwd(), 'fixtures/library', name));
/** The fixture with a comment line added so its sha256 differs per run (duplicates are refused by design). */
const unique = (name: string) => ({ name: name.replace('.csv', `-${run}.csv`), mimeType: 'text/csv', buffer: Buffer.concat([Buffer.from(`# run ${run}\n`), fixture(name)]) });
const shot = (name: string) => ({ path: `test-results/library-${name}.png`, fullPage: true });

test('member uploads three files, fixes metadata, finds, filters, overlays and exports', async ({ page }) => {
	await signInAs(page, 'member');
	await page.goto('/library/upload');
	await expect(page.getByTestId('drop-zone')).toHaveAttribute('data-hydrated', 'true');
	await page.getByTestId('file-input').setInputFiles([unique('tidewater-blue-catalyst-epsilon.csv'), unique('violet-ketone-absorbance.csv'), unique('sill-sheet-transmission.csv')]);
	const cards = page.getByTestId('upload-card');
	await expect(cards).toHaveCount(3);
	await expect(page.getByTestId('overall-progress')).toBeVisible();
	await expect(page.getByTestId('file-progress')).toHaveCount(3);
	for (let i = 0; i < 3; i++) await expect(cards.nth(i).getByTestId('upload-status')).toHaveText('ready');
	await expect(page.getByTestId('preview-spectrum')).toHaveCount(3);

	// fix the metadata of each file
	const blue = page.locator('[data-file^="tidewater-blue"]');
	await blue.locator('input[name=name]').fill(`Tidewater Blue e2e ${run}`);
	await blue.locator('select[name=part]').selectOption('photocatalyst');
	await blue.locator('input[name=tripletEnergyKjPerMol]').fill('232');
	await blue.locator('input[name=cas]').fill('50-00-1');
	await expect(blue.getByText('Not a valid CAS number')).toBeVisible();
	await blue.locator('input[name=cas]').fill('');
	const violet = page.locator('[data-file^="violet-ketone"]');
	await violet.locator('input[name=name]').fill(`Violet ketone e2e ${run}`);
	await violet.locator('input[name=concentrationM]').fill('1e-4');
	await violet.locator('input[name=pathCm]').fill('1');
	const sill = page.locator('[data-file^="sill-sheet"]');
	await sill.locator('input[name=name]').fill(`Sill sheet e2e ${run}`);
	await page.screenshot(shot('upload'));
	await page.getByTestId('save-all').click();
	for (let i = 0; i < 3; i++) await expect(cards.nth(i).getByTestId('upload-status')).toHaveText('saved');
	await expect(page.getByTestId('overall-progress')).toHaveAttribute('value', '1');

	// fuzzy search with a misspelt name
	await page.goto(`/library?q=${encodeURIComponent('Tidewatr Blu e2e')}`);
	await expect(page.getByTestId('library-table').getByText(`Tidewater Blue e2e ${run}`)).toBeVisible();
	await page.screenshot(shot('search'));

	// absorbs at 450 nm
	await page.goto('/library');
	await page.locator('input[name=absorbsAt]').fill('450');
	await page.getByRole('button', { name: 'Search' }).click();
	await expect(page).toHaveURL(/absorbsAt=450/);
	const table = page.getByTestId('library-table');
	await expect(table.getByText(`Tidewater Blue e2e ${run}`)).toBeVisible();
	await expect(table.getByText(`Violet ketone e2e ${run}`)).toHaveCount(0);
	await page.screenshot(shot('absorbs-450'));

	// overlay two
	await page.getByRole('checkbox', { name: `select Tidewater Blue e2e ${run}` }).check();
	await page.getByRole('checkbox', { name: /select Harbour Amber/ }).check();
	await page.getByTestId('overlay-selected').click();
	await expect(page).toHaveURL(/\/library\/overlay\?ids=\d+,\d+/);
	await expect(page.getByTestId('overlay-legend').locator('li')).toHaveCount(2);
	await page.getByTestId('normalise-max').check();
	await expect(page).toHaveURL(/scale=max/);
	await expect(page.locator('.u-legend')).toContainText('Harbour Amber');
	await page.screenshot(shot('overlay'));

	// detail page and CSV export
	await page.getByTestId('overlay-legend').getByText(`Tidewater Blue e2e ${run}`).click();
	await expect(page.getByTestId('spectrum-name')).toHaveText(`Tidewater Blue e2e ${run}`);
	await expect(page.getByTestId('peak-table')).toContainText('452');
	await page.getByTestId('y-mode').selectOption('logEpsilon');
	await page.screenshot(shot('detail'));
	const download = page.waitForEvent('download');
	await page.getByTestId('export-csv').click();
	const file = await download;
	const text = readFileSync((await file.path())!, 'utf8');
	expect(text).toMatch(/wavelength \(nm\),epsilon/);
	expect(text.trim().split('\n').filter((l) => /^\d/.test(l))).toHaveLength(451);
});

test('a viewer sees no upload button and the API answers 403', async ({ page }) => {
	await signInAs(page, 'viewer');
	await page.goto('/library');
	await expect(page.getByTestId('library-table')).toBeVisible();
	await expect(page.getByRole('link', { name: 'Upload spectra' })).toHaveCount(0);
	await page.screenshot(shot('viewer'));
	const api = await bearerContext('viewer');
	const r = await api.post('/api/spectra', { multipart: { file: { name: 'v.csv', mimeType: 'text/csv', buffer: fixture('violet-ketone-absorbance.csv') } }, headers: { origin: new URL(page.url()).origin } });
	expect(r.status()).toBe(403);
	expect((await r.json()).error.code).toBe('forbidden');
	await api.dispose();
});
