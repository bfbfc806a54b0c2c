/**
 * Decodes one block's `##XYDATA=(X++(Y..Y))` (AFFN or ASDF: SQZ/DIF/DUP) through jcampconverter and
 * checks what jcampconverter does not: the point count against NPOINTS, finiteness, and stray
 * tokens in AFFN lines (jcampconverter silently decodes stray letters as compression characters).
 */
import { convert } from 'jcampconverter';
import type { ParseIssue } from '../types';

export interface XyDataPoints {
	x: number[];
	y: number[];
	lines: number[];
	issues: ParseIssue[];
	logs: string[];
}

const AFFN_TOKEN = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const ASDF_CHARS = /^[0-9+\-.\s,@A-Sa-sT-Zs%?]*$/;

/** @param lines - all lines; start/end - 0-based block range; dataLine - index of the `##XYDATA` line */
export function readXyData(lines: string[], start: number, end: number, dataLine: number, nPoints: number | undefined, xFactor = 1, block?: number): XyDataPoints {
	const out: XyDataPoints = { x: [], y: [], lines: [], issues: [], logs: [] };
	const err = (code: string, message: string, line?: number) => out.issues.push({ severity: 'error', code, message, line, block });
	const dataLines: number[] = [];
	for (let i = dataLine + 1; i <= end && !/^\s*##/.test(lines[i]); i++) if (lines[i].replace(/\$\$.*$/, '').trim()) dataLines.push(i);
	const lineOk = dataLines.map((i) => lines[i].replace(/\$\$.*$/, '').trim().split(/[\s,]+/).every((t) => AFFN_TOKEN.test(t)));
	const nOk = lineOk.filter(Boolean).length;
	const affn = nOk === dataLines.length;
	if (!affn && nOk >= 0.5 * dataLines.length) {
		// Plain-number data with a few bad lines: report them (a stray "NaN" would otherwise decode as DIF/SQZ digits).
		dataLines.forEach((i, k) => {
			if (!lineOk[k]) err('not_a_number', `line ${i + 1}: not a number ("${lines[i].trim().slice(0, 40)}")`, i + 1);
		});
		return out;
	}
	if (!affn) {
		// Compressed (or broken) data: only the ASDF alphabet may appear.
		for (const i of dataLines) {
			const t = lines[i].replace(/\$\$.*$/, '');
			if (!ASDF_CHARS.test(t)) {
				err('not_a_number', `line ${i + 1}: unexpected characters in compressed data ("${t.trim().slice(0, 40)}")`, i + 1);
				if (out.issues.length > 10) return out;
			}
		}
		if (out.issues.length) return out;
	}
	const parsed = convert(lines.slice(start, end + 1).join('\n'), { keepRecordsRegExp: /.*/ }) as unknown as {
		flatten: { spectra?: { data: { x: number[]; y: number[] } }[] }[];
		logs?: { message?: string }[];
	};
	for (const l of parsed.logs ?? []) out.logs.push(String(l?.message ?? l));
	const sp = parsed.flatten.find((e) => e.spectra?.length)?.spectra?.[0];
	if (!sp) {
		err('no_data', `block starting on line ${start + 1}: no data could be decoded`, dataLine + 1);
		return out;
	}
	out.x = Array.from(sp.data.x);
	out.y = Array.from(sp.data.y);
	if (nPoints !== undefined && out.x.length !== nPoints)
		err('point_count_mismatch', `block starting on line ${start + 1}: NPOINTS says ${nPoints} but the data decode to ${out.x.length} points (damaged or stray characters?)`, dataLine + 1);
	out.lines = assignLines(lines, dataLines, out.x, affn, xFactor);
	return out;
}

/** Line of each point: exact for AFFN (token count), by leading x for compressed lines. */
function assignLines(lines: string[], dataLines: number[], x: number[], affn: boolean, xFactor: number): number[] {
	const res = new Array<number>(x.length).fill(dataLines[0] !== undefined ? dataLines[0] + 1 : 0);
	if (affn) {
		let p = 0;
		for (const i of dataLines) {
			const n = lines[i].replace(/\$\$.*$/, '').trim().split(/[\s,]+/).length - 1;
			for (let k = 0; k < n && p < x.length; k++) res[p++] = i + 1;
		}
		return res;
	}
	const lead = dataLines.map((i) => Number(/^\s*([+-]?\d*\.?\d+)/.exec(lines[i])?.[1] ?? NaN) * xFactor);
	const desc = x.length > 1 && x[x.length - 1] < x[0];
	let k = 0;
	for (let p = 0; p < x.length; p++) {
		while (k + 1 < lead.length && (desc ? x[p] <= lead[k + 1] : x[p] >= lead[k + 1])) k++;
		res[p] = dataLines[k] + 1;
	}
	return res;
}
