/**
 * The HTTP class of a refusal, decided by the core from its issue codes so that any caller (a route, a worker
 * thread, a script) answers the same: 413 the file expands past the per-file caps; 415 not an optical spectrum
 * or not a text format; 422 parsed but physically impossible or outside the product's range; 400 damaged or
 * unreadable (API.md error statuses).
 */
import type { ParseIssue } from '../types';

export const TOO_LARGE_CODES = new Set(['too_many_points', 'too_many_spectra']);
export const UNSUPPORTED_CODES = new Set(['unsupported_format', 'not_optical_spectrum']);
export const PHYSICAL_CODES = new Set([
	'negative_transmittance', 'x_not_positive', 'duplicate_x_conflict', 'duplicate_x', 'invalid_concentration', 'invalid_path',
	'transmittance_above_one', 'negative_k', 'absorbance_too_high', 'x_out_of_range', 'outside_optical_range', 'not_finite', 'npoints_exceeded'
]);

/** 413, 415, 422 or 400 for a list of issues (errors first; the first error decides between 415 and the rest). */
export function statusForIssues(issues: ParseIssue[]): 400 | 413 | 415 | 422 {
	const errors = issues.filter((i) => i.severity === 'error');
	if (errors.some((i) => TOO_LARGE_CODES.has(i.code))) return 413;
	if (errors[0] && UNSUPPORTED_CODES.has(errors[0].code)) return 415;
	if (errors.some((i) => PHYSICAL_CODES.has(i.code))) return 422;
	return 400;
}
