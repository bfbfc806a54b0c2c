/** Small helpers shared by the account and group form actions. */

/** The text fields of a form post as a plain object (files are ignored). */
export async function readForm(request: Request): Promise<Record<string, string>> {
	const fd = await request.formData();
	const out: Record<string, string> = {};
	for (const [k, v] of fd) if (typeof v === 'string') out[k] = v;
	return out;
}

/** A same-site path to continue to after sign-in; anything else becomes `fallback`. */
export function safeNext(next: string | null | undefined, fallback = '/account'): string {
	if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
	return next;
}

/** Keeps only the non-secret values the user typed, for re-filling a form after an error. */
export function keep<K extends string>(values: Record<string, string>, ...names: K[]): Record<K, string> {
	return Object.fromEntries(names.map((n) => [n, values[n] ?? ''])) as Record<K, string>;
}

/** One field-level message as the `errors` map every form action returns. */
export function errorsOf(field: string, message: string): Record<string, string> {
	return { [field]: message };
}
