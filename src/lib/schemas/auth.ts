/**
 * Zod schemas for account forms and the auth API, shared by form actions and /api routes.
 * Messages name the field in plain words; they never say whether an account exists.
 */
import { z } from 'zod';

/** An e-mail address, trimmed and lower-cased. */
export const emailField = z
	.string({ error: 'Enter an e-mail address.' })
	.trim()
	.toLowerCase()
	.max(254, 'At most 254 characters.')
	.pipe(z.email({ error: 'Enter a valid e-mail address, like name@lab.example.org.' }));

/** A new password: 10–200 characters (long passphrases welcome). */
export const newPasswordField = z
	.string({ error: 'Enter a password.' })
	.min(10, 'Use at least 10 characters.')
	.max(200, 'Use at most 200 characters.');

const nameField = z.string({ error: 'Enter your name.' }).trim().min(1, 'Enter your name.').max(120, 'At most 120 characters.');

/** POST /api/auth/signin and the sign-in form. */
export const signInSchema = z.object({
	email: emailField,
	password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200, 'At most 200 characters.')
});

/** The sign-up form. */
export const signUpSchema = z.object({ name: nameField, email: emailField, password: newPasswordField });

/** Sign-up through an invitation link (the e-mail comes from the invitation). */
export const inviteSignUpSchema = z.object({ name: nameField, password: newPasswordField });

/** The forgot-password form. */
export const forgotSchema = z.object({ email: emailField });

/** The reset-password form. */
export const resetSchema = z
	.object({ token: z.string().min(10, 'This link is incomplete.').max(100), password: newPasswordField, confirm: z.string() })
	.refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });

/** The change-password form on the account page. */
export const changePasswordSchema = z
	.object({ current: z.string().min(1, 'Enter your current password.').max(200), password: newPasswordField, confirm: z.string() })
	.refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });

/** POST /api/tokens and the new-token form. */
export const createTokenSchema = z.object({
	name: z.string({ error: 'Name the token.' }).trim().min(1, 'Name the token, e.g. "plate reader script".').max(80, 'At most 80 characters.')
});

/** Revoking a token by id. */
export const tokenIdSchema = z.object({ id: z.coerce.number({ error: 'No such token.' }).int().positive('No such token.') });

/** Field → first message, for `fail(400, { errors })`. */
export function fieldErrors(error: z.ZodError): Record<string, string> {
	const out: Record<string, string> = {};
	for (const i of error.issues) {
		const k = i.path.map(String).join('.') || 'form';
		out[k] ??= i.message;
	}
	return out;
}
