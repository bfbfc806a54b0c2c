/**
 * The Window finder with the reaction modes, as a chemist runs them (invented demo spectra and lamps, seeds/):
 * a blue photoredox mixture in photocatalytic mode, and an E/Z photoswitch in reversible mode.
 */
import { expect, test } from '@playwright/test';
import { signInAs } from './helpers/auth';
import { demoIds, windowLink } from './helpers/windowLinks';

test.describe('Window finder, reaction modes', () => {
	test('a blue photoredox mixture ranks the 450 nm LED first in photocatalytic mode', async ({ page }) => {
		await signInAs(page, 'member');
		const ids = await demoIds(page.request);
		// Calder aryl bromide (absorbs below ≈ 300 nm) with Tidewater Blue (visible band at 452 nm) and Tarrow
		// dihydropyridine as the reductant (absorbs up to ≈ 400 nm), in acetonitrile behind 2 mm borosilicate 3.3 tubing
		const link = windowLink({
			s: ids.spectrum('Calder aryl bromide'),
			c: 0.05,
			o: `${ids.spectrum('Tarrow dihydropyridine')}:0.1`,
			solv: ids.solvent('Acetonitrile'),
			wall: ids.material('borosilicate-3.3-tubing'),
			d: 2,
			l: 1,
			phi: 0.5,
			v: 5
		});
		await page.goto(link);
		await expect(page.getByTestId('answer')).toHaveAttribute('data-stale', 'false');
		// choose the mode and the photocatalyst on the page, as a chemist does
		await page.getByLabel('A photocatalyst or sensitiser').check();
		await page.getByTestId('photocatalyst-picker').fill('tidewater');
		await page.getByRole('option', { name: /^Tidewater Blue \(TWB-7\)/ }).click();
		await page.getByLabel('Photocatalyst concentration (mol L⁻¹)').fill('0.002');
		await expect(page.getByTestId('answer')).toHaveAttribute('data-stale', 'false');
		// common practice: a photocatalyst absorbing at 452 nm is driven best by a blue 450 nm LED, which emits only where
		// the photocatalyst is the sole absorber; a mercury lamp's UV lines go to the reductant (or stay in the wall)
		await expect(page.getByTestId('lamp-table').getByTestId('lamp-name').first()).toHaveText(/Blue LED 450/);
		await expect(page.getByTestId('verdict')).toContainText('best lamp: Blue LED 450');
		await expect(page.getByTestId('band-max')).toContainText(/At its band maximum \(45\d nm\) the wall passes \d+ %/);
		await expect(page.getByTestId('budget-sort')).toBeVisible();
		await page.screenshot({ path: 'test-results/window-photoredox.png' });
		await page.getByRole('heading', { name: 'Where each lamp’s photons go' }).scrollIntoViewIfNeeded();
		await page.screenshot({ path: 'test-results/window-photoredox-budget.png' });
		// the mode is in the link: a fresh page shows the same first lamp on first render
		await expect.poll(() => new URL(page.url()).searchParams.get('mode')).toBe('photocatalytic');
		const html = await (await page.request.get(new URL(page.url()).pathname + new URL(page.url()).search, { headers: { accept: 'text/html' } })).text();
		expect(html).toMatch(/data-testid="lamp-name"[^>]*>Blue LED 450/);
	});

	test('an E/Z pair shows its photostationary state and that 90 % is not reachable', async ({ page }) => {
		await signInAs(page, 'member');
		const ids = await demoIds(page.request);
		const link = windowLink({
			s: ids.spectrum('Dunmore cinnamate'),
			c: 0.01,
			solv: ids.solvent('Methanol'),
			wall: ids.material('borosilicate-3.3-tubing'),
			d: 2,
			l: 1,
			v: 10,
			mode: 'reversible',
			p: ids.spectrum('Dunmore cinnamate (Z isomer)'),
			phi: 0.5,
			phib: 0.5
		});
		await page.goto(link);
		await expect(page.getByTestId('answer')).toHaveAttribute('data-stale', 'false');
		// with equal forward and back Φ, the monochromatic PSS is x_Z = ε_E/(ε_E + ε_Z) (photostationary-state condition,
		// IUPAC Glossary of Terms Used in Photochemistry, 3rd ed., 2007, "photostationary state"): where both absorb, it
		// stays below 90 % unless ε_E ≥ 9 ε_Z, which the demo pair never has under a lamp's band
		await expect(page.getByTestId('pss')).toHaveText(/^\d+(\.\d)? %$/);
		const pss = Number((await page.getByTestId('pss').textContent())!.replace(/[^\d.]/g, ''));
		expect(pss).toBeGreaterThan(0);
		expect(pss).toBeLessThan(90);
		await expect(page.getByTestId('unreachable')).toContainText('90 % not reachable');
		await expect(page.getByTestId('t90')).toHaveText('not reachable');
		await expect(page.getByTestId('lamp-table').getByTestId('lamp-time').first()).toContainText('PSS');
		await page.getByRole('heading', { name: /Time course with/ }).scrollIntoViewIfNeeded();
		await page.waitForTimeout(300);
		await page.screenshot({ path: 'test-results/window-ez-course.png' });
		await page.getByRole('heading', { name: 'Spectra on one wavelength axis' }).scrollIntoViewIfNeeded();
		await page.waitForTimeout(300);
		await page.screenshot({ path: 'test-results/window-ez-spectra.png' });
	});
});
