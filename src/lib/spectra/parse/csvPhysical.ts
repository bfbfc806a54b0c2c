/**
 * Physical plausibility of one delimited-text spectrum after unit conversion: errors name the column and the line.
 *
 * Limits (common practice unless a source is named):
 * - x after conversion to nm must lie in 100 nm – 100 µm (vacuum UV to far IR; nothing a UV–vis library stores is
 *   outside). A table that runs on past 100 µm at its long-wavelength end (solar and blackbody tables reach 1 mm)
 *   keeps its optical part and the tail is dropped with a warning naming the lines; any other point outside is refused.
 * - absorbance ≤ 10: A = 10 means 10⁻¹⁰ of the light passes; spectrophotometers saturate near A 4–6.
 * - transmittance (or reflectance) as a fraction −0.05…1.05, as percent −5…105 %.
 * - ε ≤ 10⁶ M⁻¹ cm⁻¹ (the strongest molecular absorbers are a few 10⁵; from memory) and ε_max ≥ 1 M⁻¹ cm⁻¹
 *   (a spectrum whose ε stays below 1 would need more than 1 mol L⁻¹ for A = 1 in 1 cm — it is absorbance).
 * - log ε within 0 … 6.
 * - with a concentration and path, A/(c·l) must be finite and ≤ 10⁶ M⁻¹ cm⁻¹.
 */
import type { ParseIssue, YUnit } from '../types';

/** Wavelength limits of anything stored, nm. */
export const X_LIMITS_NM: [number, number] = [100, 100_000];
export const MAX_ABSORBANCE_READ = 10;
export const MAX_EPSILON = 1e6;

const fmt = (v: number) => (Math.abs(v) >= 1e5 || (Math.abs(v) < 1e-3 && v !== 0) ? v.toExponential(3) : String(+v.toPrecision(6)));

export interface RangeOutcome {
	/** Points to keep [from, to) — the whole spectrum unless a far-IR tail is dropped. */
	keep: [number, number];
	issues: ParseIssue[];
}

/**
 * Checks x (already in nm) against 100 nm – 100 µm.
 * @param xNm - x in nm, file order; lines - 1-based lines
 */
export function checkXRangeNm(xNm: ArrayLike<number>, lines: ArrayLike<number>, what: string, xFile?: ArrayLike<number>): RangeOutcome {
	const n = xNm.length;
	const [lo, hi] = X_LIMITS_NM;
	// values that are not numbers or not positive in the file's own unit are reported by validatePoints
	const bad = (i: number) => (xFile ? Number.isFinite(xFile[i]) && xFile[i] > 0 : Number.isFinite(xNm[i])) && (xNm[i] < lo || xNm[i] > hi);
	let from = 0, to = n;
	const ascending = n > 1 && xNm[n - 1] > xNm[0];
	// a tail past 100 µm at the long-wavelength end of a monotonic axis
	if (ascending) while (to > from && Number.isFinite(xNm[to - 1]) && xNm[to - 1] > hi && (to < 2 || xNm[to - 1] > xNm[to - 2])) to--;
	else while (from < to && Number.isFinite(xNm[from]) && xNm[from] > hi && (from + 1 >= n || xNm[from] > xNm[from + 1])) from++;
	const issues: ParseIssue[] = [];
	for (let i = from; i < to && issues.length < 5; i++) {
		if (!bad(i)) continue;
		issues.push({ severity: 'error', code: 'x_out_of_range', message: `${what}: x = ${fmt(xNm[i])} nm on line ${lines[i]} is outside 100 nm – 100 µm after unit conversion (check the x unit)`, line: lines[i] || undefined });
	}
	const dropped = n - (to - from);
	if (!issues.length && dropped > 0 && to - from >= 5) {
		const [a, b] = ascending ? [to, n - 1] : [0, from - 1];
		issues.push({ severity: 'warning', code: 'x_tail_dropped', message: `${what}: ${dropped} point(s) beyond 100 µm (lines ${lines[a]}–${lines[b]}) are outside the optical range and were not imported`, line: lines[a] || undefined });
	} else if (!issues.length && dropped > 0) {
		issues.push({ severity: 'error', code: 'x_out_of_range', message: `${what}: x runs beyond 100 µm after unit conversion (line ${lines[ascending ? n - 1 : 0]}); check the x unit`, line: lines[ascending ? n - 1 : 0] || undefined });
	}
	return { keep: [from, to], issues };
}

/** Range of the finite values. */
function extent(y: ArrayLike<number>): [number, number, number] {
	let min = Infinity, max = -Infinity, at = -1;
	for (let i = 0; i < y.length; i++) {
		if (!Number.isFinite(y[i])) continue;
		if (y[i] < min) min = y[i];
		if (y[i] > max) {
			max = y[i];
			at = i;
		}
	}
	return [min, max, at];
}

const HINT = 'say which quantity it is (yUnit: absorbance, transmittance-percent, epsilon, counts, relative…)';

/**
 * Checks y in the unit it will be stored under. `stated` = the unit came from the file or the caller (not assumed).
 * @returns errors naming the column and the line of the worst value
 */
export function checkYPlausible(y: ArrayLike<number>, lines: ArrayLike<number>, yUnit: YUnit, what: string, stated: boolean, cl?: { c?: number; l?: number }): ParseIssue[] {
	const [min, max, at] = extent(y);
	if (at < 0) return [];
	const line = lines[at] || undefined;
	const e = (code: string, message: string): ParseIssue[] => [{ severity: 'error', code, message, line }];
	const on = line ? ` (line ${line})` : '';
	switch (yUnit) {
		case 'absorbance': {
			if (max > MAX_ABSORBANCE_READ) {
				const looksT = min >= -0.5 && max <= 105 && max > 20;
				const why = stated ? '' : ' (the file does not state the unit)';
				return e('implausible_absorbance', `${what}: values up to ${fmt(max)}${on} cannot be absorbance (none above ${MAX_ABSORBANCE_READ} is physical)${why}${looksT ? '; they look like %T' : max > 1000 ? '; they look like detector counts or ε' : ''} — ${HINT}`);
			}
			if (cl?.c !== undefined && cl?.l !== undefined) {
				const eps = max / (cl.c * cl.l);
				if (!Number.isFinite(eps) || eps > MAX_EPSILON)
					return [{ severity: 'error', code: 'implausible_epsilon', message: `${what}: A = ${fmt(max)} at c = ${fmt(cl.c)} mol L⁻¹ and l = ${fmt(cl.l)} cm gives ε = ${fmt(eps)} M⁻¹ cm⁻¹, above ${fmt(MAX_EPSILON)} — check the concentration and path`, line }];
			}
			return [];
		}
		case 'transmittance':
		case 'reflectance':
			if (max > 1.05) return e(`implausible_${yUnit}`, `${what}: ${yUnit} ${fmt(max)}${on} is above 1.05 as a fraction — if these are percent, say so (yUnit ${yUnit}-percent)`);
			if (min < -0.05) return e(`implausible_${yUnit}`, `${what}: ${yUnit} ${fmt(min)} is below −0.05`);
			return [];
		case 'transmittance-percent':
		case 'reflectance-percent': {
			const q = yUnit.replace('-percent', '');
			if (max > 105) return e(`implausible_${q}`, `${what}: ${fmt(max)} %${on} is above 105 % — ${HINT}`);
			return [];
		}
		case 'epsilon':
			if (max > MAX_EPSILON) return e('implausible_epsilon', `${what}: ε up to ${fmt(max)} M⁻¹ cm⁻¹${on} is above ${fmt(MAX_EPSILON)} — ${HINT}`);
			if (max < 1) return e('implausible_epsilon', `${what}: ε at most ${fmt(max)} M⁻¹ cm⁻¹ would need more than 1 mol L⁻¹ for an absorbance of 1 in 1 cm — these look like absorbance; ${HINT}`);
			return [];
		case 'log-epsilon':
			if (max > 6 || max < 0) return e('implausible_epsilon', `${what}: log ε up to ${fmt(max)}${on} is outside 0–6 — ${HINT}`);
			return [];
		default:
			return [];
	}
}
