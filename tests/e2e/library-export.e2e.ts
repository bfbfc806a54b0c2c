import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { signInAs } from './helpers/auth';

test('a spectrum’s plot exports as a PNG image', async ({ page }) => {
	await signInAs(page, 'member');
	await page.goto('/library?q=Morrow%20enone');
	await page.getByRole('link', { name: 'Morrow enone', exact: true }).click();
	await expect(page.getByRole('heading', { level: 1, name: 'Morrow enone' })).toBeVisible();
	const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export PNG' }).click()]);
	expect(download.suggestedFilename()).toBe('Morrow-enone.png');
	const file = await download.path();
	await download.saveAs('test-results/library-export.png');
	const bytes = readFileSync(file);
	// PNG signature (ISO/IEC 15948): 89 50 4E 47 0D 0A 1A 0A, then an IHDR chunk with width and height
	expect([...bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
	expect(bytes.readUInt32BE(16)).toBeGreaterThan(300);
	expect(bytes.readUInt32BE(20)).toBeGreaterThan(200);
	await page.screenshot({ path: 'test-results/library-detail-export.png', fullPage: true });
});
