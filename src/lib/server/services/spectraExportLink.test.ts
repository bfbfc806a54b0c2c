/** The id list of a LINK export (invented ids; the route's role checks are in the role × route matrix). */
import { describe, expect, it } from 'vitest';
import { ApiError } from '../http';
import { parseIdList } from './spectraExportLink';

describe('parseIdList', () => {
	it('keeps the order and drops repeats', () => {
		expect(parseIdList('3, 1,3,2')).toEqual([3, 1, 2]);
	});
	it.each([null, '', '1,x', '0', '-2', '1.5', Array.from({ length: 101 }, (_, i) => i + 1).join(',')])('refuses %s with 400 naming ids', (v) => {
		try {
			parseIdList(v as string | null);
			throw new Error('accepted');
		} catch (e) {
			expect(e).toBeInstanceOf(ApiError);
			expect((e as ApiError).status).toBe(400);
			expect((e as ApiError).extra.field).toBe('ids');
		}
	});
});
