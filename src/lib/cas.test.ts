/** CAS Registry Number check digit: Σ (digit × position from the right) mod 10 (Chemical Abstracts Service verification formula). */
import { describe, expect, it } from 'vitest';
import { casEquals, classifyCasQuery, expectedCasCheckDigit, isCasShaped, isValidCasNumber, normaliseCas } from './cas';

describe('CAS numbers', () => {
	it('accepts real CAS numbers (water 7732-18-5, THF 109-99-9, acetonitrile 75-05-8, acetone 67-64-1; CAS Common Chemistry, from memory)', () => {
		for (const c of ['7732-18-5', '109-99-9', '75-05-8', '67-64-1', '75-09-2']) expect(isValidCasNumber(c)).toBe(true);
	});
	it('999-99-9 has the shape but a wrong check digit (9×1+9×2+9×3+9×4+9×5 = 135 → 5)', () => {
		expect(isCasShaped('999-99-9')).toBe(true);
		expect(expectedCasCheckDigit('999-99-9')).toBe(5);
		expect(classifyCasQuery('999-99-9')).toMatchObject({ kind: 'invalid-cas' });
		expect((classifyCasQuery('999-99-9') as { message: string }).message).toMatch(/check digit should be 5/);
	});
	it('names are not CAS-shaped; leading zeros and spaces are canonicalised', () => {
		expect(classifyCasQuery('tetrahydrofuran')).toEqual({ kind: 'not-cas' });
		expect(classifyCasQuery('THF')).toEqual({ kind: 'not-cas' });
		expect(normaliseCas(' 0109-99-9 ')).toBe('109-99-9');
		expect(casEquals('109-99-9', '0109-99-9')).toBe(true);
		expect(casEquals('109-99-9', '999-99-5')).toBe(false);
		expect(casEquals(null, '109-99-9')).toBe(false);
	});
});
