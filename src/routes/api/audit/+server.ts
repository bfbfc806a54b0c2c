import { json } from '@sveltejs/kit';
import { apiHandler } from '$lib/server/http';
import { auditFor, auditToApi } from '$lib/server/services/auditLog';
import type { RequestHandler } from './$types';

/** GET /api/audit `?groupId=&limit=&before=` — lead of the group or admin: the audit log, newest first. */
export const GET: RequestHandler = apiHandler(async ({ locals, url }) => json((await auditFor(locals, Object.fromEntries(url.searchParams))).map(auditToApi)));
