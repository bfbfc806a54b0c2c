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

/** Splits one data line into tokens; returns an error message naming the bad character. */
export function tokenizeAsdf(text: string, compressed: boolean): Token[] | string {
	const out: Token[] = [];
	let cur: Token | null = null;
	const flush = () => {
		if (cur) out.push(cur);
		cur = null;
	};
	for (let i = 0; i < text.length; i++) {
		const c = text[i];
		if (c === ' ' || c === '\t' || c === ',' || c === ';' || c === '\f' || c === '\v') {
			flush();
			continue;
		}
		if ((c >= '0' && c <= '9') || c === '.') {
			if (!cur) cur = { kind: 'abs', text: '' };
			if (cur.kind === 'missing') return `a digit after "?" at column ${i + 1}`;
			if (c === '.' && (cur.text.includes('.') || /[eE]/.test(cur.text))) return `a second decimal point at column ${i + 1}`;
			cur.text += c;
			continue;
		}
		if (c === '+' || c === '-') {
			// The sign of an exponent (`4.6e-05`) stays in its number; any other sign starts a new value (PAC).
			if (cur && cur.kind === 'abs' && /[eE]$/.test(cur.text)) {
				cur.text += c;
				continue;
			}
			flush();
			cur = { kind: 'abs', text: c };
			continue;
		}
		if (!compressed && (c === 'e' || c === 'E') && cur && cur.kind === 'abs' && /[0-9.]$/.test(cur.text) && !/[eE]/.test(cur.text) && /^[+-]?\d/.test(text.slice(i + 1, i + 3))) {
			cur.text += c;
			continue;
		}
		let k: number;
		if ((k = SQZ_POS.indexOf(c)) >= 0 || (k = SQZ_NEG.indexOf(c)) >= 0) {
			flush();
			cur = { kind: 'abs', text: (SQZ_POS.includes(c) ? '' : '-') + (SQZ_POS.includes(c) ? k : k + 1) };
			continue;
		}
		if ((k = DIF_POS.indexOf(c)) >= 0 || (k = DIF_NEG.indexOf(c)) >= 0) {
			flush();
			cur = { kind: 'dif', text: (DIF_POS.includes(c) ? '' : '-') + (DIF_POS.includes(c) ? k : k + 1) };
			continue;
		}
		if ((k = DUP.indexOf(c)) >= 0) {
			flush();
			cur = { kind: 'dup', text: String(k + 1) };
			continue;
		}
		if (c === '?') {
			flush();
			out.push({ kind: 'missing', text: '?' });
			continue;
		}
		return `unexpected character "${c}" at column ${i + 1}`;
	}
	flush();
	return out;
}

const NUM = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
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
		if (first.kind !== 'abs' || !NUM.test(first.text)) return fail('not_a_number', `line ${i + 1}: a data line must start with its x value ("${text.slice(0, 40)}")`, i);
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
			if (!NUM.test(tok.text)) return fail('not_a_number', `line ${i + 1}: "${tok.text}" is not a number`, i);
			const v = Number(tok.text);
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
