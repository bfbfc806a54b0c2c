import { fail } from '@sveltejs/kit';
import { changePasswordSchema, createTokenSchema, tokenIdSchema, fieldErrors } from '$lib/schemas/auth';
import { changePassword, sendVerification } from '$lib/server/auth/account';
import { createApiToken } from '$lib/server/auth/api-tokens';
import { createSession } from '$lib/server/auth/session';
import { listApiTokens, revokeApiToken } from '$lib/server/db/apiTokens';
import { groupsOfUser } from '$lib/server/db/groups';
import { audit } from '$lib/server/db/audit';
import { pageUser } from '$lib/server/auth/guard';
import { keep, readForm, errorsOf } from '$lib/server/auth/forms';
import { linkBase } from '$lib/server/mail/send';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = pageUser(event);
	const [tokens, groups] = await Promise.all([listApiTokens(user.id), groupsOfUser(user.id)]);
	return { tokens, groups, emailVerified: user.emailVerified, verified: event.url.searchParams.has('verified') };
};

export const actions: Actions = {
	password: async (event) => {
		const user = pageUser(event);
		const parsed = changePasswordSchema.safeParse(await readForm(event.request));
		if (!parsed.success) return fail(400, { action: 'password', errors: fieldErrors(parsed.error) });
		if (!(await changePassword(user.id, parsed.data.current, parsed.data.password))) {
			return fail(400, { action: 'password', errors: errorsOf('current', 'This is not your current password.') });
		}
		// Every session ended with the change; keep this browser signed in with a fresh one.
		await createSession(user.id, event.cookies, event.url);
		return { action: 'password', done: true };
	},
	createToken: async (event) => {
		const user = pageUser(event);
		const v = await readForm(event.request);
		const parsed = createTokenSchema.safeParse(v);
		if (!parsed.success) return fail(400, { action: 'createToken', ...keep(v, 'name'), errors: fieldErrors(parsed.error) });
		const t = await createApiToken(user.id, parsed.data.name);
		return { action: 'createToken', newToken: t.token, newTokenName: t.name };
	},
	revokeToken: async (event) => {
		const user = pageUser(event);
		const parsed = tokenIdSchema.safeParse(await readForm(event.request));
		if (!parsed.success) return fail(400, { action: 'revokeToken', errors: fieldErrors(parsed.error) });
		if (!(await revokeApiToken(user.id, parsed.data.id))) return fail(404, { action: 'revokeToken', errors: errorsOf('form', 'No such token.') });
		await audit({ actorId: user.id, action: 'token.revoke', target: String(parsed.data.id) });
		return { action: 'revokeToken', done: true };
	},
	resendVerification: async (event) => {
		const user = pageUser(event);
		if (user.emailVerified) return fail(400, { action: 'resendVerification', errors: errorsOf('form', 'Your address is already confirmed.') });
		if (!(await sendVerification(user.id, user.email, user.name, linkBase(event.url)))) {
			return fail(429, { action: 'resendVerification', errors: errorsOf('form', 'Several links went out recently; try again in an hour.') });
		}
		return { action: 'resendVerification', done: true };
	}
};
