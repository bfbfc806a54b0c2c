import { json } from '@sveltejs/kit';
import { apiHandler, notFound, zodToApiError } from '$lib/server/http';
import { requireUser } from '$lib/server/policy';
import { tokenIdSchema } from '$lib/schemas/auth';
import { revokeApiToken } from '$lib/server/db/apiTokens';
import { audit } from '$lib/server/db/audit';
import type { RequestHandler } from './$types';

/** DELETE /api/tokens/:id — revokes one of the caller's tokens; 404 for anyone else's. */
export const DELETE: RequestHandler = apiHandler(async ({ locals, params }) => {
	const user = requireUser(locals);
	const parsed = tokenIdSchema.safeParse({ id: params.id });
	if (!parsed.success) throw zodToApiError(parsed.error);
	if (!(await revokeApiToken(user.id, parsed.data.id))) throw notFound('No such token.');
	await audit({ actorId: user.id, action: 'token.revoke', target: String(parsed.data.id) });
	return json({ ok: true });
});
