/** Preview of a delimited file for the upload step: how it will be read, before anything is stored. */
import type { ParseIssue, Result } from '../types';
import { guessColumns, readPreamble, type ColumnGuess } from './csvColumns';
import { findTable } from './csvTable';

export interface DelimitedPreview {
	delimiter: ',' | ';' | '\t';
	decimalSeparator: '.' | ',';
	/** Header fields, or null when the table has none. */
	header: string[] | null;
	/** 1-based line of the header and of the first data row. */
	headerLine: number | null;
	dataStartLine: number;
	dataRowCount: number;
	/** Up to `maxRows` data rows as written in the file. */
	firstRows: string[][];
	columns: Omit<ColumnGuess, 'guess'>[];
	/** Lines before the header (instrument preamble, marker lines). */
	preamble: string[];
}

/**
 * Inspects delimited text without building spectra. Never throws.
 * @param maxRows - data rows to return (default 10)
 */
export function inspectDelimited(text: string, maxRows = 10): Result<DelimitedPreview> {
	try {
		const t = findTable(text);
		if (!t) return { ok: false, issues: [{ severity: 'error', code: 'unsupported_format', message: 'no table of numbers found (expected x and y columns separated by comma, semicolon or tab)' }] };
		const pre = readPreamble(t);
		const columns = guessColumns(t, pre.guess).map(({ guess: _g, ...c }) => c);
		const warnings: ParseIssue[] = [];
		if (!columns.some((c) => c.role === 'y' && c.yUnit)) warnings.push({ severity: 'warning', code: 'y_unit_assumed', message: 'no column names a y unit; choose kind and unit' });
		const headerEnd = t.headerRow >= 0 ? t.headerRow : t.dataStart;
		return {
			ok: true,
			warnings,
			value: {
				delimiter: t.delimiter,
				decimalSeparator: t.decimalComma ? ',' : '.',
				header: t.headerRow >= 0 ? t.rows[t.headerRow] : null,
				headerLine: t.headerRow >= 0 ? t.headerRow + 1 : null,
				dataStartLine: t.dataStart + 1,
				dataRowCount: t.dataEnd - t.dataStart + 1,
				firstRows: t.rows.slice(t.dataStart, Math.min(t.dataEnd + 1, t.dataStart + maxRows)),
				columns,
				preamble: t.rows.slice(0, headerEnd).map((r) => r.join(t.delimiter))
			}
		};
	} catch (e) {
		return { ok: false, issues: [{ severity: 'error', code: 'internal_error', message: `preview failed: ${(e as Error)?.message ?? e}` }] };
	}
}
