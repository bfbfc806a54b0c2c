/** resampleToGrid and the common grid (PRODUCT.md: 190–1100 nm, 0.5 nm compute, 1 nm search vector). */
import { describe, expect, it } from 'vitest';
import { bufferToVector, makeGrid, SEARCH_LENGTH, toSearchVector, vectorToBuffer } from './grid';
import { resampleToGrid } from './resample';

describe('resampleToGrid', () => {
	it('linear interpolation is exact for a straight line, NaN outside the data (definition)', () => {
		const r = resampleToGrid([200, 210, 230], [0, 1, 3], 195, 235, 5);
		expect(Array.from(r.slice(1, 8))).toEqual([0, 0.5, 1, 1.5, 2, 2.5, 3]);
		expect(Number.isNaN(r[0])).toBe(true);
		expect(Number.isNaN(r[8])).toBe(true);
	});
	it('accepts descending x and non-uniform steps', () => {
		const r = resampleToGrid([400, 390, 300], [4, 3.9, 3], 300, 400, 50);
		expect(r[0]).toBeCloseTo(3, 12);
		expect(r[1]).toBeCloseTo(3.5, 12);
		expect(r[2]).toBeCloseTo(4, 12);
	});
});

describe('grid and search vector', () => {
	it('911 values on 190–1100 nm at 1 nm; the compute grid has 1821 points at 0.5 nm (PRODUCT.md)', () => {
		expect(SEARCH_LENGTH).toBe(911);
		const g = makeGrid();
		expect(g.length).toBe(1821);
		expect(g[1820]).toBe(1100);
	});
	it('0 outside the measured range, Float32 BLOB round trip', () => {
		const v = toSearchVector({ x: Float64Array.from([300, 400]), y: Float64Array.from([1, 2]) });
		expect(v).toBeInstanceOf(Float32Array);
		expect(v[0]).toBe(0);
		expect(v[110]).toBe(1);
		expect(v[160]).toBeCloseTo(1.5, 6);
		expect(v[211]).toBe(0);
		expect(Array.from(bufferToVector(vectorToBuffer(v)))).toEqual(Array.from(v));
		expect(() => bufferToVector(new Uint8Array(3))).toThrow(RangeError);
	});
});
