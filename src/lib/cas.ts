/**
 * CAS Registry Numbers: 2–7 digits, 2 digits, 1 check digit (e.g. 7732-18-5). The check digit is the sum of the other
 * digits, each multiplied by its position counted from the right (1, 2, 3 …), modulo 10 (CAS Registry Number
 * verification formula, published by the Chemical Abstracts Service). A query shaped like a CAS number is a CAS
 * look-up: it matches the CAS number exactly, never fuzzily.
 */

const CAS_SHAPE = /^\s*(\d{2,7})-(\d{2})-(\d)\s*$/;

/** True when the text has the shape of a CAS number (whatever its check digit). */
export function isCasShaped(text: string): boolean {
	return CAS_SHAPE.test(text);
}

/** The check digit the first two parts call for, or null when the text is not CAS-shaped. */
export function expectedCasCheckDigit(text: string): number | null {
	const m = CAS_SHAPE.exec(text);
	if (!m) return null;
	const digits = (m[1] + m[2]).split('').reverse();
	return digits.reduce((s, d, i) => s + Number(d) * (i + 1), 0) % 10;
}

/** True for a CAS-shaped text with a correct check digit. */
export function isValidCasNumber(text: string): boolean {
	const m = CAS_SHAPE.exec(text);
	return !!m && expectedCasCheckDigit(text) === Number(m[3]);
}

/** Canonical form (no spaces, no leading zeros in the first part) of a CAS-shaped text, or null. */
export function normaliseCas(text: string): string | null {
	const m = CAS_SHAPE.exec(text);
	if (!m) return null;
	return `${String(Number(m[1]))}-${m[2]}-${m[3]}`;
}

export type CasQuery = { kind: 'not-cas' } | { kind: 'cas'; cas: string } | { kind: 'invalid-cas'; message: string };

/** Classifies a search query: not CAS-shaped (fuzzy search), a valid CAS number (exact match) or a CAS-shaped text with a wrong check digit. */
export function classifyCasQuery(query: string): CasQuery {
	const cas = normaliseCas(query);
	if (!cas) return { kind: 'not-cas' };
	if (isValidCasNumber(cas)) return { kind: 'cas', cas };
	return { kind: 'invalid-cas', message: `${cas} is not a valid CAS number: its check digit should be ${expectedCasCheckDigit(cas)}.` };
}

/** True when a stored CAS number is the queried one (both compared in canonical form). */
export function casEquals(stored: string | null | undefined, cas: string): boolean {
	return !!stored && normaliseCas(stored) === normaliseCas(cas);
}
