/**
 * Optical-constants tables (wavelength, n, k) as delimited text: read as a wall material rather than as spectra.
 * The wall model then follows T = (1 − R)²·exp(−4πk·d/λ) with R = ((n − 1)/(n + 1))² (Born & Wolf, Principles of
 * Optics; see ../../irradiation/walls.ts). Wavelengths are returned in nm, ascending.
 */
import type { ParseIssue, Result } from '../types';
import { columnValues } from './csvColumns';
import { planDelimited } from './csv';
import { opticalConstantRole, toNm, xUnitOfHeader } from './csvUnits';
import { X_LIMITS_NM } from './csvPhysical';

export interface OpticalConstantsTable {
	wavelengthNm: number[];
	n: number[];
	k: number[];
	/** The refractive index used for the Fresnel loss: n at 589.3 nm (sodium D line, common practice), else the median n. */
	nForFresnel: number;
}

/** Negative k within this of zero is noise and read as 0 (common practice for tabulated k near transparency). */
const NEGATIVE_K_NOISE = 1e-9;

/** Reads a table with a wavelength column and columns named n and k. Errors name the line. */
export function readOpticalConstantsTable(text: string): Result<OpticalConstantsTable> {
	const fail = (code: string, message: string, line?: number): Result<OpticalConstantsTable> => ({ ok: false, issues: [{ severity: 'error', code, message, line }] });
	const plan = planDelimited(text);
	if (!plan) return fail('unsupported_format', 'no table of numbers found');
	const cols = plan.columns;
	const x = cols.find((c) => c.role === 'x');
	const nCol = cols.find((c) => c.role !== 'x' && opticalConstantRole(c.name) === 'n');
	const kCol = cols.find((c) => c.role !== 'x' && opticalConstantRole(c.name) === 'k');
	if (!x || !nCol || !kCol) return fail('not_optical_constants', 'expected a wavelength column and columns named "n" and "k"', plan.table.headerRow + 1 || undefined);
	const t = plan.table;
	const unit = xUnitOfHeader(x.name) ?? x.headerXUnit ?? (x.xUnit === 'um' ? 'um' : x.xUnit === 'cm-1' ? 'cm-1' : 'nm');
	const xs = columnValues(t, x.index), ns = columnValues(t, nCol.index), ks = columnValues(t, kCol.index);
	const rows: { x: number; n: number; k: number; line: number }[] = [];
	const issues: ParseIssue[] = [];
	for (let i = 0; i < xs.length; i++) {
		const line = t.dataStart + i + 1;
		if ((t.rows[t.dataStart + i] ?? []).every((f) => f.trim() === '')) continue;
		const nm = toNm(xs[i], unit);
		if (!Number.isFinite(nm) || nm < X_LIMITS_NM[0] || nm > X_LIMITS_NM[1]) issues.push({ severity: 'error', code: 'x_out_of_range', message: `wavelength ${xs[i]} on line ${line} is outside 100 nm – 100 µm`, line });
		else if (!(ns[i] >= 1 && ns[i] <= 5)) issues.push({ severity: 'error', code: 'invalid_n', message: `n = ${ns[i]} on line ${line} is not a refractive index of a wall material (1–5)`, line });
		else if (!Number.isFinite(ks[i]) || ks[i] < -NEGATIVE_K_NOISE) issues.push({ severity: 'error', code: 'negative_k', message: `k = ${ks[i]} on line ${line} must be a number ≥ 0`, line });
		else rows.push({ x: nm, n: ns[i], k: Math.max(0, ks[i]), line });
		if (issues.length >= 10) break;
	}
	if (issues.length) return { ok: false, issues };
	rows.sort((a, b) => a.x - b.x);
	for (let i = 1; i < rows.length; i++) if (rows[i].x === rows[i - 1].x) return fail('duplicate_x_conflict', `wavelength ${rows[i].x} nm appears twice (lines ${rows[i - 1].line} and ${rows[i].line})`, rows[i].line);
	if (rows.length < 2) return fail('too_few_points', 'an n, k table needs at least 2 wavelengths');
	const wavelengthNm = rows.map((r) => r.x), n = rows.map((r) => r.n), k = rows.map((r) => r.k);
	let nForFresnel: number;
	const D = 589.3;
	const j = wavelengthNm.findIndex((w) => w >= D);
	if (j > 0) nForFresnel = n[j - 1] + ((D - wavelengthNm[j - 1]) / (wavelengthNm[j] - wavelengthNm[j - 1])) * (n[j] - n[j - 1]);
	else if (j === 0 && wavelengthNm[0] === D) nForFresnel = n[0];
	else nForFresnel = [...n].sort((a, b) => a - b)[Math.floor(n.length / 2)];
	return { ok: true, value: { wavelengthNm, n, k, nForFresnel }, warnings: [] };
}
