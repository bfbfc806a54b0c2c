/** λmax, edge and cut-offs on synthetic curves whose answers follow from their definition. */
import { describe, expect, it } from 'vitest';
import { findAbsorptionEdge, findCutoff } from './bands';
import { deriveSpectrum } from './derive';
import { findPeaks } from './peaks';
import type { NormalisedSpectrum } from './types';

const gauss = (x: number, c: number, s: number) => Math.exp(-0.5 * ((x - c) / s) ** 2);
const spec = (kind: NormalisedSpectrum['kind'], f: (x: number) => number): NormalisedSpectrum => {
	const x = Float64Array.from({ length: 611 }, (_, i) => 200 + i);
	return { kind, x, y: x.map(f), yUnit: kind === 'transmission' ? 'transmittance' : 'absorbance' };
};

describe('bands', () => {
	it('edge of a Gaussian band (σ 20 nm at 450 nm) is where it falls to 10 %: 450 + 20·√(2 ln 10) nm (analytic)', () => {
		const s = spec('absorption', (x) => 2 * gauss(x, 260, 15) + 0.5 * gauss(x, 450, 20));
		const expected = 450 + 20 * Math.sqrt(2 * Math.log(10));
		expect(Math.abs(findAbsorptionEdge(s.x, s.y)! - expected)).toBeLessThan(0.05);
		const d = deriveSpectrum(s);
		expect(d.lambdaMaxNm).toBe(260);
		expect(d.peaks.map((p) => p.wavelengthNm)).toEqual([260, 450]);
	});
	it('cut-off: shortest λ above which T stays ≥ threshold, linear interpolation (definition)', () => {
		// T rises linearly from 0 at 300 nm to 1 at 400 nm, with a dip to 0.05 at 250 nm below it.
		const s = spec('transmission', (x) => (x < 300 ? (x === 250 ? 0.05 : 0.2) : Math.min(1, (x - 300) / 100)));
		expect(findCutoff(s.x, s.y, 0.5)).toBeCloseTo(350, 9);
		expect(findCutoff(s.x, s.y, 0.1)).toBeCloseTo(310, 9);
		const d = deriveSpectrum(s);
		expect(d.cutoff50Nm).toBeCloseTo(350, 9);
		expect(d.lambdaMaxNm).toBeNull();
		expect(findPeaks(s)).toEqual([]);
		expect(findCutoff(s.x, s.y.map(() => 1), 0.5)).toBeNull();
	});
});
