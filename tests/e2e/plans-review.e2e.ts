/**
 * The lead's desk, as people use it: a member saves and submits a plan, the lead gets the mail (outbox), returns it
 * with a comment, the member replies, changes the decision and resubmits, the second lead approves; the PDF report
 * downloads and its text names the lamp, the photon flux basis and the safety deferral; the group's matrix shows the
 * plan in its lamp × absorber cell, and a click on the cell opens the Window finder with those inputs.
 * Screenshots (1366 and 390 px) of the plan page, the matrix, the report and the audit log go to test-results/screens/.
 */
import { readFileSync } from 'node:fs';
import { expect, test, type APIRequestContext, type Page } from '@playwright/test';
import { PDFParse } from 'pdf-parse';
import { bearerContext, DEMO_PASSWORD } from './helpers/auth';

const LEAD2 = 'lead2@windowsill.test';
const shots = 'test-results/screens';

async function signIn(page: Page, email: string) {
	await page.context().clearCookies();
	const r = await page.request.post('/api/auth/signin', { data: { email, password: DEMO_PASSWORD } });
	expect(r.status(), `sign-in as ${email}`).toBe(200);
}

/** The newest outbox message to `to` whose subject contains `subject` (polls: mail arrives asynchronously). */
async function mailTo(admin: APIRequestContext, to: string, subject: string): Promise<{ subject: string; text: string }> {
	let found: { subject: string; text: string } | undefined;
	await expect
		.poll(async () => {
			const r = await admin.get(`/api/admin/outbox?to=${encodeURIComponent(to)}&limit=20`);
			expect(r.status()).toBe(200);
			found = ((await r.json()) as { subject: string; text: string }[]).find((m) => m.subject.includes(subject));
			return !!found;
		}, { timeout: 15_000 })
		.toBe(true);
	return found!;
}

async function screenshots(page: Page, name: string) {
	for (const width of [1366, 390]) {
		await page.setViewportSize({ width, height: 900 });
		await page.screenshot({ path: `${shots}/${name}-${width}.png`, fullPage: true });
	}
	await page.setViewportSize({ width: 1366, height: 900 });
}

test('submit → mail → return with comment → reply and resubmit → another lead approves; PDF; matrix', async ({ page }) => {
	test.setTimeout(240_000);
	const admin = await bearerContext('admin');
	const title = `Morrow enone under UV-A ${Date.now().toString(36)}`;
	const ids = async (table: string, where: string) => {
		const r = await page.request.get(`/api/${table}?${where}`);
		return r.json();
	};

	// The member saves the plan (as the Window finder's save form does: inputs + decision + an idempotency key; sent twice).
	await signIn(page, 'member@windowsill.test');
	const spectra = (await ids('spectra', 'q=Morrow%20enone')).items as { id: number; name: string }[];
	const substrateId = spectra.find((s) => s.name === 'Morrow enone')!.id;
	const solventId = ((await ids('solvents', 'q=dichloromethane')) as { id: number; name: string }[]).find((s) => s.name === 'Dichloromethane')!.id;
	const wallId = ((await (await page.request.get('/api/materials')).json()) as { id: number; name: string }[]).find((m) => m.name.startsWith('Borosilicate 3.3 glass, laboratory'))!.id;
	const lamp = ((await (await page.request.get('/api/lamps')).json()) as { id: number; name: string }[]).find((l) => l.name === 'Bench LED 365 (array A)')!;
	const body = {
		title,
		inputs: { substrate: { spectrumId: substrateId, concentrationM: 0.02 }, solvent: { id: solventId }, wall: { materialId: wallId, thicknessMm: 2 }, pathCm: 1, quantumYield: 0.3, volumeL: 0.005, includeCurves: true },
		decision: { lampId: lamp.id, irradiationTimeS: 3600 },
		idempotencyKey: crypto.randomUUID()
	};
	const [first, second] = await Promise.all([page.request.post('/api/plans', { data: body }), page.request.post('/api/plans', { data: body })]);
	expect([first.status(), second.status()].sort()).toEqual([200, 201]);
	const planId = (await first.json()).id as number;
	expect((await second.json()).id).toBe(planId);

	await page.goto(`/plans/${planId}`);
	await expect(page.getByTestId('plan-state')).toHaveAttribute('data-state', 'draft');
	await expect(page.getByTestId('decision-lamp')).toContainText(lamp.name);
	await page.getByTestId('submit-plan').click();
	await expect(page.getByTestId('plan-state')).toHaveAttribute('data-state', 'submitted');

	// The lead gets the mail and follows its link.
	const submitted = await mailTo(admin, 'lead@windowsill.test', `Plan waiting for review: ${title}`);
	const link = submitted.text.match(/https?:\/\/\S+\/plans\/\d+/)![0];
	expect(new URL(link).pathname).toBe(`/plans/${planId}`);
	await signIn(page, 'lead@windowsill.test');
	await page.goto(new URL(link).pathname);
	await page.getByTestId('review-comment').fill('Please add the safety measures (UV-A at 3 W) and check the time.');
	await page.getByTestId('return-plan').click();
	await expect(page.getByTestId('plan-state')).toHaveAttribute('data-state', 'returned');
	const returned = await mailTo(admin, 'member@windowsill.test', `Plan returned: ${title}`);
	expect(returned.text).toContain('Please add the safety measures');

	// The member replies in the thread, changes the decision and submits again.
	await signIn(page, 'member@windowsill.test');
	await page.goto(`/plans/${planId}`);
	await expect(page.getByTestId('thread')).toContainText('Please add the safety measures');
	await page.getByTestId('comment-body').fill('Added: UV-A goggles, closed enclosure; time set to 90 min.');
	await page.getByTestId('comment-send').click();
	await expect(page.getByTestId('thread')).toContainText('UV-A goggles, closed enclosure');
	await page.getByRole('button', { name: 'Change the decision' }).click();
	const form = page.getByTestId('decision-form');
	await form.locator('input[name="irradiationTimeMin"]').fill('90');
	await form.locator('input[name="temperatureC"]').fill('20');
	await form.locator('textarea[name="safetyMeasures"]').fill('UV-A rated goggles; enclosure closed while the LEDs are on; fan cooling checked.');
	await form.getByRole('button', { name: 'Save the decision and recompute' }).click();
	await expect(page.getByTestId('safety-measures')).toContainText('UV-A rated goggles');
	await page.getByTestId('submit-plan').click();
	await expect(page.getByTestId('plan-state')).toHaveAttribute('data-state', 'submitted');
	await mailTo(admin, 'lead@windowsill.test', 'New comment on plan');

	// The second lead approves; the plan page shows the approval, frozen.
	await mailTo(admin, LEAD2, `Plan waiting for review: ${title}`);
	await signIn(page, LEAD2);
	await page.goto('/plans');
	await expect(page.getByTestId('waiting-plans')).toContainText(title);
	await page.goto(`/plans/${planId}`);
	await page.getByTestId('approve-plan').click();
	await expect(page.getByTestId('plan-state')).toHaveAttribute('data-state', 'approved');
	await expect(page.getByText('The numbers below are frozen as approved.')).toBeVisible();
	await mailTo(admin, 'member@windowsill.test', `Plan approved: ${title}`);
	await page.getByTestId('recompute').click();
	await expect(page.getByTestId('no-changes')).toBeVisible();
	await screenshots(page, 'plan');

	// The PDF downloads and reads as it should.
	const downloadPromise = page.waitForEvent('download');
	await page.getByTestId('pdf-link').click();
	const download = await downloadPromise;
	expect(download.suggestedFilename()).toMatch(new RegExp(`^plan-${planId}-.*\\.pdf$`));
	const text = (await new PDFParse({ data: new Uint8Array(readFileSync(await download.path())) }).getText()).text.replace(/\s+/g, ' ');
	expect(text).toContain(lamp.name);
	expect(text).toContain('Photon flux into the vessel and its basis');
	expect(text).toMatch(/einstein s⁻¹ \(model: emission model × optical power × coupling factor\)/);
	expect(text).toContain('Approved by Dr. Maelis Orrin');
	expect(text).toContain('Consult your institutional safety officer before operating any light source.');

	await page.goto(`/api/plans/${planId}/report?format=html`);
	await expect(page.getByTestId('deferral')).toContainText('institutional safety officer');
	await screenshots(page, 'report');
	await page.emulateMedia({ media: 'print' });
	await expect(page.locator('nav.tools')).toBeHidden();
	await page.emulateMedia({ media: 'screen' });

	// The matrix under the plan's conditions shows the plan in its cell; the cell opens the Window finder.
	await page.goto(`/groups/harbourlight/matrix?solvent=${solventId}&wall=${wallId}&thicknessMm=2&pathCm=1&concentrationM=0.02`);
	const cell = page.locator(`[data-cell="${lamp.id}:${substrateId}"]`);
	await expect(cell.locator(`[data-plan-link="${planId}"]`)).toContainText('approved');
	await screenshots(page, 'matrix');
	await cell.locator('a').first().click();
	await expect(page).toHaveURL(/\/window\?/);
	const q = new URL(page.url()).searchParams;
	expect([q.get('s'), q.get('lamps'), q.get('solv'), q.get('wall'), q.get('d'), q.get('l'), q.get('c')]).toEqual([String(substrateId), String(lamp.id), String(solventId), String(wallId), '2', '1', '0.02']);

	// The audit log has every transition and the comments.
	await page.goto('/audit');
	for (const action of ['plan.create', 'plan.submit', 'plan.return', 'plan.comment', 'plan.update', 'plan.approve']) await expect(page.locator(`tr[data-action="${action}"]`).first()).toBeVisible();
	await screenshots(page, 'audit');
	await admin.dispose();
});
