/** Preview of a delimited file for the upload step: how it will be read, before anything is stored. */
import type { ParseIssue, Result } from '../types';
import { NO_TABLE, planDelimited, type DelimitedOptions } from './csv';
import type { ColumnGuess } from './csvColumns';
import type { CsvLayout } from './csvLayout';
import type { Delimiter } from './csvTable';

export interface DelimitedPreview {
	/** ' ' = any run of spaces or tabs. */
	delimiter: Delimiter;
	decimalSeparator: '.' | ',';
	/** One spectrum per column or per row, and why (shown in the preview; the user may switch). */
	layout: CsvLayout;
	layoutReason: string;
	/** Header fields, or null when the table has none. */
	header: string[] | null;
	/** 1-based line of the header and of the first data row. */
	headerLine: number | null;
	dataStartLine: number;
	dataRowCount: number;
	/** Up to `maxRows` data rows as written in the file (at most 12 fields each). */
	firstRows: string[][];
	/** Columns layout: every column with its role, unit, reason when skipped, and whether it is ticked by default. */
	columns: Omit<ColumnGuess, 'guess'>[];
	/** Lines before the header (instrument preamble, marker lines), at most 40. */
	preamble: string[];
	/** Key–value lines understood in the preamble (XUNITS, YUNITS, …). */
	keyValues: { key: string; value: string; line: number }[];
	/** Why the file is not a spectrum (non-optical axis, optical constants), when it is not. */
	refusal: ParseIssue | null;
}

/**
 * Inspects delimited text without building spectra. Never throws.
 * @param maxRows - data rows to return (default 10)
 */
export function inspectDelimited(text: string, maxRows = 10, options: Pick<DelimitedOptions, 'layout' | 'filename'> = {}): Result<DelimitedPreview> {
	try {
		const plan = planDelimited(text, options);
		if (!plan) return { ok: false, issues: [{ severity: 'error', code: 'unsupported_format', message: NO_TABLE }] };
		const { table: t, preamble: pre, layout } = plan;
		const columns = layout.layout === 'rows' ? plan.columns.slice(0, 1) : plan.columns.map(({ guess: _g, ...c }) => c);
		const warnings: ParseIssue[] = [];
		if (layout.layout === 'columns' && !pre.yUnit && !columns.some((c) => c.role === 'y' && c.yUnit)) warnings.push({ severity: 'warning', code: 'y_unit_assumed', message: 'no column names a y unit; choose kind and unit' });
		const headerEnd = t.headerRow >= 0 ? t.headerRow : t.dataStart;
		const cut = (r: string[]) => (r.length > 12 ? [...r.slice(0, 12), '…'] : r);
		return {
			ok: true,
			warnings,
			value: {
				delimiter: t.delimiter,
				decimalSeparator: t.decimalComma ? ',' : '.',
				layout: layout.layout,
				layoutReason: layout.reason,
				header: t.headerRow >= 0 ? cut(t.rows[t.headerRow]) : null,
				headerLine: t.headerRow >= 0 ? t.headerRow + 1 : null,
				dataStartLine: t.dataStart + 1,
				dataRowCount: t.dataEnd - t.dataStart + 1,
				firstRows: t.rows.slice(t.dataStart, Math.min(t.dataEnd + 1, t.dataStart + maxRows)).map(cut),
				columns,
				preamble: t.rows.slice(Math.max(0, headerEnd - 40), headerEnd).map((r) => r.join(t.delimiter === ' ' ? ' ' : t.delimiter)),
				keyValues: pre.keyValues.slice(0, 40),
				refusal: plan.refusal ?? null
			}
		};
	} catch (e) {
		return { ok: false, issues: [{ severity: 'error', code: 'internal_error', message: `preview failed: ${(e as Error)?.message ?? e}` }] };
	}
}
