/**
 * Physical validation of one spectrum's points, shared by the JCAMP and CSV readers.
 * Refuses NaN/non-finite values, negative transmittance, x that cannot be a positive wavelength,
 * fewer than 5 points and duplicate x with conflicting y; merges identical duplicates with a warning.
 */
import type { ParseIssue, RawSpectrum, Result, YUnit } from '../types';

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
		else if (isT && y <= -noise) err('negative_transmittance', `${p.what}: negative transmittance ${y}${p.yUnit === 'transmittance-percent' ? ' %T' : ' (as a fraction; noise down to −0.002 is read as 0)'}${at}`, p.lines[i]);
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

/** Limits on values after unit conversion (422 when crossed): x 100 nm–100 µm; T ≤ 1.05 (noise margin); A ≤ 10. */
export const PHYSICAL_LIMITS = { minNm: 100, maxNm: 100_000, maxTransmittance: 1.05, maxAbsorbance: 10 };

export interface PhysicalIn {
	x: ArrayLike<number>;
	y: ArrayLike<number>;
	lines?: ArrayLike<number>;
	xUnit: 'nm' | 'um' | 'cm-1';
	yUnit: YUnit;
	what: string;
	block?: number;
}

const fmt = (v: number) => (Math.abs(v) >= 1e6 || (Math.abs(v) < 1e-3 && v !== 0) ? v.toExponential(3) : String(Number(v.toPrecision(6))));

/**
 * Checks values after conversion to nm and the stored quantity: x within 100 nm–100 µm and finite; transmittance
 * at most 1.05 (or 105 %T; common practice: a little above 1 is baseline noise); decadic absorbance at most 10
 * (no spectrophotometer measures beyond that; common practice); ε finite (log ε above 308 overflows).
 * @returns the first error (with its line), or undefined
 */
export function checkPhysicalValues(p: PhysicalIn): ParseIssue | undefined {
	const line = (i: number) => (p.lines && p.lines[i] ? p.lines[i] : undefined);
	const at = (i: number) => (line(i) ? `line ${line(i)}` : `point ${i + 1}`);
	const issue = (code: string, message: string, i: number): ParseIssue => ({ severity: 'error', code, message: `${p.what}: ${message}`, line: line(i), block: p.block });
	const n = p.x.length;
	for (let i = 0; i < n; i++) {
		const v = p.x[i];
		const nm = p.xUnit === 'nm' ? v : p.xUnit === 'um' ? v * 1000 : 1e7 / v;
		if (!Number.isFinite(nm) || nm < PHYSICAL_LIMITS.minNm || nm > PHYSICAL_LIMITS.maxNm)
			return issue('x_out_of_range', `x = ${fmt(v)} ${p.xUnit === 'um' ? 'µm' : p.xUnit === 'cm-1' ? 'cm⁻¹' : 'nm'} on ${at(i)} is ${Number.isFinite(nm) ? fmt(nm) + ' nm, ' : ''}outside 100 nm–100 µm`, i);
	}
	let worst = -1;
	for (let i = 0; i < n; i++) if (worst < 0 || p.y[i] > p.y[worst]) worst = i;
	if (worst < 0) return undefined;
	const top = p.y[worst];
	if (p.yUnit === 'transmittance' && top > PHYSICAL_LIMITS.maxTransmittance)
		return issue('transmittance_above_one', `transmittance ${fmt(top)} on ${at(worst)} is above 1.05${top <= 105 ? ' (if the values are %T, choose the y unit transmittance-percent)' : ''}`, worst);
	if (p.yUnit === 'transmittance-percent' && top > 100 * PHYSICAL_LIMITS.maxTransmittance)
		return issue('transmittance_above_one', `transmittance ${fmt(top)} % on ${at(worst)} is above 105 %`, worst);
	if (p.yUnit === 'absorbance' && top > PHYSICAL_LIMITS.maxAbsorbance)
		return issue('absorbance_too_high', `absorbance ${fmt(top)} on ${at(worst)} is above 10, which no spectrophotometer measures${top <= 105 ? ' (values like these are usually %T: choose the y unit transmittance-percent)' : ''}`, worst);
	if (p.yUnit === 'log-epsilon' && !Number.isFinite(10 ** top)) return issue('not_finite', `log ε = ${fmt(top)} on ${at(worst)} gives an infinite ε`, worst);
	return undefined;
}

/**
 * Percent or fraction for a transmittance whose header does not say: percent when the 95th percentile is above
 * 1.5 or any value above 10 (a fraction with a few noise spikes stays a fraction; common practice).
 */
export function transmittanceLooksPercent(y: ArrayLike<number>): boolean {
	const n = y.length;
	if (!n) return false;
	const sorted = Float64Array.from(y).sort();
	const p95 = sorted[Math.min(n - 1, Math.floor(0.95 * (n - 1)))];
	return p95 > 1.5 || sorted[n - 1] > 10;
}

/**
 * The checks every parser's result gets: the per-file caps (points, spectra) and the physical limits of each
 * spectrum's values (checkPhysicalValues). A refusal names the spectrum and the line.
 */
export function checkParsedSpectra(
	r: Result<RawSpectrum[]>,
	limits: { maxPointsPerFile: number; maxSpectraPerFile: number }
): Result<RawSpectrum[]> {
	if (!r.ok) return r;
	if (r.value.length > limits.maxSpectraPerFile)
		return { ok: false, issues: [{ severity: 'error', code: 'too_many_spectra', message: `the file holds ${r.value.length} spectra; at most ${limits.maxSpectraPerFile} are read from one file` }] };
	let points = 0;
	for (const s of r.value) points += s.x.length;
	if (points > limits.maxPointsPerFile)
		return { ok: false, issues: [{ severity: 'error', code: 'too_many_points', message: `the file holds ${points} points; at most ${limits.maxPointsPerFile} are read from one file` }] };
	const many = r.value.length > 1;
	const errors: ParseIssue[] = [];
	for (const s of r.value) {
		const e = checkPhysicalValues({ x: s.x, y: s.y, lines: s.lines, xUnit: s.xUnit, yUnit: s.yUnit, what: many ? `"${s.label}"` : 'spectrum', block: many ? s.index : undefined });
		if (e) errors.push(e);
	}
	return errors.length ? { ok: false, issues: [...errors, ...r.warnings] } : r;
}
