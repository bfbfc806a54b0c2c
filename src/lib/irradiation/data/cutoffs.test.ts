/**
 * Wall cut-offs are never the limit of the data: where T stays above the threshold down to the first wavelength with
 * data, the cut-off is null with a note. Expected values: ../shared/REFERENCE.md §2.3 [computed from the CC0
 * refractive-index database k tables]; MANIFEST.md for the crown-glass data range (k 300 nm – 2.5 µm).
 */
import { describe, expect, it } from 'vitest';
import { wallCutoffsNm } from '../walls';
import { findWallMaterial } from './materials';

const model = (id: string) => findWallMaterial(id)!.definition;

describe('cut-offs outside the data are null with a note', () => {
	it('borosilicate crown, 3 mm: T(300 nm) already above 50 % → both cut-offs null, "below the data range, T(300 nm) = …"', () => {
		const c = wallCutoffsNm(model('borosilicate-crown'), 3);
		expect(c.cutoff10Nm).toBeNull();
		expect(c.cutoff50Nm).toBeNull();
		// MANIFEST: internal T(1 mm, 300 nm) = 0.887 → 0.887³ ≈ 0.70 internal for 3 mm, × (1 − R)² ≈ 0.918 → ≈ 64 %
		expect(c.cutoff50Note).toMatch(/^below the data range, T\(300 nm\) = 6[2-6] %$/);
		expect(c.dataFromNm).toBe(300);
	});
	it('borosilicate crown, 10 mm: a real 50 % cut-off at ≈ 308 nm (REFERENCE §2.3, internal; Fresnel adds ≈ 1 nm), 10 % still below the data', () => {
		const c = wallCutoffsNm(model('borosilicate-crown'), 10);
		expect(c.cutoff50Nm!).toBeGreaterThan(306);
		expect(c.cutoff50Nm!).toBeLessThan(312);
		expect(c.cutoff10Nm).toBeNull();
		expect(c.cutoff10Note).toMatch(/^below the data range, T\(300 nm\)/);
	});
	it('fused silica, UV grade, 2 mm: transmits below its first data point (REFERENCE §2.3: "< 190 nm") → null, not "190"', () => {
		const c = wallCutoffsNm(model('fused-silica-uv-grade'), 2);
		expect(c.cutoff10Nm).toBeNull();
		expect(c.cutoff50Nm).toBeNull();
		expect(c.cutoff50Note).toMatch(/^below the data range, T\(19\d(\.\d)? nm\) = (8|9)\d %$/);
	});
	it('borosilicate 3.3 float sheet, 3.3 mm: real cut-offs inside the data (REFERENCE §2.3 internal T10 275, T50 292 nm)', () => {
		const c = wallCutoffsNm(model('borosilicate-3.3-sheet'), 3.3);
		expect(Math.abs(c.cutoff10Nm! - 275)).toBeLessThan(3);
		expect(Math.abs(c.cutoff50Nm! - 292)).toBeLessThan(3);
		expect(c.cutoff10Note).toBeUndefined();
	});
});
