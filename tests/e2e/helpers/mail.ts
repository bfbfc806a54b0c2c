/**
 * Reads mail caught by the local fake SMTP server through the admin outbox page.
 *   const link = await latestLink('ana@lab.example.org', '/verify');
 */
import { expect } from '@playwright/test';
import { bearerContext } from './auth';

/** Links in the newest messages to `to` whose path starts with `pathPrefix` (newest first). */
export async function linksTo(to: string, pathPrefix: string): Promise<string[]> {
	const admin = await bearerContext('admin');
	try {
		const r = await admin.get(`/admin/outbox?to=${encodeURIComponent(to)}`);
		expect(r.status()).toBe(200);
		const html = await r.text();
		return [...html.matchAll(/data-testid="outbox-link"[^>]*>([^<]+)</g)]
			.map((m) => m[1].replace(/&amp;/g, '&'))
			.filter((l) => new URL(l).pathname.startsWith(pathPrefix));
	} finally {
		await admin.dispose();
	}
}

/** Waits (up to ~10 s) for a message to `to` with a link under `pathPrefix`; returns the newest such link. */
export async function latestLink(to: string, pathPrefix: string): Promise<string> {
	let links: string[] = [];
	await expect
		.poll(async () => {
			links = await linksTo(to, pathPrefix);
			return links.length;
		}, { timeout: 10_000 })
		.toBeGreaterThan(0);
	return links[0];
}
