/**
 * Delimited-text reader (CSV, semicolon, tab, runs of spaces): tries the table both ways round (csvLayout), reads the
 * units the file states (headers, key–value blocks, unit words in column names) with their scale and Jacobian,
 * skips columns that are not spectra, and refuses values that cannot be physical. Numbers are parsed here
 * (decimal comma, E-notation), not by papaparse. Pure: no I/O; the result is structured-clonable.
 */
import type { ParseIssue, RawSpectrum, Result, SpectrumKind, XUnit, YUnit } from '../types';
import { HC_EV_NM, Y_UNIT_TEXT } from '../units';
import { columnConsensus, guessColumns, readPreamble, type ColumnGuess, type Preamble } from './csvColumns';
import { chooseLayout, headerNumbers, type CsvLayout, type LayoutChoice } from './csvLayout';
import { checkXRangeNm, checkYPlausible } from './csvPhysical';
import { findTable, type DelimitedTable } from './csvTable';
import { KIND_OF_Y, nonOpticalAxis, opticalConstantRole, timeUnitSeconds, toNm, X_UNIT_NAMES, yUnitOfHeader, type HeaderXUnit, type HeaderYUnit } from './csvUnits';
import { parseNumberField } from './numbers';
import { resolveUnits } from './resolveUnits';
import { validatePoints } from './validate';

export interface DelimitedOptions {
	/** Columns layout: 0-based column indices in the file to import as y (default: every ticked y column). */
	columns?: number[];
	xUnit?: XUnit;
	yUnit?: YUnit;
	kind?: SpectrumKind;
	/** One spectrum per column or per row (default: detected). */
	layout?: CsvLayout;
	/** Caller's concentration and path (for the ε plausibility check only; index.ts copies them into metadata). */
	concentrationM?: number;
	pathCm?: number;
	/** File name: a last hint for the y quantity ("…_irrad.txt", "…_abs.csv") when nothing else states it. */
	filename?: string;
}

const fail = (code: string, message: string, line?: number): Result<RawSpectrum[]> => ({ ok: false, issues: [{ severity: 'error', code, message, line }] });
export const NO_TABLE = 'no table of numbers found (expected x and y columns separated by comma, semicolon, tab or spaces)';

/** Keeps the first two warnings of each code and folds the rest into a count (35 columns, one message). */
function collapse(w: ParseIssue[]): ParseIssue[] {
	const seen = new Map<string, number>();
	const out: ParseIssue[] = [];
	for (const i of w) {
		const n = (seen.get(i.code) ?? 0) + 1;
		seen.set(i.code, n);
		if (n <= 2) out.push(i);
	}
	for (const [code, n] of seen) if (n > 2) out.push({ severity: 'warning', code, message: `…and ${n - 2} more spectra with the same warning (${code})` });
	return out;
}

/** Errors only, the first three of each code, then one line counting the rest (72 columns, one message). */
function collapseErrors(all: ParseIssue[]): ParseIssue[] {
	const errors = all.filter((i) => i.severity === 'error');
	const seen = new Map<string, number>();
	const out: ParseIssue[] = [];
	for (const i of errors) {
		const n = (seen.get(i.code) ?? 0) + 1;
		seen.set(i.code, n);
		if (n <= 3) out.push(i);
	}
	for (const [code, n] of seen) if (n > 3) out.push({ severity: 'error', code, message: `…and ${n - 3} more with the same problem` });
	return out;
}

/** y quantity from the file name's words, when nothing in the file states one. */
function filenameHint(name: string | undefined): HeaderYUnit | undefined {
	if (!name) return undefined;
	const w = name.toLowerCase().replace(/\.[a-z0-9]+$/, '').split(/[^a-z%]+/);
	if (w.some((s) => /^irrad/.test(s))) return { yUnit: 'W/m2/nm', kind: 'emission', scale: 1, as: 'irradiance (file name)' };
	if (w.some((s) => /^(abs|absorbance|absorption)$/.test(s))) return { yUnit: 'absorbance', kind: 'absorption', scale: 1, as: 'absorbance (file name)' };
	return undefined;
}

/** The y unit every unnamed column falls back to: what the preamble states, else the named columns' consensus. */
function fileFallback(pre: Preamble): HeaderYUnit | undefined {
	if (pre.yUnit) return { yUnit: pre.yUnit, kind: KIND_OF_Y[pre.yUnit], scale: 1 };
	return pre.guess;
}

export interface DelimitedPlan {
	table: DelimitedTable;
	preamble: Preamble;
	layout: LayoutChoice;
	/** Columns layout: every column's role; rows layout: the corner column as label and one entry per wavelength column. */
	columns: ColumnGuess[];
	/** Refusal found while planning (non-optical table, optical constants). */
	refusal?: ParseIssue;
}

/** Plans how a table is read (shared by the reader and the preview). Never throws. */
export function planDelimited(text: string, options: Pick<DelimitedOptions, 'layout' | 'filename'> = {}): DelimitedPlan | undefined {
	const t = findTable(text);
	if (!t) return undefined;
	const pre = readPreamble(t);
	const layout = chooseLayout(t, options.layout);
	if (layout.layout === 'rows') {
		const nums = headerNumbers(t) ?? [];
		const columns: ColumnGuess[] = [{ index: 0, name: (t.rows[t.headerRow]?.[0] ?? '').trim(), role: 'skipped', note: 'row labels (times)' }, ...nums.map((v, i): ColumnGuess => ({ index: i + 1, name: String(v), role: 'x' }))];
		return { table: t, preamble: pre, layout, columns };
	}
	let cols = guessColumns(t, fileFallback(pre), pre);
	if (!fileFallback(pre)) {
		const agreed = columnConsensus(cols) ?? filenameHint(options.filename);
		if (agreed) cols = guessColumns(t, agreed, pre);
	}
	const plan: DelimitedPlan = { table: t, preamble: pre, layout, columns: cols };
	const x = cols.find((c) => c.role === 'x')!;
	const headerLine = t.headerRow >= 0 ? t.headerRow + 1 : undefined;
	const what = x.name ? `column ${x.index + 1} ("${x.name}")` : `column ${x.index + 1}`;
	const axis = nonOpticalAxis(x.name);
	if (axis && !x.headerXUnit) plan.refusal = { severity: 'error', code: 'not_optical_table', message: `${what} is a ${axis} axis: this is a ${axis} table, not an optical spectrum (expected wavelength, wavenumber or photon energy)`, line: headerLine };
	const nk = cols.filter((c) => c.role !== 'x' && opticalConstantRole(c.name));
	if (nk.some((c) => opticalConstantRole(c.name) === 'n') && nk.some((c) => opticalConstantRole(c.name) === 'k'))
		plan.refusal = { severity: 'error', code: 'optical_constants_table', message: `the columns ${nk.map((c) => `"${c.name}"`).join(' and ')} are optical constants (refractive index n and extinction coefficient k), not spectra; add the material as a wall from its n, k data instead`, line: headerLine };
	return plan;
}

/**
 * Parses delimited text. Never throws; errors name the line (1-based) and column.
 * @returns ok with one spectrum per y column (or per row), or the issues that refused the file
 */
export function parseDelimited(text: string, options: DelimitedOptions = {}): Result<RawSpectrum[]> {
	try {
		const plan = planDelimited(text, options);
		if (!plan) return fail('unsupported_format', NO_TABLE);
		if (plan.refusal) return { ok: false, issues: [plan.refusal] };
		return plan.layout.layout === 'rows' ? readRows(plan, options) : readColumns(plan, options);
	} catch (e) {
		return fail('internal_error', `delimited-text reader failed: ${(e as Error)?.message ?? e}`);
	}
}

interface Built {
	x: number[];
	y: number[];
	lines: number[];
}

/** Converts an Å or eV axis to nm in place (with the Jacobian hc/λ² for densities per eV); returns the reader's unit. */
function convertAxis(b: Built, unit: HeaderXUnit | undefined, density: boolean, warnings: ParseIssue[], what: string): XUnit | undefined {
	if (unit === 'angstrom') {
		for (let i = 0; i < b.x.length; i++) b.x[i] = b.x[i] / 10;
		return 'nm';
	}
	if (unit === 'ev') {
		for (let i = 0; i < b.x.length; i++) {
			const nm = HC_EV_NM / b.x[i];
			// per-eV spectral density → per nm: I_λ = I_E·|dE/dλ| = I_E·hc/λ² (hc in eV nm, CODATA 2018)
			if (density) b.y[i] = b.y[i] * (HC_EV_NM / (nm * nm));
			b.x[i] = nm;
		}
		warnings.push({ severity: 'warning', code: 'x_converted', message: `${what}: x in eV converted to nm (λ = hc/E)${density ? ', y per eV converted to per nm (× hc/λ²)' : ''}` });
		return 'nm';
	}
	return unit === undefined ? undefined : unit;
}

/** Finishes one spectrum: units, plausibility, x range, validation. Pushes issues/warnings; returns the spectrum or undefined. */
function finish(
	b: Built,
	opts: { what: string; label: string; index: number; column?: number; fileX: XUnit | undefined; guess: HeaderYUnit | undefined; pre: Preamble; options: DelimitedOptions; xLabel?: string; yLabel?: string; assumedNote?: string },
	issues: ParseIssue[],
	warnings: ParseIssue[]
): RawSpectrum | undefined {
	const { what, options, pre } = opts;
	// a number too large for a double ("1e999"), or one that overflows when scaled or converted: physically meaningless
	for (let i = 0; i < b.x.length; i++) {
		const bad = b.x[i] === Infinity || b.x[i] === -Infinity ? 'x' : b.y[i] === Infinity || b.y[i] === -Infinity ? 'y' : undefined;
		if (bad) {
			issues.push({ severity: 'error', code: 'not_finite_after_conversion', message: `${what}: ${bad} on line ${b.lines[i]} is not a finite number after unit conversion`, line: b.lines[i] || undefined });
			return undefined;
		}
	}
	let guess = opts.guess;
	// reflectance and transmittance of unknown scale: percent when any value exceeds 1.5 (common practice)
	if (guess?.yUnit === 'reflectance' && guess.transmittanceScaleUnknown) {
		let max = -Infinity;
		for (const v of b.y) if (v > max) max = v;
		if (max > 1.5) guess = { ...guess, yUnit: 'reflectance-percent', transmittanceScaleUnknown: false };
	}
	const units = resolveUnits(b.x, b.y, options.xUnit ? undefined : opts.fileX, options.yUnit ? undefined : guess, pre.kind, { kind: options.kind ?? pre.kind, xUnit: options.xUnit, yUnit: options.yUnit ?? pre.yUnit }, { what });
	if (guess?.kind === 'reflectance' && !options.yUnit && !options.kind) {
		units.kind = 'reflectance';
		units.yUnit = guess.yUnit;
	}
	const stated = !!(options.yUnit || pre.yUnit || guess);
	const xNm = b.x.map((v) => (units.xUnit === 'um' ? v * 1000 : units.xUnit === 'cm-1' ? 1e7 / v : v));
	const range = checkXRangeNm(xNm, b.lines, what, b.x);
	const bad = range.issues.filter((i) => i.severity === 'error');
	if (bad.length) {
		issues.push(...bad);
		return undefined;
	}
	const [from, to] = range.keep;
	const x = b.x.slice(from, to), y = b.y.slice(from, to), lines = b.lines.slice(from, to);
	if (to - from < b.x.length) {
		// the unit warnings of the kept part (a dropped far-IR tail must not make the axis look unusual)
		const again = resolveUnits(x, y, options.xUnit ? undefined : opts.fileX, options.yUnit ? undefined : guess, pre.kind, { kind: options.kind ?? pre.kind, xUnit: options.xUnit, yUnit: options.yUnit ?? pre.yUnit }, { what });
		units.warnings = again.warnings;
	}
	const yBad = checkYPlausible(y, lines, units.yUnit, what, stated, { c: options.concentrationM ?? pre.metadata.concentrationM, l: options.pathCm ?? pre.metadata.pathCm });
	if (yBad.length) {
		issues.push(...yBad);
		return undefined;
	}
	const v = validatePoints({ x, y, lines, yUnit: units.yUnit, what });
	issues.push(...v.issues);
	if (!v.value) return undefined;
	warnings.push(...range.issues, ...units.warnings.filter((w) => !(opts.assumedNote && w.code === 'y_unit_assumed')));
	if (opts.assumedNote) warnings.push({ severity: 'warning', code: 'y_unit_inferred', message: `${what}: ${opts.assumedNote}` });
	return { label: opts.label, index: opts.index, column: opts.column, x: v.value.x, y: v.value.y, lines: v.value.lines, xUnit: units.xUnit, yUnit: units.yUnit, kind: units.kind, metadata: { ...pre.metadata }, xUnitLabel: opts.xLabel, yUnitLabel: opts.yLabel };
}

/** When nothing states the y quantity: detector counts under a spectrometer header when the values are large. */
function dataGuess(pre: Preamble, y: number[]): { guess?: HeaderYUnit; note?: string } {
	let max = -Infinity;
	for (const v of y) if (v > max) max = v;
	if (pre.instrumentHeader && max > 10) return { guess: { yUnit: 'counts', kind: 'emission', scale: 1 }, note: `no unit stated; values up to ${max} under a spectrometer header read as detector counts (emission) — please confirm` };
	return {};
}

function readColumns(plan: DelimitedPlan, options: DelimitedOptions): Result<RawSpectrum[]> {
	const { table: t, preamble: pre, columns: cols } = plan;
	const xCol = cols.find((c) => c.role === 'x')!;
	const warnings: ParseIssue[] = [];
	let yCols = cols.filter((c) => c.role === 'y' && c.ticked !== false);
	for (const c of cols) if ((c.role === 'skipped' || c.role === 'axis') && !options.columns?.includes(c.index)) warnings.push({ severity: 'warning', code: 'column_skipped', message: `column ${c.index + 1}${c.name ? ` ("${c.name}")` : ''}: ${c.note}` });
	if (options.columns) {
		const bad = options.columns.find((i) => !Number.isInteger(i) || i < 0 || i >= t.nColumns || cols[i].role === 'x' || cols[i].role === 'axis');
		if (bad !== undefined) return fail('column_out_of_range', `columns: ${bad} is not a y column (the file has columns 0–${t.nColumns - 1}; ${cols.filter((c) => c.role === 'x' || c.role === 'axis').map((c) => c.index).join(', ')} ${cols.filter((c) => c.role === 'x' || c.role === 'axis').length > 1 ? 'are axes' : 'is the axis'})`);
		yCols = options.columns.map((i) => cols[i]);
	}
	if (!yCols.length) return fail('no_spectrum', `no column holds a spectrum: ${cols.filter((c) => c.note).map((c) => `column ${c.index + 1} — ${c.note}`).join('; ') || 'only an axis'}`);
	const trailing = t.rows.slice(t.dataEnd + 1).findIndex((r) => r.some((f) => f.trim() !== ''));
	if (trailing >= 0) warnings.push({ severity: 'warning', code: 'trailing_lines_ignored', message: `lines from ${t.dataEnd + 2 + trailing} on are not data and were ignored`, line: t.dataEnd + 2 + trailing });
	const issues: ParseIssue[] = [];
	const spectra: RawSpectrum[] = [];
	const paired = cols.filter((o) => o.role === 'x').length > 1;
	yCols.forEach((c, k) => {
		const xc = cols[c.xColumn ?? xCol.index] ?? xCol;
		const label = c.sample ?? (c.name || `column ${c.index + 1}`);
		const what = `column ${c.index + 1}${c.name ? ` ("${c.name}")` : ''}`;
		const b: Built = { x: [], y: [], lines: [] };
		for (let i = t.dataStart; i <= t.dataEnd; i++) {
			const r = t.rows[i];
			if (r.length === 0 || r.every((f) => f.trim() === '')) continue;
			// one x/y pair per sample: a shorter sample leaves its pair blank at the end
			if ((paired || xc.index !== xCol.index) && (r[xc.index] ?? '').trim() === '' && (r[c.index] ?? '').trim() === '') continue;
			b.x.push(parseNumberField(r[xc.index] ?? '', t.decimalComma));
			b.y.push(parseNumberField(r[c.index] ?? '', t.decimalComma));
			b.lines.push(i + 1);
		}
		let guess = options.yUnit ? undefined : c.guess;
		let note: string | undefined;
		if (!guess && !options.yUnit && !pre.yUnit) ({ guess, note } = dataGuess(pre, b.y));
		else if (guess?.as?.endsWith('(file name)')) note = `no unit stated in the file; read as ${guess.yUnit === 'W/m2/nm' ? 'spectral irradiance, W m⁻² nm⁻¹' : guess.yUnit} because the file name says so — please confirm`;
		if (guess && guess.scale !== 1 && !options.yUnit) {
			for (let i = 0; i < b.y.length; i++) b.y[i] *= guess.scale;
			warnings.push({ severity: 'warning', code: 'y_scaled', message: `${what}: ${c.name ? 'values' : guess.as ?? 'values'} converted to ${Y_UNIT_TEXT[guess.yUnit] ?? guess.yUnit} (× ${guess.scale})` });
		}
		const density = !!guess && (guess.kind === 'emission' || guess.perX === 'ev');
		const fileX = options.xUnit ? undefined : convertAxis(b, xc.headerXUnit, density, warnings, what) ?? xc.xUnit;
		const s = finish(b, { what, label, index: k, column: c.index, fileX: xc.headerXUnit || !options.xUnit ? fileX : undefined, guess, pre, options, xLabel: xc.name || undefined, yLabel: c.name || undefined, assumedNote: note }, issues, warnings);
		if (!s) return;
		if (c.sample) s.metadata.title = c.sample;
		spectra.push(s);
	});
	if (issues.some((i) => i.severity === 'error')) return { ok: false, issues: collapseErrors(issues) };
	if (!spectra.length) return fail('no_spectrum', 'no y column to import');
	return { ok: true, value: spectra, warnings: collapse([...warnings, ...issues]) };
}

const TIME_NAME: Record<number, string> = { 1e-6: 'µs', 1e-3: 'ms', 1: 's', 60: 'min', 3600: 'h', 86400: 'd' };

/** Rows layout: a header row of wavelengths, one spectrum per data row; the first field is the row's label (a time). */
function readRows(plan: DelimitedPlan, options: DelimitedOptions): Result<RawSpectrum[]> {
	const { table: t, preamble: pre, layout } = plan;
	const nums = headerNumbers(t)!;
	const warnings: ParseIssue[] = [];
	const issues: ParseIssue[] = [];
	const spectra: RawSpectrum[] = [];
	const unitS = layout.timeUnitS ?? 1;
	const guess = options.yUnit ? undefined : fileFallback(pre) ?? filenameHint(options.filename);
	const headerXUnit = pre.xUnit ?? layout.xUnit;
	let assumedTime = false;
	for (let i = t.dataStart, k = 0; i <= t.dataEnd; i++) {
		const r = t.rows[i];
		if (r.length === 0 || r.every((f) => f.trim() === '')) continue;
		const cell = (r[0] ?? '').trim();
		const b: Built = { x: nums.slice(), y: nums.map((_, j) => parseNumberField(r[j + 1] ?? '', t.decimalComma)), lines: nums.map(() => i + 1) };
		// time of the row: a plain number in the corner's unit (seconds when it names none), or "30 s", "5 min"
		let timeS: number | undefined;
		const v = parseNumberField(cell, t.decimalComma);
		const m = /^([+-]?[\d.,]+(?:[eE][+-]?\d+)?)\s*([a-zµ]+)$/i.exec(cell);
		if (!Number.isNaN(v)) {
			timeS = v * unitS;
			if (layout.timeAssumed) assumedTime = true;
		} else if (m && timeUnitSeconds(m[2]) !== undefined) timeS = parseNumberField(m[1], t.decimalComma) * timeUnitSeconds(m[2])!;
		const label = !Number.isNaN(v) ? `t = ${cell} ${TIME_NAME[unitS] ?? 's'}` : cell || `row ${k + 1}`;
		const what = `line ${i + 1}${cell ? ` ("${cell}")` : ''}`;
		const fileX = convertAxis(b, headerXUnit, !!guess && guess.kind === 'emission', warnings, what) ?? 'nm';
		const s = finish(b, { what, label, index: k, fileX, guess, pre, options, xLabel: headerXUnit ? X_UNIT_NAMES[headerXUnit] : undefined, yLabel: undefined }, issues, warnings);
		k++;
		if (!s) continue;
		if (timeS !== undefined && Number.isFinite(timeS)) s.timeS = timeS;
		s.blockLabel = cell;
		spectra.push(s);
	}
	if (issues.some((i) => i.severity === 'error')) return { ok: false, issues: collapseErrors(issues) };
	if (!spectra.length) return fail('no_spectrum', 'no row to import');
	const lead: ParseIssue[] = [{ severity: 'warning', code: 'layout_rows', message: `read as ${spectra.length} spectra, one per row (${layout.reason})` }];
	// one unit assumption for the whole series, not one per row
	const assumed = warnings.filter((w) => w.code === 'y_unit_assumed');
	if (assumed.length) {
		lead.push({ severity: 'warning', code: 'y_unit_assumed', message: `y unit not stated; the ${spectra.length} rows are read as ${spectra[0]?.yUnit ?? 'absorbance'} (${spectra[0]?.kind ?? 'absorption'}) — please confirm` });
		for (let i = warnings.length - 1; i >= 0; i--) if (warnings[i].code === 'y_unit_assumed') warnings.splice(i, 1);
	}
	if (assumedTime) lead.push({ severity: 'warning', code: 'time_unit_assumed', message: 'the first column names no time unit; row labels read as seconds — please confirm' });
	return { ok: true, value: spectra, warnings: collapse([...lead, ...warnings, ...issues]) };
}

export type { ColumnGuess };
