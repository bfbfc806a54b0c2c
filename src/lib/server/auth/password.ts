/**
 * Password hashing with argon2id (@node-rs/argon2). Parameters follow the OWASP Password
 * Storage Cheat Sheet minimum for argon2id: m = 19456 KiB, t = 2, p = 1.
 */
import { hash, verify } from '@node-rs/argon2';

const OPTIONS = { algorithm: 2 /* Argon2id */, memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

/** Hashes a password; the result is a PHC string starting with `$argon2id$`. */
export function hashPassword(password: string): Promise<string> {
	return hash(password, OPTIONS);
}

/** True when `password` matches the stored PHC hash; false on any mismatch or malformed hash. */
export async function verifyPassword(storedHash: string, password: string): Promise<boolean> {
	try {
		return await verify(storedHash, password);
	} catch {
		return false;
	}
}

/**
 * A fixed hash to verify against when no account exists, so a wrong e-mail costs the same time
 * as a wrong password (no timing hint about which accounts exist).
 */
let dummy: Promise<string> | null = null;
export function dummyHash(): Promise<string> {
	dummy ??= hashPassword('windowsill-no-such-account');
	return dummy;
}
