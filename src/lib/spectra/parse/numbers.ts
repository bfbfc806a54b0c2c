/** Number and text helpers shared by the parsers (no locale guessing beyond the decimal separator). */

const NUMBER_DOT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const NUMBER_COMMA = /^[+-]?(\d+,?\d*|,\d+)([eE][+-]?\d+)?$/;

/**
 * Parses one numeric field strictly (no `parseFloat` prefix tolerance, no "NaN", no "Infinity").
 * @param decimalComma - true when ',' is the decimal separator (default false)
 * @returns the number, or NaN when the field is not a plain decimal / E-notation number
 */
export function parseNumberField(field: string, decimalComma = false): number {
	const t = field.trim();
	if (decimalComma) return NUMBER_COMMA.test(t) ? Number(t.replace(',', '.')) : NaN;
	return NUMBER_DOT.test(t) ? Number(t) : NaN;
}

/** Splits text into lines (CRLF, CR or LF); index i is line i+1. */
export function splitLines(text: string): string[] {
	return text.split(/\r\n|\r|\n/);
}

/** Removes a UTF-8 byte-order mark. */
export function stripBom(text: string): string {
	return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

/**
 * Splits a line of JCAMP-DX AFFN numbers into fields: blanks, commas and ';' separate, and so does the sign of the
 * next value (`1688010-4235230` is two values, JCAMP-DX 4.24 §5.5), except the sign of an exponent (`4.6e-05`).
 */
export function splitAffnFields(text: string): string[] {
	const out: string[] = [];
	let cur = '';
	for (let i = 0; i < text.length; i++) {
		const c = text[i];
		if (c === ' ' || c === '\t' || c === ',' || c === ';') {
			if (cur) out.push(cur);
			cur = '';
		} else if ((c === '+' || c === '-') && cur && !/[eE]$/.test(cur)) {
			out.push(cur);
			cur = c;
		} else cur += c;
	}
	if (cur) out.push(cur);
	return out;
}
