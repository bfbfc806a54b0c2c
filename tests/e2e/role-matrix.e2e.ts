/**
 * Runs the role × route matrix (tests/integration/roleMatrix.rows.ts) over HTTP against the
 * built app: each actor gets its own request context (bearer token, or none for anonymous).
 */
import { test, expect, type APIRequestContext } from '@playwright/test';
import { ACTORS, ROLE_MATRIX_ROWS, type Actor } from '../integration/roleMatrix.rows';
import { baseURL, bearerContext, postForm } from './helpers/auth';

const contexts = new Map<Actor, APIRequestContext>();

test.beforeAll(async () => {
	for (const a of ACTORS) contexts.set(a, await bearerContext(a));
});
test.afterAll(async () => {
	for (const c of contexts.values()) await c.dispose();
});

async function call(ctx: APIRequestContext, row: (typeof ROLE_MATRIX_ROWS)[number]) {
	if (row.kind === 'action') return postForm(ctx, row.path, row.form ?? {});
	const body = row.json !== undefined ? { data: row.json } : row.form ? { multipart: row.form } : {};
	const opts = { maxRedirects: 0, headers: { origin: new URL(baseURL()).origin, ...(row.kind === 'page' ? { accept: 'text/html' } : {}) }, ...body };
	return ctx.fetch(row.path, { method: row.method, ...opts });
}

const seen = new Set<string>();
for (const row of ROLE_MATRIX_ROWS) {
	let title = `${row.method} ${row.path} — ${row.name}`;
	while (seen.has(title)) title += ' (again)';
	seen.add(title);
	test(title, async () => {
		const got: Record<string, number> = {};
		for (const actor of ACTORS) got[actor] = (await call(contexts.get(actor)!, row)).status();
		expect(got).toEqual(row.expect);
	});
}
