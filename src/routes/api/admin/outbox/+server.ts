import { json } from '@sveltejs/kit';
import { ApiError, apiHandler, notFound } from '$lib/server/http';
import { listOutbox } from '$lib/server/db/outbox';
import { requireAdmin } from '$lib/server/policy';
import type { RequestHandler } from './$types';

/**
 * GET /api/admin/outbox `?to=&limit=` — admins, development and test only: what the local fake SMTP server received,
 * newest first. In production (NODE_ENV=production without WINDOWSILL_DEMO=1) mail goes to real SMTP and this is 404.
 */
export const GET: RequestHandler = apiHandler(async ({ locals, url }) => {
	requireAdmin(locals);
	if (process.env.NODE_ENV === 'production' && process.env.WINDOWSILL_DEMO !== '1') throw notFound('The outbox exists only in development and tests.');
	const to = (url.searchParams.get('to') ?? '').trim().slice(0, 254);
	const limitRaw = url.searchParams.get('limit');
	const limit = limitRaw === null || limitRaw === '' ? 50 : Number(limitRaw);
	if (!Number.isInteger(limit) || limit < 1 || limit > 500) throw new ApiError(400, 'invalid', 'limit: a whole number from 1 to 500.', { field: 'limit' });
	const rows = await listOutbox({ to: to || undefined, limit });
	return json(rows.map((m) => ({ to: m.to, subject: m.subject, text: m.text, receivedAt: m.receivedAt, from: m.from, links: m.links })));
});
