/**
 * Auth helpers for Playwright specs (demo accounts from seeds/01_demo_accounts.ts).
 *
 *   await signInAs(page, 'member');                  // browser page with a session cookie
 *   const api = await apiAs(request, 'lead');        // the given request context, signed in by cookie
 *   const api = await bearerContext('viewer');       // a NEW request context sending Authorization: Bearer
 *   await postForm(api, '/groups/harbourlight?/invite', { email, role });   // a form action like a browser
 */
import { expect, request as playwrightRequest, type APIRequestContext, type Page } from '@playwright/test';

export const DEMO_USERS = {
	admin: 'admin@windowsill.test',
	lead: 'lead@windowsill.test',
	member: 'member@windowsill.test',
	viewer: 'viewer@windowsill.test',
	outsider: 'outsider@windowsill.test'
} as const;
export type DemoRole = keyof typeof DEMO_USERS;
export const DEMO_PASSWORD = process.env.DEMO_PASSWORD ?? 'sunlit-bench-demo';

/** The base URL the Playwright config uses (E2E_BASE_URL, else 127.0.0.1:E2E_PORT). */
export function baseURL(): string {
	return process.env.E2E_BASE_URL ?? `http://127.0.0.1:${process.env.E2E_PORT ?? 4173}`;
}

/** Signs a browser page in (the page's context keeps the cookie). */
export async function signInAs(page: Page, role: DemoRole): Promise<void> {
	const r = await page.request.post('/api/auth/signin', { data: { email: DEMO_USERS[role], password: DEMO_PASSWORD } });
	expect(r.status(), `sign-in as ${role}`).toBe(200);
}

/** Signs an existing request context in by cookie and returns it. */
export async function apiAs(request: APIRequestContext, role: DemoRole): Promise<APIRequestContext> {
	const r = await request.post('/api/auth/signin', { data: { email: DEMO_USERS[role], password: DEMO_PASSWORD } });
	expect(r.status(), `sign-in as ${role}`).toBe(200);
	return request;
}

const tokens = new Map<DemoRole, string>();

/** A bearer API token for a demo user (created once per worker through POST /api/tokens). */
export async function tokenFor(role: DemoRole): Promise<string> {
	const cached = tokens.get(role);
	if (cached) return cached;
	const ctx = await playwrightRequest.newContext({ baseURL: baseURL() });
	await apiAs(ctx, role);
	const r = await ctx.post('/api/tokens', { data: { name: `e2e ${role}` } });
	expect(r.status()).toBe(201);
	const { token } = await r.json();
	await ctx.dispose();
	tokens.set(role, token);
	return token;
}

/** A new request context acting as `role` through `Authorization: Bearer`, or anonymous. Dispose it when done. */
export async function bearerContext(role: DemoRole | 'anonymous'): Promise<APIRequestContext> {
	const headers: Record<string, string> = role === 'anonymous' ? {} : { authorization: `Bearer ${await tokenFor(role)}` };
	return playwrightRequest.newContext({ baseURL: baseURL(), extraHTTPHeaders: headers });
}

/**
 * Posts a form action the way a browser without JavaScript does: urlencoded body, same-origin
 * `Origin` header (SvelteKit's CSRF check), HTML accepted, redirects not followed.
 */
export function postForm(ctx: APIRequestContext, path: string, fields: Record<string, string> = {}) {
	return ctx.post(path, { form: fields, headers: { origin: new URL(baseURL()).origin, accept: 'text/html' }, maxRedirects: 0 });
}
