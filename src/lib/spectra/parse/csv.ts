/**
 * Delimited-text reader (CSV, semicolon, tab) built on papaparse: one RawSpectrum per numeric y column
 * (or only `options.columns`). Numbers are parsed here (decimal comma, E-notation), not by papaparse.
 */
import type { ParseIssue, RawSpectrum, Result, SpectrumKind, XUnit, YUnit } from '../types';
import { guessColumns, readPreamble } from './csvColumns';
import { findTable } from './csvTable';
import { parseNumberField } from './numbers';
import { resolveUnits } from './resolveUnits';
import { validatePoints } from './validate';

export interface DelimitedOptions {
	/** 0-based column indices in the file to import as y (default: every numeric y column). */
	columns?: number[];
	xUnit?: XUnit;
	yUnit?: YUnit;
	kind?: SpectrumKind;
}

const fail = (code: string, message: string, line?: number): Result<RawSpectrum[]> => ({ ok: false, issues: [{ severity: 'error', code, message, line }] });

/** Keeps the first two warnings of each code and folds the rest into a count (35 columns, one message). */
function collapse(w: ParseIssue[]): ParseIssue[] {
	const seen = new Map<string, number>();
	const out: ParseIssue[] = [];
	for (const i of w) {
		const n = (seen.get(i.code) ?? 0) + 1;
		seen.set(i.code, n);
		if (n <= 2) out.push(i);
	}
	for (const [code, n] of seen) if (n > 2) out.push({ severity: 'warning', code, message: `…and ${n - 2} more columns with the same warning (${code})` });
	return out;
}

/**
 * Parses delimited text. Never throws; errors name the line (1-based) and column.
 * @returns ok with one spectrum per y column, or the issues that refused the file
 */
export function parseDelimited(text: string, options: DelimitedOptions = {}): Result<RawSpectrum[]> {
	try {
		const t = findTable(text);
		if (!t) return fail('unsupported_format', 'no table of numbers found (expected x and y columns separated by comma, semicolon or tab)');
		const pre = readPreamble(t);
		const cols = guessColumns(t, pre.guess);
		const xCol = cols.find((c) => c.role === 'x')!;
		// photon-energy axes would otherwise pass as µm (1.5–6 fits both): refuse rather than misplace the band
		if (!options.xUnit && /(^|[^a-z])ev([^a-z]|$)|electron.?volt/i.test(xCol.name))
			return fail('unsupported_x_unit', `column ${xCol.index + 1} ("${xCol.name}"): x in electronvolts is not read; export the spectrum against wavelength (nm) or wavenumber (cm⁻¹)`, t.headerRow + 1);
		const warnings: ParseIssue[] = [];
		let yCols = cols.filter((c) => c.role === 'y');
		for (const c of cols) if (c.role === 'skipped' && !options.columns?.includes(c.index)) warnings.push({ severity: 'warning', code: 'column_skipped', message: `column ${c.index + 1}: ${c.note}` });
		if (options.columns) {
			const bad = options.columns.find((i) => !Number.isInteger(i) || i < 0 || i >= t.nColumns || cols[i].role === 'x');
			if (bad !== undefined) return fail('column_out_of_range', `columns: ${bad} is not a y column (the file has columns 0–${t.nColumns - 1}, x is ${xCol.index})`);
			yCols = options.columns.map((i) => cols[i]);
		}
		const first = t.dataStart;
		const trailing = t.rows.slice(t.dataEnd + 1).findIndex((r) => r.some((f) => f.trim() !== ''));
		if (trailing >= 0) warnings.push({ severity: 'warning', code: 'trailing_lines_ignored', message: `lines from ${t.dataEnd + 2 + trailing} on are not data and were ignored`, line: t.dataEnd + 2 + trailing });
		const issues: ParseIssue[] = [];
		const spectra: RawSpectrum[] = [];
		yCols.forEach((c, k) => {
			const x: number[] = [];
			const y: number[] = [];
			const lines: number[] = [];
			const xc = cols[c.xColumn ?? xCol.index] ?? xCol;
			const paired = xc.index !== xCol.index || cols.some((o) => o.role === 'x' && o.index !== xCol.index);
			const label = c.sample ?? (c.name || `column ${c.index + 1}`);
			const what = `column ${c.index + 1}${c.name ? ` ("${c.name}")` : ''}`;
			for (let i = first; i <= t.dataEnd; i++) {
				const r = t.rows[i];
				if (r.length === 0 || r.every((f) => f.trim() === '')) continue;
				// one x/y pair per sample: a shorter sample leaves its pair blank at the end
				if (paired && (r[xc.index] ?? '').trim() === '' && (r[c.index] ?? '').trim() === '') continue;
				x.push(parseNumberField(r[xc.index] ?? '', t.decimalComma));
				y.push(parseNumberField(r[c.index] ?? '', t.decimalComma));
				lines.push(i + 1);
			}
			const units = resolveUnits(x, y, options.xUnit ? undefined : (xc.xUnit ?? xCol.xUnit ?? pre.xUnit), c.guess, pre.kind, { kind: options.kind ?? pre.kind, xUnit: options.xUnit, yUnit: options.yUnit ?? pre.yUnit }, { what });
			const v = validatePoints({ x, y, lines, yUnit: units.yUnit, what });
			issues.push(...v.issues);
			if (!v.value) return;
			warnings.push(...units.warnings);
			spectra.push({ label, index: k, column: c.index, x: v.value.x, y: v.value.y, lines: v.value.lines, xUnit: units.xUnit, yUnit: units.yUnit, kind: units.kind, metadata: { ...pre.metadata, ...(c.sample ? { title: c.sample } : {}) }, xUnitLabel: xc.name || undefined, yUnitLabel: c.name || undefined });
		});
		if (issues.some((i) => i.severity === 'error')) return { ok: false, issues };
		if (!spectra.length) return fail('no_spectrum', 'no y column to import');
		return { ok: true, value: spectra, warnings: collapse([...warnings, ...issues]) };
	} catch (e) {
		return fail('internal_error', `delimited-text reader failed: ${(e as Error)?.message ?? e}`);
	}
}
