/**
 * Bounded decoder of JCAMP-DX `(X++(Y..Y))` data lines in every legal form (JCAMP-DX 4.24, McDonald & Wilks,
 * Appl. Spectrosc. 42, 151, 1988, §5.9 and the ASDF table):
 *   AFFN  free-format decimals, E-notation (`4.6e-05`), separated by blanks, commas or by the sign of the next
 *         value (`1688010-4235230`, which is PAC);
 *   SQZ   `@ A–I` (0…9) and `a–i` (−1…−9) replace the sign and first digit of an absolute value;
 *   DIF   `% J–R` (0…9) and `j–r` (−1…−9) start a difference from the previous ordinate;
 *   DUP   `S–Z s` (1…9) repeat the previous value (or difference) that many times in all;
 *   `?`   a missing ordinate; `$$` starts a comment anywhere on a line.
 * A line ending in DIF form is followed by a line whose first ordinate repeats the last one (the Y check).
 * The running point count is checked against a budget while decoding, so a DUP count of 10⁸ in a tiny file is
 * refused before any memory is used for it.
 */

export interface AsdfBudget {
	/** Points still allowed for the whole file (global cap minus what earlier blocks used). */
	remaining: number;
	/** The global cap, for messages. */
	cap: number;
}

export interface AsdfLine {
	/** 0-based line index in the file. */
	line: number;
	/** The abscissa written at the start of the line (times XFACTOR applied by the caller). */
	x: number;
	/** Index of the point the abscissa belongs to (the check point for a Y-checked line). */
	index: number;
}

export type AsdfResult =
	| { ok: true; y: number[]; lines: number[]; starts: AsdfLine[]; missing: number[]; warnings: string[] }
	| { ok: false; code: string; message: string; line: number };

/** Decoding options. */
export interface AsdfOptions {
	/** NPOINTS when the block states it: decoding stops once the count runs clearly past it. */
	nPoints?: number;
	budget: AsdfBudget;
}

/** Points a block may decode beyond its NPOINTS before it is refused (≥ 16, 10 %; common practice for damaged files). */
export const npointsOverrun = (n: number) => n + Math.max(16, Math.ceil(n * 0.1));

const SQZ_POS = '@ABCDEFGHI';
const SQZ_NEG = 'abcdefghi';
const DIF_POS = '%JKLMNOPQR';
const DIF_NEG = 'jklmnopqr';
const DUP = 'STUVWXYZs';
/** Compression letters other than e/E (which double as exponent markers). */
const COMPRESSION_NOT_E = /[@ABCDFGHIabcdfghi%J-Rj-rS-Zs]/;

type Token = { kind: 'abs' | 'dif' | 'dup' | 'missing'; text: string };

/** Removes a `$$` comment. */
export const stripComment = (s: string) => {
	const k = s.indexOf('$$');
	return k < 0 ? s : s.slice(0, k);
};

/** True when the data lines use a compression letter other than e/E: then e/E are SQZ characters, not exponents. */
export function usesCompression(lines: string[], from: number, to: number): boolean {
	for (let i = from; i <= to; i++) if (COMPRESSION_NOT_E.test(stripComment(lines[i]))) return true;
	return false;
}

/** Character classes for the tokenizer: 1 digit, 2 '.', 3 sign, 4 separator, 5 SQZ, 6 DIF, 7 DUP, 8 '?', 9 e/E. */
const CLASS = new Uint8Array(128);
for (let c = 48; c <= 57; c++) CLASS[c] = 1;
CLASS[46] = 2;
CLASS[43] = CLASS[45] = 3;
for (const c of ' \t,;\f\v') CLASS[c.charCodeAt(0)] = 4;
for (const c of SQZ_POS + SQZ_NEG) CLASS[c.charCodeAt(0)] = 5;
for (const c of DIF_POS + DIF_NEG) CLASS[c.charCodeAt(0)] = 6;
for (const c of DUP) CLASS[c.charCodeAt(0)] = 7;
CLASS[63] = 8;
const LETTER_VALUE = new Int8Array(128);
for (let k = 0; k < 10; k++) (LETTER_VALUE[SQZ_POS.charCodeAt(k)] = k), (LETTER_VALUE[DIF_POS.charCodeAt(k)] = k);
for (let k = 0; k < 9; k++) (LETTER_VALUE[SQZ_NEG.charCodeAt(k)] = -(k + 1)), (LETTER_VALUE[DIF_NEG.charCodeAt(k)] = -(k + 1)), (LETTER_VALUE[DUP.charCodeAt(k)] = k + 1);

/**
 * Splits one data line into tokens; returns an error message naming the bad character.
 * @param compressed - true when the block uses ASDF letters (then e/E are SQZ −5/+5, never exponents)
 */
export function tokenizeAsdf(text: string, compressed: boolean): Token[] | string {
	const out: Token[] = [];
	let kind: Token['kind'] | null = null;
	let prefix = '';
	let from = 0;
	let dot = false;
	let exp = false;
	const n = text.length;
	for (let i = 0; i <= n; i++) {
		const code = i < n ? text.charCodeAt(i) : 32;
		let cls = code < 128 ? CLASS[code] : 0;
		if ((code === 101 || code === 69) && !compressed) cls = 9;
		if (cls === 1) {
			if (kind === null) (kind = 'abs'), (prefix = ''), (from = i), (dot = false), (exp = false);
			continue;
		}
		if (cls === 2) {
			if (kind === null) (kind = 'abs'), (prefix = ''), (from = i), (dot = false), (exp = false);
			else if (dot || exp || kind === 'dup') return `a misplaced decimal point at column ${i + 1}`;
			dot = true;
			continue;
		}
		if (cls === 9) {
			// An exponent only right after a digit or '.' of a plain number, followed by [+-]digit or a digit.
			const next = i + 1 < n ? text.charCodeAt(i + 1) : 0;
			const after = next === 43 || next === 45 ? (i + 2 < n ? text.charCodeAt(i + 2) : 0) : next;
			if (kind === 'abs' && !exp && after >= 48 && after <= 57) {
				exp = true;
				if (next === 43 || next === 45) i++;
				continue;
			}
			cls = 5; // not an exponent: the SQZ letter e/E
		}
		// Any other character ends the current token.
		if (kind !== null) {
			out.push({ kind, text: prefix + text.slice(from, i) });
			kind = null;
		}
		if (cls === 4 || i === n) continue;
		if (cls === 3) {
			kind = 'abs';
			prefix = code === 45 ? '-' : '';
			from = i + 1;
			dot = false;
			exp = false;
			// A bare sign must be followed by a digit or '.'.
			const next = i + 1 < n ? CLASS[text.charCodeAt(i + 1)] ?? 0 : 0;
			if (next !== 1 && next !== 2) return `a sign without a number at column ${i + 1}`;
			continue;
		}
		if (cls === 5 || cls === 6 || cls === 7) {
			const v = LETTER_VALUE[code];
			kind = cls === 5 ? 'abs' : cls === 6 ? 'dif' : 'dup';
			prefix = v < 0 ? `-${-v}` : String(v);
			from = i + 1;
			dot = false;
			exp = false;
			continue;
		}
		if (cls === 8) {
			out.push({ kind: 'missing', text: '?' });
			continue;
		}
		return `unexpected character "${text[i]}" at column ${i + 1}`;
	}
	return out;
}

const same = (a: number, b: number) => Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(a), Math.abs(b));

/**
 * Decodes the data lines `from`…`to` (0-based, inclusive; `##` lines end the data).
 * @returns ordinates (before YFACTOR), the 0-based line of each point and the abscissa of each line start
 */
export function decodeAsdf(lines: string[], from: number, to: number, opts: AsdfOptions): AsdfResult {
	const compressed = usesCompression(lines, from, to);
	const limit = Math.min(opts.budget.remaining, opts.nPoints !== undefined ? npointsOverrun(opts.nPoints) : Infinity);
	const y: number[] = [];
	const at: number[] = [];
	const starts: AsdfLine[] = [];
	const missing: number[] = [];
	const warnings: string[] = [];
	let prevEndedDif = false;
	let last = NaN;
	const fail = (code: string, message: string, line: number): AsdfResult => ({ ok: false, code, message, line: line + 1 });
	const overrun = (i: number, extra: number): AsdfResult | undefined => {
		if (y.length + extra <= limit) return undefined;
		if (limit < opts.budget.remaining) return fail('npoints_exceeded', `line ${i + 1}: the data expand past the ${opts.nPoints} points NPOINTS declares (damaged compressed data?)`, i);
		return fail('too_many_points', `line ${i + 1}: the data expand past ${opts.budget.cap.toLocaleString('en')} points, the limit for one file`, i);
	};
	for (let i = from; i <= to; i++) {
		const text = stripComment(lines[i]).trim();
		if (!text) continue;
		if (text.startsWith('##')) break;
		const tokens = tokenizeAsdf(text, compressed);
		if (typeof tokens === 'string') return fail('not_a_number', `line ${i + 1}: ${tokens} ("${text.slice(0, 40)}")`, i);
		if (!tokens.length) continue;
		const first = tokens[0];
		if (first.kind !== 'abs' || Number.isNaN(Number(first.text))) return fail('not_a_number', `line ${i + 1}: a data line must start with its x value ("${text.slice(0, 40)}")`, i);
		const x = Number(first.text);
		let checkPending = prevEndedDif;
		let prev: { kind: 'abs' | 'dif' | 'missing'; v: number } | null = null;
		let endedDif = false;
		starts.push({ line: i, x, index: checkPending ? y.length - 1 : y.length });
		for (let t = 1; t < tokens.length; t++) {
			const tok = tokens[t];
			if (tok.kind === 'dup') {
				if (!/^\d+$/.test(tok.text)) return fail('not_a_number', `line ${i + 1}: bad repeat count "${tok.text}"`, i);
				const n = Number(tok.text);
				if (!prev) return fail('not_a_number', `line ${i + 1}: a repeat count with nothing to repeat`, i);
				if (n < 1) return fail('not_a_number', `line ${i + 1}: a repeat count of 0`, i);
				const o = overrun(i, n - 1);
				if (o) return o;
				for (let r = 1; r < n; r++) {
					if (prev.kind === 'dif') last += prev.v;
					else if (prev.kind === 'missing') missing.push(y.length);
					y.push(prev.kind === 'missing' ? NaN : prev.kind === 'abs' ? prev.v : last);
					at.push(i);
				}
				continue;
			}
			if (tok.kind === 'missing') {
				checkPending = false;
				const o = overrun(i, 1);
				if (o) return o;
				missing.push(y.length);
				y.push(NaN);
				at.push(i);
				prev = { kind: 'missing', v: NaN };
				endedDif = false;
				continue;
			}
			const v = Number(tok.text);
			if (Number.isNaN(v)) return fail('not_a_number', `line ${i + 1}: "${tok.text}" is not a number`, i);
			if (!Number.isFinite(v)) return fail('not_finite', `line ${i + 1}: "${tok.text}" is too large to be a number`, i);
			if (tok.kind === 'dif') {
				if (!Number.isFinite(last)) return fail('not_a_number', `line ${i + 1}: a difference (DIF) without a value before it`, i);
				checkPending = false;
				last += v;
				prev = { kind: 'dif', v };
				endedDif = true;
			} else {
				endedDif = false;
				prev = { kind: 'abs', v };
				if (checkPending) {
					// Y check: the first ordinate repeats the last one of the previous line; it is not a new point.
					checkPending = false;
					if (!same(v, last)) return fail('y_check_failed', `line ${i + 1}: the Y check value ${v} does not repeat the previous line's last value ${last} (damaged data)`, i);
					continue;
				}
				last = v;
			}
			const o = overrun(i, 1);
			if (o) return o;
			y.push(last);
			at.push(i);
		}
		prevEndedDif = endedDif;
	}
	if (missing.length) warnings.push(`${missing.length} missing value(s) ("?") dropped, first on line ${at[missing[0]] + 1}`);
	return { ok: true, y, lines: at, starts, missing, warnings };
}
