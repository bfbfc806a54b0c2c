/**
 * Which way round a table holds its spectra.
 *
 * - `columns`: one x column (wavelength) and one spectrum per y column — the common export.
 * - `rows`: a header row of wavelengths and one spectrum per data row, the first field of each row its label —
 *   how kinetics and diode-array time series are often written (a time in the first field). The time is kept
 *   per spectrum as `timeS` (seconds) with the row's label, so a time series can be read back in order.
 *
 * Both readings are tried; the one whose axis is monotonic, in the UV–vis–NIR range and labelled wins. When both
 * fit, the longer axis wins (a spectrum has more points than a series has spectra) and the choice is reported.
 */
import type { DelimitedTable } from './csvTable';
import { isAxisName, nonOpticalAxis, timeUnitSeconds, xUnitOfHeader, type HeaderXUnit } from './csvUnits';
import { parseNumberField } from './numbers';

export type CsvLayout = 'columns' | 'rows';

export interface LayoutChoice {
	layout: CsvLayout;
	/** One sentence for the preview: why this reading was chosen. */
	reason: string;
	/** Rows layout: the x unit (from the corner cell or the range) and the seconds per unit of the row labels. */
	xUnit?: HeaderXUnit;
	timeUnitS?: number;
	/** Rows layout: the corner cell names a time, or the labels are plain numbers read as seconds. */
	timeAssumed?: boolean;
}

/** Strictly monotonic and inside the UV–vis–NIR range of `u` (common practice: 100–5000 nm, 0.1–5 µm, 2000–100 000 cm⁻¹). */
export function plausibleAxis(v: ArrayLike<number>, u?: HeaderXUnit): HeaderXUnit | undefined {
	if (v.length < 5) return undefined;
	let up = true, down = true, min = Infinity, max = -Infinity;
	for (let i = 0; i < v.length; i++) {
		if (!Number.isFinite(v[i])) return undefined;
		if (i) {
			if (!(v[i] > v[i - 1])) up = false;
			if (!(v[i] < v[i - 1])) down = false;
		}
		min = Math.min(min, v[i]);
		max = Math.max(max, v[i]);
	}
	if (!up && !down) return undefined;
	const ranges: [HeaderXUnit, number, number][] = [['nm', 100, 5000], ['um', 0.1, 5], ['cm-1', 2000, 100000], ['angstrom', 1000, 50000], ['ev', 0.25, 12.4]];
	for (const [unit, lo, hi] of ranges) if ((u === undefined ? unit === 'nm' || unit === 'cm-1' : unit === u) && min >= lo && max <= hi) return unit;
	return undefined;
}

/** The header row's numbers after the corner cell, or undefined when they are not all numbers. */
export function headerNumbers(t: DelimitedTable): number[] | undefined {
	if (t.headerRow < 0) return undefined;
	const h = t.rows[t.headerRow];
	// whitespace-delimited files lose an empty corner cell: the row is one field short and all numbers
	const from = h.length === t.nColumns - 1 && !Number.isNaN(parseNumberField(h[0], t.decimalComma)) ? 0 : 1;
	if (h.length - from < 5) return undefined;
	const out: number[] = [];
	for (let i = from; i < h.length; i++) {
		const v = parseNumberField(h[i], t.decimalComma);
		if (Number.isNaN(v)) return undefined;
		out.push(v);
	}
	return out;
}

/** Chooses the layout; `forced` (the user's choice in the preview) wins when given. */
export function chooseLayout(t: DelimitedTable, forced?: CsvLayout): LayoutChoice {
	const nums = headerNumbers(t);
	const hdr = t.headerRow >= 0 ? t.rows[t.headerRow] : [];
	const corner = nums && hdr.length === nums.length ? '' : (hdr[0] ?? '').trim();
	const cornerUnit = xUnitOfHeader(corner.replace(/time|\bt\b/gi, ''));
	const rowsAxis = nums ? plausibleAxis(nums, cornerUnit) : undefined;
	const col0: number[] = [];
	for (let i = t.dataStart; i <= t.dataEnd; i++) col0.push(parseNumberField(t.rows[i]?.[0] ?? '', t.decimalComma));
	const colAxis = plausibleAxis(col0.filter(Number.isFinite));
	const timeUnit = timeUnitSeconds(corner);
	const cornerTime = nonOpticalAxis(corner.split(/[\\/|]/)[0] ?? '') === 'time' || timeUnit !== undefined;
	const rows = (reason: string): LayoutChoice => ({ layout: 'rows', reason, xUnit: rowsAxis ?? cornerUnit ?? 'nm', timeUnitS: timeUnit ?? 1, timeAssumed: timeUnit === undefined });
	if (forced === 'rows') return rows('one spectrum per row, as chosen');
	if (forced === 'columns') return { layout: 'columns', reason: 'one spectrum per column, as chosen' };
	if (t.labelledRows && nums) return rows(`one spectrum per row: the header row holds ${nums.length} wavelengths and each row starts with its label`);
	if (!rowsAxis || !nums) return { layout: 'columns', reason: 'one spectrum per column: the first column is the axis' };
	const cornerIsAxis = corner !== '' && isAxisName(corner) && !cornerTime;
	if (cornerTime) return rows(`one spectrum per row: the header row holds ${nums.length} wavelengths and the first column is a time ("${corner}")`);
	if (cornerIsAxis && colAxis) return { layout: 'columns', reason: `one spectrum per column: "${corner}" is the axis (the numbers in the header are column names)` };
	if (!colAxis) return rows(`one spectrum per row: the header row holds ${nums.length} wavelengths; the first column is not a wavelength axis`);
	if (nums.length > col0.length) return rows(`one spectrum per row: both the header row and the first column could be wavelengths; the header row is longer (${nums.length} vs ${col0.length})`);
	return { layout: 'columns', reason: `one spectrum per column: both the header row and the first column could be wavelengths; the first column is longer (${col0.length} vs ${nums.length})` };
}
