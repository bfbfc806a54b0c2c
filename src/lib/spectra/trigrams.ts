/**
 * Trigrams of names for the Library's n-gram index (`spectrum_terms`), in the manner of trigram
 * similarity indexes: each word is padded with two spaces in front and one behind, so prefixes and
 * short words yield grams too. Text is folded first: NFKD, combining marks dropped, lower case;
 * words are split at white space and / ; | + &, and every other non-letter, non-digit character is
 * removed inside a word ("TWB-7" → "twb7", "1,3-butadiene" → "13butadiene").
 *
 * A gram is packed into an integer < 2^18 (three 6-bit codes: space 0, a–z 1–26, 0–9 27–36, any other
 * letter 37–63 by code point); collisions between rare letters only add candidates, which the fuzzy
 * re-rank then orders on the real text.
 */

/** Folded words of a text (see the module comment). */
export function foldWords(text: string): string[] {
	return text
		.normalize('NFKD')
		.replace(/\p{M}+/gu, '')
		.toLowerCase()
		.split(/[\s/;|+&]+/u)
		.map((w) => w.replace(/[^\p{L}\p{N}]+/gu, ''))
		.filter(Boolean);
}

function code(ch: string): number {
	if (ch === ' ') return 0;
	const c = ch.codePointAt(0)!;
	if (c >= 97 && c <= 122) return c - 96;
	if (c >= 48 && c <= 57) return c - 48 + 27;
	return 37 + (c % 27);
}

/** Distinct packed trigrams of all the texts given. */
export function trigramsOf(...texts: (string | null | undefined)[]): number[] {
	const out = new Set<number>();
	for (const t of texts) {
		if (!t) continue;
		for (const w of foldWords(t)) {
			const chars = [' ', ' ', ...Array.from(w), ' '];
			for (let i = 0; i + 2 < chars.length; i++) out.add(code(chars[i]) * 4096 + code(chars[i + 1]) * 64 + code(chars[i + 2]));
		}
	}
	return [...out];
}

/** The texts of a spectrum that feed the index: name, synonyms (JSON array or list), CAS number. */
export function spectrumTermTexts(row: { name: string; synonyms: string | string[] | null; cas: string | null }): string[] {
	let syn: string[] = [];
	if (Array.isArray(row.synonyms)) syn = row.synonyms;
	else if (row.synonyms) {
		try {
			const v = JSON.parse(row.synonyms);
			if (Array.isArray(v)) syn = v.filter((s) => typeof s === 'string');
		} catch {
			syn = [row.synonyms];
		}
	}
	return [row.name, ...syn, row.cas ?? ''];
}
