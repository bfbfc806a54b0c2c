/**
 * One block's `##XYDATA=(X++(Y..Y))` through the bounded decoder (jcampAsdf.ts), then the abscissae
 * (JCAMP-DX 4.24 §5.9: x_i = FIRSTX + i·(LASTX − FIRSTX)/(NPOINTS − 1); where the count or header disagrees, each
 * line's own abscissa and the spacing), and the checks the header allows: NPOINTS, LASTX, FIRSTY, LASTY
 * (a mismatch is a warning with the numbers; damaged data — a failed Y check, a stray character — are refused).
 */
import type { ParseIssue } from '../types';
import { decodeAsdf, stripComment, usesCompression, type AsdfBudget } from './jcampAsdf';
import { parseNumberField } from './numbers';

export interface XyDataPoints {
	x: number[];
	y: number[];
	lines: number[];
	issues: ParseIssue[];
	logs: string[];
}

/** Header values that describe the data (already free of `$$` comments); undefined when absent or not a number. */
export interface XyDataHeader {
	firstX?: number;
	lastX?: number;
	deltaX?: number;
	xFactor: number;
	yFactor: number;
	nPoints?: number;
	firstY?: number;
	lastY?: number;
}

const AFFN_LINE = /^[\s,;0-9eE.+-]*$/;
const near = (a: number, b: number, tol: number) => Math.abs(a - b) <= tol;

/** @param lines - all lines; start/end - 0-based block range; dataLine - index of the `##XYDATA` line */
export function readXyData(lines: string[], start: number, end: number, dataLine: number, h: XyDataHeader, budget: AsdfBudget, block?: number): XyDataPoints {
	const out: XyDataPoints = { x: [], y: [], lines: [], issues: [], logs: [] };
	const err = (code: string, message: string, line?: number) => out.issues.push({ severity: 'error', code, message, line, block });
	const warn = (code: string, message: string, line?: number) => out.issues.push({ severity: 'warning', code, message, line, block });
	let last = dataLine;
	while (last + 1 <= end && !/^\s*##/.test(lines[last + 1])) last++;
	// Plain-number data with a few lines holding letters (a stray "NaN" would otherwise decode as SQZ/DIF digits).
	if (usesCompression(lines, dataLine + 1, last)) {
		const data: number[] = [];
		for (let i = dataLine + 1; i <= last; i++) if (stripComment(lines[i]).trim()) data.push(i);
		const plain = new Set(data.filter((i) => AFFN_LINE.test(stripComment(lines[i]))));
		if (plain.size >= 0.5 * data.length) {
			for (const i of data) if (!plain.has(i) && out.issues.length < 20) err('not_a_number', `line ${i + 1}: not a number ("${lines[i].trim().slice(0, 40)}")`, i + 1);
			return out;
		}
	}
	const d = decodeAsdf(lines, dataLine + 1, last, { nPoints: h.nPoints, budget });
	if (!d.ok) {
		err(d.code, d.message, d.line);
		return out;
	}
	budget.remaining -= d.y.length;
	out.logs.push(...d.warnings);
	const n = d.y.length;
	if (!n) {
		err('no_data', `block starting on line ${start + 1}: ##XYDATA holds no values`, dataLine + 1);
		return out;
	}
	const xf = h.xFactor;
	const s0 = d.starts[0];
	let dx: number | undefined;
	if (h.firstX !== undefined && h.lastX !== undefined && h.nPoints !== undefined && h.nPoints > 1) dx = (h.lastX - h.firstX) / (h.nPoints - 1);
	else if (h.deltaX !== undefined) dx = h.deltaX;
	else if (d.starts.length > 1 && d.starts[1].index > s0.index) dx = ((d.starts[1].x - s0.x) * xf) / (d.starts[1].index - s0.index);
	else if (h.firstX !== undefined && h.lastX !== undefined && n > 1) dx = (h.lastX - h.firstX) / (n - 1);
	if (n > 1 && (dx === undefined || !Number.isFinite(dx) || dx === 0)) {
		err('no_x_spacing', `block starting on line ${start + 1}: the x spacing cannot be found (no FIRSTX/LASTX/NPOINTS or DELTAX)`, dataLine + 1);
		return out;
	}
	const step = dx ?? 0;
	const x = new Array<number>(n);
	const exact = h.nPoints === n && h.firstX !== undefined && h.lastX !== undefined;
	if (exact) for (let i = 0; i < n; i++) x[i] = h.firstX! + i * step;
	else
		for (let k = 0; k < d.starts.length; k++) {
			const s = d.starts[k];
			const to = k + 1 < d.starts.length ? d.starts[k + 1].index : n;
			for (let i = Math.max(0, s.index); i < to; i++) x[i] = s.x * xf + (i - s.index) * step;
		}
	// X check: each line's abscissa against the computed one (half a step, or one XFACTOR unit for rounded abscissae).
	const tol = Math.max(Math.abs(step) * 0.5, Math.abs(xf), 1e-9 * Math.abs(s0.x * xf));
	const off = d.starts.filter((s) => s.index >= 0 && s.index < n && !near(s.x * xf, x[s.index], tol));
	if (off.length)
		warn('x_check_mismatch', `${off.length} data line(s) start at an x that disagrees with FIRSTX/LASTX/NPOINTS, first line ${off[0].line + 1} (${off[0].x * xf} vs ${x[off[0].index]})`, off[0].line + 1);
	if (h.nPoints !== undefined && h.nPoints !== n)
		warn('point_count_mismatch', `NPOINTS says ${h.nPoints}; the data decode to ${n} points (x from each line's own abscissa)`, dataLine + 1);
	if (h.lastX !== undefined && !exact && !near(x[n - 1], h.lastX, tol)) warn('lastx_mismatch', `LASTX says ${h.lastX}; the last decoded point is at ${x[n - 1]}`, d.lines[n - 1] + 1);
	const yf = h.yFactor;
	const ySpan = Math.max(...[d.y[0], d.y[n - 1]].map((v) => Math.abs(v * yf)), 1e-30);
	// FIRSTY/LASTY are real values, often printed with few digits: allow half a unit in their last printed place.
	const checkY = (label: string, said: number | undefined, got: number, atX: number, line: number) => {
		const decimals = (/\.(\d+)$/.exec(String(said)) ?? ['', ''])[1].length;
		if (said !== undefined && Number.isFinite(got) && !near(said, got, 1e-3 * Math.max(Math.abs(said), ySpan) + 0.5 * 10 ** -decimals))
			warn(`${label.toLowerCase()}_mismatch`, `${label} says ${said}; the data give ${Number(got.toPrecision(6))} (at x = ${Number(atX.toPrecision(8))}, line ${line})`, line);
	};
	checkY('FIRSTY', h.firstY, d.y[0] * yf, x[0], d.lines[0] + 1);
	checkY('LASTY', h.lastY, d.y[n - 1] * yf, x[n - 1], d.lines[n - 1] + 1);
	const missing = new Set(d.missing);
	for (let i = 0; i < n; i++) {
		if (missing.has(i)) continue;
		const v = d.y[i] * yf;
		if (!Number.isFinite(v)) {
			err('not_finite', `line ${d.lines[i] + 1}: y × YFACTOR (${d.y[i]} × ${yf}) is not a finite number`, d.lines[i] + 1);
			return out;
		}
		out.x.push(x[i]);
		out.y.push(v);
		out.lines.push(d.lines[i] + 1);
	}
	return out;
}

/** Reads the header numbers a block needs; a value that is not a number is reported as an error naming its line. */
export function readXyHeader(ldr: Map<string, string>, ldrLine: Map<string, number>, block?: number): { header: XyDataHeader; issues: ParseIssue[] } {
	const issues: ParseIssue[] = [];
	const get = (key: string, label: string): number | undefined => {
		const v = ldr.get(key);
		if (v === undefined || v.trim() === '') return undefined;
		const n = parseNumberField(v.trim());
		if (!Number.isFinite(n)) {
			const line = (ldrLine.get(key) ?? 0) + 1;
			issues.push({ severity: 'error', code: 'bad_header_number', message: `line ${line}: ##${label}= "${v.slice(0, 30)}" is not a number`, line, block });
			return undefined;
		}
		return n;
	};
	const header: XyDataHeader = {
		firstX: get('FIRSTX', 'FIRSTX'),
		lastX: get('LASTX', 'LASTX'),
		deltaX: get('DELTAX', 'DELTAX'),
		xFactor: get('XFACTOR', 'XFACTOR') ?? 1,
		yFactor: get('YFACTOR', 'YFACTOR') ?? 1,
		nPoints: get('NPOINTS', 'NPOINTS'),
		firstY: get('FIRSTY', 'FIRSTY'),
		lastY: get('LASTY', 'LASTY')
	};
	for (const [k, v] of [['XFACTOR', header.xFactor], ['YFACTOR', header.yFactor]] as const)
		if (v === 0) issues.push({ severity: 'error', code: 'bad_header_number', message: `line ${(ldrLine.get(k) ?? 0) + 1}: ##${k}= 0`, line: (ldrLine.get(k) ?? 0) + 1, block });
	if (header.nPoints !== undefined && !(Number.isInteger(header.nPoints) && header.nPoints >= 0)) {
		const line = (ldrLine.get('NPOINTS') ?? 0) + 1;
		issues.push({ severity: 'warning', code: 'bad_header_number', message: `line ${line}: ##NPOINTS= ${header.nPoints} is not a count; ignored`, line, block });
		header.nPoints = undefined;
	}
	return { header, issues };
}
