/**
 * Finds the table inside delimited text: delimiter (',', ';', tab, or any run of spaces/tabs — tried in turn,
 * the first four passed to papaparse explicitly, whitespace split here with double quotes respected), decimal
 * separator, the data block (first run of ≥ 3 all-numeric rows with ≥ 2 fields), the header row just above it,
 * and the preamble (instrument headers, key–value blocks, marker lines).
 */
import Papa from 'papaparse';
import { parseNumberField, stripBom } from './numbers';

export type Delimiter = ',' | ';' | '\t' | ' ';

export interface DelimitedTable {
	/** ' ' means "any run of spaces or tabs" (space-aligned instrument and model exports). */
	delimiter: Delimiter;
	decimalComma: boolean;
	/** All rows; row i is line i + 1 of the original text. */
	rows: string[][];
	/** 0-based row indices of the first and last data rows. */
	dataStart: number;
	dataEnd: number;
	/** 0-based row index of the header, or -1. */
	headerRow: number;
	/** Number of columns of the data block. */
	nColumns: number;
	/** Every data row starts with a text label ("5 min", "sample A") before its numbers: one spectrum per row. */
	labelledRows?: boolean;
}

const trimRow = (r: string[]) => {
	let n = r.length;
	while (n > 0 && r[n - 1].trim() === '') n--;
	return n === r.length ? r : r.slice(0, n);
};

export const isNumericRow = (r: string[], decimalComma: boolean) =>
	r.length >= 2 && r.every((f) => !Number.isNaN(parseNumberField(f, decimalComma)));

const WHITESPACE_FIELD = /"((?:[^"]|"")*)"|(\S+)/g;

/** Splits one line on runs of whitespace; "quoted fields" may contain spaces ("" is a literal quote). */
export function splitWhitespace(line: string): string[] {
	const out: string[] = [];
	WHITESPACE_FIELD.lastIndex = 0;
	let m: RegExpExecArray | null;
	while ((m = WHITESPACE_FIELD.exec(line))) out.push(m[1] !== undefined ? m[1].replace(/""/g, '"') : m[2]);
	return out;
}

function splitAll(clean: string, d: Delimiter): string[][] {
	if (d === ' ') return clean.split('\n').map(splitWhitespace);
	const parsed = Papa.parse<string[]>(clean, { delimiter: d, newline: '\n', skipEmptyLines: false, quoteChar: '"' });
	return parsed.data.map((r) => trimRow(r.map(String)));
}

/** Returns the table, or undefined when no delimiter yields at least 3 numeric rows. */
export function findTable(text: string): DelimitedTable | undefined {
	const clean = stripBom(text).replace(/\r\n|\r/g, '\n');
	let best: { d: Delimiter; dc: boolean; score: number; wide: boolean } | undefined;
	// The delimiter is chosen on the first 600 lines (instrument preambles are shorter); then the whole text is split once.
	let cut = -1;
	for (let k = 0; k < 600; k++) {
		cut = clean.indexOf('\n', cut + 1);
		if (cut < 0) break;
	}
	const sample = cut < 0 ? clean : clean.slice(0, cut);
	// Earlier delimiters win ties: a tab file splits the same on tabs and on whitespace.
	for (const d of [',', ';', '\t', ' '] as Delimiter[]) {
		const rows = splitAll(sample, d);
		for (const dc of d === ',' ? [false] : [false, true]) {
			let score = 0;
			let wide = false;
			for (const r of rows)
				if (isNumericRow(r, dc)) {
					score++;
					if (r.length >= 6) wide = true;
				}
			if (score > (best?.score ?? 0)) best = { d, dc, score, wide };
		}
	}
	// ≥ 3 numeric rows, or fewer wide ones (a short time series written one spectrum per row)
	let labelled = false;
	if (!best || (best.score < 3 && !best.wide)) {
		// rows of numbers behind a text label ("5 min;0.12;0.13;…"): a series written one spectrum per row
		for (const d of [',', ';', '\t'] as Delimiter[]) {
			const rows = splitAll(sample, d);
			for (const dc of d === ',' ? [false] : [false, true]) {
				let score = 0;
				for (const r of rows) if (r.length >= 6 && isNumericRow(r.slice(1), dc)) score++;
				if (score > (best?.score ?? 0)) best = { d, dc, score, wide: true };
			}
		}
		if (!best || best.score < 1) return undefined;
		labelled = true;
	}
	const { dc } = best;
	const rows = splitAll(clean, best.d);
	const n = rows.length;
	const numeric = labelled ? (r: string[]) => r.length >= 6 && isNumericRow(r.slice(1), dc) : (r: string[]) => isNumericRow(r, dc);
	let dataStart = -1;
	// First numeric row followed closely by more: ≥ 3 of the 5 rows from it are numeric (a bad value
	// inside the data must not move the start; it is reported later with its line).
	for (let i = 0; i < n && dataStart < 0; i++) {
		if (!numeric(rows[i])) continue;
		// a row of wavelengths one field short of the rows below is a header whose empty corner cell was lost (whitespace)
		if (!labelled && i + 1 < n && rows[i].length >= 5 && rows[i + 1].length === rows[i].length + 1 && isNumericRow(rows[i + 1], dc)) continue;
		let count = 0;
		for (let k = i; k < n && k < i + 5; k++) if (numeric(rows[k]) && rows[k].length === rows[i].length) count++;
		if (count >= Math.min(3, best.score, best.wide ? 1 : 3)) dataStart = i;
	}
	if (dataStart < 0) return undefined;
	// labelled rows: the first of them may be the header of wavelengths (an empty or text corner, then ascending numbers)
	if (labelled && dataStart + 1 < n && numeric(rows[dataStart + 1]) && ascendingNumbers(rows[dataStart].slice(1), dc)) dataStart++;
	const nColumns = rows[dataStart].length;
	// Data end: last row whose first field is a number (marker and dash lines after it are ignored).
	let dataEnd = dataStart;
	for (let i = dataStart; i < n; i++) if (labelled ? numeric(rows[i]) : !Number.isNaN(parseNumberField(rows[i][0] ?? '', dc))) dataEnd = i;
	let headerRow = -1;
	for (let i = dataStart - 1; i >= 0; i--) {
		if (rows[i].length === 0 || rows[i].every((f) => f.trim() === '')) continue;
		if (rows[i].length >= 2 && !isKeyValueOnly(rows[i], nColumns)) headerRow = i;
		break;
	}
	return { delimiter: best.d, decimalComma: dc, rows, dataStart, dataEnd, headerRow, nColumns, ...(labelled ? { labelledRows: true } : {}) };
}

/** A two-field "KEY value" line above a wider table is a key–value line, not a header. */
function isKeyValueOnly(r: string[], nColumns: number): boolean {
	return nColumns > 2 && r.length === 2 && /^[A-Za-z]/.test(r[0].trim()) && r[1].trim() !== '';
}

function ascendingNumbers(r: string[], dc: boolean): boolean {
	let prev = -Infinity;
	for (const f of r) {
		const v = parseNumberField(f, dc);
		if (!(v > prev)) return false;
		prev = v;
	}
	return r.length >= 5;
}
