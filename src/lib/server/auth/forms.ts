/** Small helpers shared by the account and group form actions. */

/** The text fields of a form post as a plain object (files are ignored). */
export async function readForm(request: Request): Promise<Record<string, string>> {
	const fd = await request.formData();
	const out: Record<string, string> = {};
	for (const [k, v] of fd) if (typeof v === 'string') out[k] = v;
	return out;
}

/**
 * A same-origin path to continue to after sign-in; anything else becomes `fallback`.
 * Refused: anything not starting with exactly one "/", any control character or whitespace other
 * than a plain space (browsers drop tabs and newlines, so "/\t/evil.example" means "//evil.example"),
 * any backslash (browsers read it as "/"), "//" anywhere in the path part, scheme-like prefixes, and
 * anything that does not resolve to this origin.
 */
export function safeNext(next: string | null | undefined, fallback = '/account'): string {
	if (!next || typeof next !== 'string' || next.length > 2000) return fallback;
	if (!next.startsWith('/') || next.startsWith('//')) return fallback;
	// eslint-disable-next-line no-control-regex
	if (/[\u0000-\u001f\u007f-\u009f\u00a0\u1680\u2000-\u200f\u2028\u2029\u202f\u205f\u3000\ufeff\\]/.test(next)) return fallback;
	let decoded = next;
	try {
		decoded = decodeURIComponent(next);
	} catch {
		return fallback;
	}
	// Encoded tricks: %2F%2F, %5C, %09 after one decoding round.
	// eslint-disable-next-line no-control-regex
	if (decoded.startsWith('//') || /[\u0000-\u001f\u007f\\]/.test(decoded)) return fallback;
	const path = next.split(/[?#]/)[0];
	if (path.includes('//')) return fallback;
	const probe = 'http://windowsill.invalid';
	try {
		const u = new URL(next, probe);
		if (u.origin !== probe) return fallback;
		return u.pathname + u.search + u.hash;
	} catch {
		return fallback;
	}
}

/** Keeps only the non-secret values the user typed, for re-filling a form after an error. */
export function keep<K extends string>(values: Record<string, string>, ...names: K[]): Record<K, string> {
	return Object.fromEntries(names.map((n) => [n, values[n] ?? ''])) as Record<K, string>;
}

/** One field-level message as the `errors` map every form action returns. */
export function errorsOf(field: string, message: string): Record<string, string> {
	return { [field]: message };
}
