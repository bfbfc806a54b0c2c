/**
 * Accounts end to end in Chromium against the built app and the local fake SMTP server:
 * sign-up with e-mail verification, invitation by a lead, password reset, tokens, throttling.
 */
import { test, expect, request as playwrightRequest } from '@playwright/test';
import { baseURL, signInAs } from './helpers/auth';
import { latestLink } from './helpers/mail';

const run = Date.now().toString(36);
const PASSWORD = 'quartz-cuvette-at-dawn';

test('sign up → verification mail → link verifies → sign in', async ({ page }) => {
	const email = `nadia.okafor.${run}@lab.example.org`;
	await page.goto('/signup');
	await page.getByLabel('Name').fill('Nadia Okafor');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill('short');
	await page.getByRole('button', { name: 'Create account' }).click();
	// Bad input: field-level message, typed values kept, password not echoed.
	await expect(page.getByText('Use at least 10 characters.')).toBeVisible();
	await expect(page.getByLabel('E-mail')).toHaveValue(email);
	await expect(page.getByLabel('Password')).toHaveValue('');

	await page.getByLabel('Password').fill(PASSWORD);
	await page.getByRole('button', { name: 'Create account' }).click();
	await expect(page.getByRole('heading', { name: 'Check your inbox' })).toBeVisible();
	await expect(page.getByRole('status')).toContainText(email);

	const link = await latestLink(email, '/verify');
	await page.goto(link);
	await page.getByRole('button', { name: 'Confirm address' }).click();
	await expect(page).toHaveURL(/\/signin\?verified=1/);
	await expect(page.getByText('Address confirmed')).toBeVisible();

	// The link is single-use.
	await page.goto(link);
	await expect(page.getByRole('alert')).toContainText('unknown, used or expired');

	await page.goto('/signin');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill(PASSWORD);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page).toHaveURL(/\/account$/);
	await expect(page.getByRole('heading', { name: 'Your account' })).toBeVisible();
	await expect(page.getByText('not confirmed yet')).toHaveCount(0);

	// Sign out from the header.
	await page.getByRole('button', { name: 'Sign out' }).click();
	await expect(page).toHaveURL(/\/signin$/);
	expect((await page.request.get('/api/me')).status()).toBe(401);
});

test('lead invites a new address → invitee signs up through the link and sees the group', async ({ page, browser }) => {
	const email = `joel.venter.${run}@lab.example.org`;
	await signInAs(page, 'lead');
	await page.goto('/groups/harbourlight');
	await page.getByLabel('E-mail').fill(email);
	await page.locator('#f-invite-role').selectOption('member');
	await page.getByRole('button', { name: 'Send invitation' }).click();
	await expect(page.getByRole('status')).toContainText(`Invitation sent to ${email}`);

	const link = await latestLink(email, '/invite/');
	const invitee = await browser.newContext({ baseURL: baseURL() });
	const p2 = await invitee.newPage();
	await p2.goto(link);
	await expect(p2.getByRole('heading', { name: 'Join Harbourlight Photochemistry Group' })).toBeVisible();
	await p2.getByLabel('Your name').fill('Joel Venter');
	await p2.getByLabel('Password').fill(PASSWORD);
	await p2.getByRole('button', { name: 'Create account and join' }).click();
	await expect(p2).toHaveURL(/\/groups\/harbourlight$/);
	await expect(p2.getByRole('heading', { name: 'Harbourlight Photochemistry Group' })).toBeVisible();
	await expect(p2.getByText('Joel Venter (you)')).toBeVisible();
	const me = await (await p2.request.get('/api/me')).json();
	expect(me.groups).toContainEqual(expect.objectContaining({ slug: 'harbourlight', role: 'member' }));
	expect(me.user.emailVerified).toBe(true);

	// A used invitation cannot be used again.
	await p2.goto(link);
	await expect(p2.getByRole('alert')).toContainText('unknown, used or expired');
	await invitee.close();

	// The lead removes the new member again (keeps the demo group as seeded).
	await page.reload();
	const row = page.getByRole('row', { name: /Joel Venter/ });
	await row.getByRole('button', { name: 'Remove' }).click();
	await expect(page.getByRole('row', { name: /Joel Venter/ })).toHaveCount(0);
});

test('forgot password → reset link works once → new password signs in', async ({ page, request }) => {
	const email = `mira.castell.${run}@lab.example.org`;
	const s = await request.post('/signup', { form: { name: 'Mira Castell', email, password: PASSWORD }, headers: { origin: new URL(baseURL()).origin, accept: 'text/html' } });
	expect(s.status()).toBe(200);
	await page.goto('/forgot');
	await page.getByLabel('E-mail').fill(email);
	await page.getByRole('button', { name: 'Send a link' }).click();
	await expect(page.getByRole('status')).toContainText('If');
	const link = await latestLink(email, '/reset');
	await page.goto(link);
	await page.getByLabel('New password').fill('second-quartz-cuvette');
	await page.getByLabel('Repeat it').fill('second-quartz-cuvette');
	await page.getByRole('button', { name: 'Save password' }).click();
	await expect(page).toHaveURL(/\/signin\?reset=1/);
	await page.goto(link);
	await expect(page.getByRole('alert')).toContainText('unknown, used or expired');
	const ok = await request.post('/api/auth/signin', { data: { email, password: 'second-quartz-cuvette' } });
	expect(ok.status()).toBe(200);
});

test('API token: shown once, works as Bearer, revoked stops working', async ({ page }) => {
	await signInAs(page, 'member');
	await page.goto('/account');
	await page.getByLabel('Token name').fill('plate reader script');
	await page.getByRole('button', { name: 'Create token' }).click();
	const token = (await page.getByTestId('new-token').textContent())!.trim();
	expect(token).toMatch(/^ws_/);
	const api = await playwrightRequest.newContext({ baseURL: baseURL(), extraHTTPHeaders: { authorization: `Bearer ${token}` } });
	const me = await api.get('/api/me');
	expect(me.status()).toBe(200);
	expect((await me.json()).user.email).toBe('member@windowsill.test');
	await page.reload();
	await expect(page.getByText('Token "plate reader script"')).toHaveCount(0); // shown once only
	const row = page.getByRole('row', { name: /plate reader script/ }).first();
	await row.getByRole('button', { name: 'Revoke' }).click();
	await expect(page.getByRole('row', { name: /plate reader script/ }).first()).toContainText('revoked');
	expect((await api.get('/api/me')).status()).toBe(401);
	await api.dispose();
});

test('repeated wrong passwords → 429 with Retry-After (throwaway account)', async ({ request }) => {
	const email = `throttle.${run}@lab.example.org`;
	await request.post('/signup', { form: { name: 'Throttle Probe', email, password: PASSWORD }, headers: { origin: new URL(baseURL()).origin, accept: 'text/html' } });
	const statuses: number[] = [];
	for (let i = 0; i < 5; i++) statuses.push((await request.post('/api/auth/signin', { data: { email, password: `wrong-${i}` } })).status());
	expect(statuses).toEqual([401, 401, 401, 401, 401]);
	const blocked = await request.post('/api/auth/signin', { data: { email, password: PASSWORD } });
	expect(blocked.status()).toBe(429);
	expect(Number(blocked.headers()['retry-after'])).toBeGreaterThan(0);
	expect((await blocked.json()).error.code).toBe('throttled');
	// Other accounts from the same IP are not affected.
	expect((await request.post('/api/auth/signin', { data: { email: 'viewer@windowsill.test', password: process.env.DEMO_PASSWORD ?? 'sunlit-bench-demo' } })).status()).toBe(200);
});

test('sign-in answers never reveal whether an account exists', async ({ request }) => {
	const a = await request.post('/api/auth/signin', { data: { email: `nobody.${run}@lab.example.org`, password: 'whatever-it-is' } });
	const b = await request.post('/api/auth/signin', { data: { email: 'member@windowsill.test', password: `wrong-${run}` } });
	expect(a.status()).toBe(401);
	expect(b.status()).toBe(401);
	expect((await a.json()).error.message).toBe((await b.json()).error.message);
	const c = await request.post('/api/auth/signin', { data: { email: 'member@windowsill.test', password: process.env.DEMO_PASSWORD ?? 'sunlit-bench-demo' } });
	expect(c.status()).toBe(200);
	expect(c.headers()['set-cookie']).toMatch(/HttpOnly/i);
	expect(c.headers()['set-cookie']).toMatch(/SameSite=Lax/i);
});
