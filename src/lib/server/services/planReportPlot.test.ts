import { describe, expect, it } from 'vitest';
import { clippedNote, overlayFrame } from './planReportPlot';

// Invented curves on a 1 nm grid (test data): a band peaking at A = 4.2 and one at A = 0.8.
const x = Array.from({ length: 701 }, (_, i) => 200 + i);
const band = (peak: number, centre: number, width: number) => x.map((l) => peak * Math.exp(-(((l - centre) / width) ** 2)));

describe('report overlay frame', () => {
	it('an absorbance above 3 is cut at the axis and the caption says so, with the real maximum', () => {
		const f = overlayFrame({ x, series: [{ name: 'dense', kind: 'absorbance', y: band(4.2, 350, 20) }] } as never);
		expect(f.aMax).toBe(3);
		expect(f.clipped).toBe(true);
		expect(f.aPeak).toBeCloseTo(4.2, 6);
		expect(clippedNote(f)).toMatch(/A = 4\.20/);
	});
	it('below 3 the axis fits the largest value (rounded up to 0.1) and nothing is said', () => {
		const f = overlayFrame({ x, series: [{ name: 'thin', kind: 'absorbance', y: band(0.8, 450, 20) }] } as never);
		expect(f.aMax).toBeCloseTo(0.8, 12);
		expect(f.clipped).toBe(false);
		expect(clippedNote(f)).toBe('');
		expect(f.from).toBeLessThanOrEqual(400);
		expect(f.to).toBeGreaterThanOrEqual(500);
	});
});
