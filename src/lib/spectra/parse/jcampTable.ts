/**
 * Reads an `(XY..XY)` table (`##XYPOINTS=`, `##PEAK TABLE=`, `##XYDATA=(XY..XY)`) with the line of
 * every pair. Pairs are `x,y` or `x y`, separated by spaces or ';' (JCAMP-DX 4.24 §5.8–5.9).
 */
import type { ParseIssue } from '../types';
import type { AsdfBudget } from './jcampAsdf';
import { parseNumberField, splitAffnFields } from './numbers';

export interface TablePoints {
	x: number[];
	y: number[];
	lines: number[];
	issues: ParseIssue[];
}

/**
 * @param lines - all lines of the file
 * @param from - 0-based index of the first data line (after the `##…=(XY..XY)` line)
 * @param xFactor - XFACTOR (default 1); yFactor - YFACTOR (default 1)
 */
export function readXyTable(lines: string[], from: number, xFactor = 1, yFactor = 1, block?: number, budget?: AsdfBudget): TablePoints {
	const out: TablePoints = { x: [], y: [], lines: [], issues: [] };
	for (let i = from; i < lines.length; i++) {
		const text = lines[i].replace(/\$\$.*$/, '').trim();
		if (/^##/.test(text)) break;
		if (!text) continue;
		// "x,y x,y" / "x y; x y" / "x, y": split to tokens and take them in pairs.
		const tokens = splitAffnFields(text);
		if (tokens.length % 2 !== 0) {
			out.issues.push({ severity: 'error', code: 'not_a_number', message: `line ${i + 1}: an x value without its y ("${text.slice(0, 40)}")`, line: i + 1, block });
			if (out.issues.length >= 20) return out;
			continue;
		}
		if (budget && out.x.length + tokens.length / 2 > budget.remaining) {
			out.issues.push({ severity: 'error', code: 'too_many_points', message: `line ${i + 1}: the table runs past ${budget.cap.toLocaleString('en')} points, the limit for one file`, line: i + 1, block });
			return out;
		}
		for (let k = 0; k < tokens.length; k += 2) {
			out.x.push(parseNumberField(tokens[k]) * xFactor);
			out.y.push(parseNumberField(tokens[k + 1]) * yFactor);
			out.lines.push(i + 1);
		}
	}
	if (budget) budget.remaining -= out.x.length;
	return out;
}
