import { json } from '@sveltejs/kit';
import { pingDatabase } from '$lib/server/db/health';
import type { RequestHandler } from './$types';

/** GET /api/health — `{ ok: true, db: "up" }`, or 503 with `db: "down"` while MariaDB is unreachable. */
export const GET: RequestHandler = async () => {
	const up = await pingDatabase();
	return json(up ? { ok: true, db: 'up' } : { ok: false, db: 'down' }, {
		status: up ? 200 : 503,
		headers: { 'cache-control': 'no-store' }
	});
};
