/**
 * The Window finder as a page: first render of a shared link, layout from phone to laptop, units never upper-cased,
 * keyboard-only use, one plan per double click, errors at the field and stale answers greyed.
 * Demo data (invented spectra and lamps, seeds/) only sets the scene; expected values are physical facts cited beside
 * each check.
 */
import { expect, test, type Page } from '@playwright/test';
import { signInAs } from './helpers/auth';
import { demoIds, windowLink } from './helpers/windowLinks';

const PHONE = { width: 390, height: 844 };
const LAPTOP = { width: 1366, height: 900 };

/** Morrow enone (invented [2+2] substrate, UV-A band) in dichloromethane behind 2 mm borosilicate 3.3 tubing. */
async function enoneLink(page: Page) {
	const ids = await demoIds(page.request);
	return windowLink({
		s: ids.spectrum('Morrow enone'),
		c: 0.01,
		solv: ids.solvent('Dichloromethane'),
		wall: ids.material('borosilicate-3.3-tubing'),
		d: 2,
		l: 1,
		phi: 0.3,
		v: 10
	});
}

const answerReady = (page: Page) => expect(page.getByTestId('answer')).toHaveAttribute('data-stale', 'false');

async function noHorizontalScroll(page: Page, path: string) {
	await page.goto(path);
	await page.waitForLoadState('networkidle');
	const { scrollWidth, innerWidth } = await page.evaluate(() => ({ scrollWidth: document.documentElement.scrollWidth, innerWidth: window.innerWidth }));
	expect(scrollWidth, `${path} is ${scrollWidth} px wide in a ${innerWidth} px window`).toBeLessThanOrEqual(innerWidth);
}

/** Elements whose computed text-transform is uppercase and whose text carries a unit or symbol. */
async function upperCasedUnits(page: Page): Promise<string[]> {
	return page.evaluate(() => {
		const out: string[] = [];
		for (const el of Array.from(document.querySelectorAll<HTMLElement>('body *'))) {
			if (getComputedStyle(el).textTransform !== 'uppercase') continue;
			const text = el.textContent ?? '';
			if (/µ|λ|mL|nm|mm/.test(text)) out.push(`${el.tagName}: ${text.trim().slice(0, 60)}`);
		}
		return out;
	});
}

test.describe('Window finder design', () => {
	test('a shared link shows its window in the first render, even without JavaScript', async ({ page, browser }) => {
		await signInAs(page, 'member');
		const link = await enoneLink(page);
		// the HTML the server sends already carries the answer
		const html = await (await page.request.get(link, { headers: { accept: 'text/html' } })).text();
		expect(html).toContain('data-testid="windows"');
		expect(html).toMatch(/\d+(\.5)?–\d+(\.5)? nm/);
		expect(html).toContain('data-testid="verdict"');
		expect(html).not.toContain('data-testid="empty-state"');
		// and a browser that runs no script shows it
		const ctx = await browser.newContext({ javaScriptEnabled: false, storageState: await page.context().storageState() });
		const noJs = await ctx.newPage();
		await noJs.goto(link);
		await expect(noJs.getByTestId('windows')).toContainText(/\d+(\.\d+)?–\d+(\.\d+)? nm/);
		await expect(noJs.getByTestId('band-max')).toContainText(/At its band maximum \(\d+ nm\) the wall passes \d+ %/);
		await ctx.close();
	});

	for (const size of [PHONE, LAPTOP]) {
		test(`no horizontal scrolling at ${size.width}×${size.height}, and screenshots`, async ({ page }) => {
			await page.setViewportSize(size);
			await signInAs(page, 'member');
			const link = await enoneLink(page);
			for (const path of [link, '/window', '/library', '/lamps', '/reference', '/reference/solvents', '/reference/materials']) await noHorizontalScroll(page, path);
			await page.goto(link);
			await answerReady(page);
			await expect(page.getByTestId('save-bar')).toBeInViewport();
			await page.screenshot({ path: `test-results/window-${size.width}-top.png` });
			await page.getByTestId('verdict').scrollIntoViewIfNeeded();
			await page.screenshot({ path: `test-results/window-${size.width}-verdict.png` });
			await page.getByRole('heading', { name: 'Where each lamp’s photons go' }).scrollIntoViewIfNeeded();
			await page.screenshot({ path: `test-results/window-${size.width}-budget.png` });
			await expect(page.getByTestId('save-bar')).toBeInViewport();
			await page.getByRole('heading', { name: 'Spectra on one wavelength axis' }).scrollIntoViewIfNeeded();
			await page.waitForTimeout(300);
			await page.screenshot({ path: `test-results/window-${size.width}-spectra.png` });
			await page.getByRole('heading', { name: /Time course with/ }).scrollIntoViewIfNeeded();
			await page.waitForTimeout(300);
			await page.screenshot({ path: `test-results/window-${size.width}-course.png` });
		});
	}

	test('no upper-cased text carries a unit or symbol', async ({ page }) => {
		await signInAs(page, 'member');
		const link = await enoneLink(page);
		for (const path of [link, '/library', '/library/upload', '/lamps', '/reference/solvents', '/reference/materials', '/plans']) {
			await page.goto(path);
			await page.waitForLoadState('networkidle');
			expect(await upperCasedUnits(page), path).toEqual([]);
		}
	});

	test('errors are in plain words at the field, and a stale answer says it is not for these inputs', async ({ page }) => {
		await signInAs(page, 'member');
		await page.goto(await enoneLink(page));
		await answerReady(page);
		const conc = page.getByLabel('Substrate concentration (mol L⁻¹)');
		await conc.fill('-0.01');
		await expect(conc).toHaveAttribute('aria-invalid', 'true');
		const describedBy = (await conc.getAttribute('aria-describedby'))!;
		await expect(page.locator(`#${describedBy}`)).toHaveText('Substrate concentration must be 0 mol L⁻¹ or more.');
		await expect(page.getByTestId('answer')).toHaveAttribute('data-stale', 'true');
		await expect(page.getByTestId('stale-note')).toContainText('Not for these inputs');
		await expect(page.getByRole('button', { name: 'Save as irradiation plan' })).toBeDisabled();
		await conc.fill('0.01');
		await answerReady(page);
		await expect(conc).not.toHaveAttribute('aria-invalid', 'true');
		await expect(page.getByRole('button', { name: 'Save as irradiation plan' })).toBeEnabled();
	});

	test('the picker is a combobox: arrows, Enter, Escape and a click outside', async ({ page }) => {
		await signInAs(page, 'member');
		await page.goto('/window');
		const box = page.getByRole('combobox', { name: 'Substrate' });
		await box.click();
		await expect(box).toHaveAttribute('aria-expanded', 'true');
		const list = page.getByRole('listbox', { name: 'Substrate' });
		// grouped by part, substrates first
		await expect(list.getByRole('group').first()).toContainText('Substrates');
		await box.press('Escape');
		await expect(box).toHaveAttribute('aria-expanded', 'false');
		await box.press('ArrowDown');
		await expect(box).toHaveAttribute('aria-expanded', 'true');
		await page.getByRole('heading', { level: 1 }).click();
		await expect(box).toHaveAttribute('aria-expanded', 'false');
		await box.fill('dunmore');
		await expect(list.getByRole('option').first()).toContainText('Dunmore cinnamate');
		await box.press('ArrowDown');
		await box.press('ArrowUp');
		const active = await box.getAttribute('aria-activedescendant');
		expect(active).toBeTruthy();
		const name = (await page.locator(`#${active}`).locator('span').first().textContent())!;
		await box.press('Enter');
		await expect(box).toHaveValue(name);
		await expect(box).toHaveAttribute('aria-expanded', 'false');
	});

	test('keyboard only: from an empty page to a saved plan', async ({ page }) => {
		await signInAs(page, 'member');
		await page.goto('/window');
		const tabTo = async (locator: ReturnType<Page['locator']>, max = 120) => {
			for (let k = 0; k < max; k++) {
				if (await locator.evaluate((el) => el === document.activeElement)) return;
				await page.keyboard.press('Tab');
			}
			throw new Error('never reached by Tab');
		};
		await tabTo(page.getByRole('combobox', { name: 'Substrate' }));
		await page.keyboard.type('morrow enone');
		await expect(page.getByRole('option', { name: /Morrow enone/ })).toBeVisible();
		await page.keyboard.press('ArrowDown');
		await page.keyboard.press('Home');
		await page.keyboard.press('Enter');
		await expect(page.getByRole('combobox', { name: 'Substrate' })).toHaveValue('Morrow enone');
		await tabTo(page.getByLabel('Substrate concentration (mol L⁻¹)'));
		await page.keyboard.press('ControlOrMeta+a');
		await page.keyboard.type('0.01');
		await tabTo(page.locator('select[name="solvent"]'));
		await page.keyboard.type('Dichloromethane');
		await expect(page.locator('select[name="solvent"]')).toHaveValue(String((await demoIds(page.request)).solvent('Dichloromethane')));
		await tabTo(page.locator('select[name="wall"]'));
		await page.keyboard.type('Borosilicate 3.3 glass, l');
		await tabTo(page.getByLabel('Volume (mL)'));
		await page.keyboard.type('10');
		await answerReady(page);
		await tabTo(page.getByLabel('Plan title'));
		await page.keyboard.type('Morrow enone [2+2], keyboard only');
		await page.keyboard.press('Enter');
		const link = page.getByTestId('save-bar').getByRole('status').getByRole('link');
		await expect(link).toContainText('Morrow enone [2+2], keyboard only');
		await tabTo(link, 5).catch(async () => link.focus());
		await page.keyboard.press('Enter');
		await expect(page.getByRole('heading', { level: 1, name: 'Morrow enone [2+2], keyboard only' })).toBeVisible();
	});

	test('a double click on Save saves one plan', async ({ page }) => {
		await signInAs(page, 'member');
		await page.goto(await enoneLink(page));
		await answerReady(page);
		const title = `Double click ${Date.now()}`;
		const count = async () => ((await (await page.request.get('/api/plans')).json()) as { title: string }[]).filter((p) => p.title === title).length;
		await page.getByLabel('Plan title').fill(title);
		await page.getByRole('button', { name: 'Save as irradiation plan' }).dblclick();
		await expect(page.getByTestId('save-bar').getByRole('status').getByRole('link')).toBeVisible();
		await page.waitForTimeout(1500);
		expect(await count()).toBe(1);
		// without JavaScript the browser may post the form twice: the server keeps one plan per idempotencyKey
		const form = {
			title: `${title} (no script)`,
			inputs: await page.locator('input[name="inputs"]').inputValue(),
			query: '',
			idempotencyKey: crypto.randomUUID()
		};
		const origin = new URL(page.url()).origin;
		for (let k = 0; k < 2; k++) {
			const r = await page.request.post('/window?/save', { form, headers: { origin, accept: 'text/html' }, maxRedirects: 0 });
			expect(r.status()).toBe(200);
		}
		const plans = (await (await page.request.get('/api/plans')).json()) as { title: string }[];
		expect(plans.filter((p) => p.title === form.title)).toHaveLength(1);
	});
});
