import { json } from '@sveltejs/kit';
import { ApiError, apiHandler, readJson, zodToApiError } from '$lib/server/http';
import { requireUser } from '$lib/server/policy';
import { createTokenSchema } from '$lib/schemas/auth';
import { createApiToken } from '$lib/server/auth/api-tokens';
import { listApiTokens } from '$lib/server/db/apiTokens';
import type { RequestHandler } from './$types';

/** GET /api/tokens — the caller's tokens (never the secret). */
export const GET: RequestHandler = apiHandler(async ({ locals }) => {
	const user = requireUser(locals);
	return json({ items: await listApiTokens(user.id) });
});

/** POST /api/tokens `{ name }` → 201 `{ token, id, name }`; the token is shown only this once. */
export const POST: RequestHandler = apiHandler(async ({ locals, request }) => {
	const user = requireUser(locals);
	// Tokens cannot make tokens: a stolen token must not be able to outlive its own revocation.
	if (locals.session?.via !== 'cookie') throw new ApiError(403, 'session_required', 'Create API tokens from a signed-in browser session, not with a token.');
	const parsed = createTokenSchema.safeParse(await readJson(request));
	if (!parsed.success) throw zodToApiError(parsed.error);
	const t = await createApiToken(user.id, parsed.data.name);
	return json(t, { status: 201, headers: { 'cache-control': 'no-store' } });
});
