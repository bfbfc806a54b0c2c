import { json } from '@sveltejs/kit';
import { apiHandler, readJson } from '$lib/server/http';
import { mailContext } from '$lib/server/services/planHttp';
import { commentOnPlan, planThread } from '$lib/server/services/planReview';
import type { RequestHandler } from './$types';

const shape = (c: Awaited<ReturnType<typeof planThread>>[number]) => ({ id: c.id, kind: c.kind, body: c.body, author: { id: c.authorId, name: c.authorName }, planVersion: c.planVersion, createdAt: c.createdAt });

/** GET /api/plans/:id/comments — viewer+ of the group: the review thread, oldest first. */
export const GET: RequestHandler = apiHandler(async ({ locals, params }) => json((await planThread(locals, params.id)).map(shape)));

/** POST /api/plans/:id/comments `{ body }` — the author, a lead of the group or an admin; mails the other side. */
export const POST: RequestHandler = apiHandler(async ({ locals, params, request, url }) => json(shape(await commentOnPlan(locals, params.id, await readJson(request), mailContext(url))), { status: 201 }));
