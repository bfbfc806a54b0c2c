import { listOutbox } from '$lib/server/db/outbox';
import { requireAdmin } from '$lib/server/policy';
import { asPage, pageUser } from '$lib/server/auth/guard';
import type { PageServerLoad } from './$types';

/** Mail captured by the local fake SMTP server; `?to=` filters by recipient. Admins only. */
export const load: PageServerLoad = async (event) => {
	pageUser(event);
	await asPage(event, () => requireAdmin(event.locals));
	const to = (event.url.searchParams.get('to') ?? '').trim().slice(0, 254);
	return { to, messages: await listOutbox({ to: to || undefined, limit: 100 }) };
};
