/**
 * Physical validation of one spectrum's points, shared by the JCAMP and CSV readers.
 * Refuses NaN/non-finite values, negative transmittance, x that cannot be a positive wavelength,
 * fewer than 5 points and duplicate x with conflicting y; merges identical duplicates with a warning.
 */
import type { ParseIssue, YUnit } from '../types';

export interface PointsIn {
	x: ArrayLike<number>;
	y: ArrayLike<number>;
	/** 1-based source line of each point (0 when unknown). */
	lines: ArrayLike<number>;
	yUnit: YUnit;
	/** Label used in messages, e.g. `column "Abs"` or `block 2`. */
	what: string;
	block?: number;
}

export interface PointsOut {
	x: Float64Array;
	y: Float64Array;
	lines: Int32Array;
}

/** Minimum number of points a spectrum must have. */
export const MIN_POINTS = 5;
const MAX_ERRORS = 20;
/**
 * Instrument noise around zero transmittance: values above −0.2 %T (−0.002 as a fraction) are read as 0 with a
 * warning (common practice: spectrophotometers report small negative %T where a sample blocks completely);
 * anything more negative is refused as physically impossible.
 */
export const NEGATIVE_T_NOISE = { percent: 0.2, fraction: 0.002 };

/** Validates points; errors carry the 1-based line of the offending value. File order is kept. */
export function validatePoints(p: PointsIn): { value?: PointsOut; issues: ParseIssue[] } {
	const issues: ParseIssue[] = [];
	const err = (code: string, message: string, line: number) => {
		if (issues.length < MAX_ERRORS)
			issues.push({ severity: 'error', code, message, line: line || undefined, block: p.block });
	};
	const n = p.x.length;
	const isT = p.yUnit === 'transmittance' || p.yUnit === 'transmittance-percent';
	const noise = p.yUnit === 'transmittance-percent' ? NEGATIVE_T_NOISE.percent : NEGATIVE_T_NOISE.fraction;
	const clipped: number[] = [];
	for (let i = 0; i < n; i++) {
		const x = p.x[i];
		const y = p.y[i];
		const at = p.lines[i] ? ` on line ${p.lines[i]}` : ` at point ${i + 1}`;
		if (!Number.isFinite(x)) err('not_a_number', `${p.what}: x is not a number${at}`, p.lines[i]);
		else if (x <= 0) err('x_not_positive', `${p.what}: x = ${x}${at} cannot be converted to a positive wavelength`, p.lines[i]);
		if (!Number.isFinite(y)) err('not_a_number', `${p.what}: y is not a number${at}`, p.lines[i]);
		else if (isT && y <= -noise) err('negative_transmittance', `${p.what}: negative transmittance ${y}${at}`, p.lines[i]);
		else if (isT && y < 0) clipped.push(i);
	}
	if (n < MIN_POINTS)
		err('too_few_points', `${p.what}: ${n} points; at least ${MIN_POINTS} are needed`, p.lines[0] ?? 0);
	if (issues.length) return { issues };
	if (clipped.length) {
		const first = clipped[0];
		issues.push({ severity: 'warning', code: 'negative_transmittance_noise', message: `${p.what}: ${clipped.length} slightly negative transmittance value(s) (above −${noise}${p.yUnit === 'transmittance-percent' ? ' %T' : ''}, instrument noise) read as 0, first on line ${p.lines[first] || first + 1}`, line: p.lines[first] || undefined, block: p.block });
	}
	const yOf = (i: number) => (isT && p.y[i] < 0 ? 0 : p.y[i]);

	// Duplicate x: sort an index by x and compare neighbours.
	const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => p.x[a] - p.x[b] || a - b);
	const drop = new Uint8Array(n);
	for (let k = 1; k < n; k++) {
		const a = order[k - 1];
		const b = order[k];
		if (p.x[a] !== p.x[b]) continue;
		const la = p.lines[a] ? `line ${p.lines[a]}` : `point ${a + 1}`;
		const lb = p.lines[b] ? `line ${p.lines[b]}` : `point ${b + 1}`;
		if (yOf(a) === yOf(b)) {
			drop[b] = 1;
			issues.push({ severity: 'warning', code: 'duplicate_x_merged', message: `${p.what}: x = ${p.x[b]} repeated with the same y (${la}, ${lb}); merged`, line: p.lines[b] || undefined, block: p.block });
		} else {
			err('duplicate_x_conflict', `${p.what}: x = ${p.x[b]} appears twice with different y (${la}: ${p.y[a]}, ${lb}: ${p.y[b]})`, p.lines[b]);
		}
	}
	if (issues.some((i) => i.severity === 'error')) return { issues };
	let m = 0;
	for (let i = 0; i < n; i++) if (!drop[i]) m++;
	if (m < MIN_POINTS) return { issues: [...issues, { severity: 'error', code: 'too_few_points', message: `${p.what}: ${m} distinct points; at least ${MIN_POINTS} are needed`, block: p.block }] };
	const out: PointsOut = { x: new Float64Array(m), y: new Float64Array(m), lines: new Int32Array(m) };
	for (let i = 0, j = 0; i < n; i++) {
		if (drop[i]) continue;
		out.x[j] = p.x[i];
		out.y[j] = yOf(i);
		out.lines[j++] = p.lines[i];
	}
	return { value: out, issues };
}
