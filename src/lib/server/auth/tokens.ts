/**
 * Random secrets for links and API tokens, and their stored form.
 * Only SHA-256 hex digests go to the database; the plain value leaves the server once
 * (in an e-mail or on the screen).
 */
import { sha256 } from '@oslojs/crypto/sha2';
import { encodeBase32LowerCaseNoPadding, encodeHexLowerCase } from '@oslojs/encoding';

/** A URL-safe random secret with `bytes` bytes of entropy (default 20 → 32 base32 chars). */
export function randomSecret(bytes = 20): string {
	const b = new Uint8Array(bytes);
	crypto.getRandomValues(b);
	return encodeBase32LowerCaseNoPadding(b);
}

/** SHA-256 of a secret as 64 lowercase hex characters (what we store). */
export function hashSecret(secret: string): string {
	return encodeHexLowerCase(sha256(new TextEncoder().encode(secret)));
}

/** Lifetimes of the one-time links, in milliseconds. */
export const LIFETIME_MS = {
	emailVerification: 48 * 3600_000,
	passwordReset: 3600_000,
	invitation: 7 * 24 * 3600_000
} as const;

/** A Date `ms` milliseconds from now. */
export const fromNow = (ms: number) => new Date(Date.now() + ms);
