/** normaliseSpectrum: nm ascending, wavenumber resampling, y conversions (sources beside each check). */
import { describe, expect, it } from 'vitest';
import { normaliseSpectrum } from './normalise';
import { findMaxIndex } from './bands';
import type { RawSpectrum } from './types';

const raw = (x: number[], y: number[], p: Partial<RawSpectrum>): RawSpectrum => ({ label: 't', index: 0, x: Float64Array.from(x), y: Float64Array.from(y), xUnit: 'nm', yUnit: 'absorbance', kind: 'absorption', metadata: {}, ...p });
const ok = (r: ReturnType<typeof normaliseSpectrum>) => {
	if (!r.ok) throw new Error(JSON.stringify(r.issues));
	return r.value;
};

describe('normaliseSpectrum', () => {
	it('a Gaussian band centred at 25 000 cm⁻¹ lands at 400 nm ± 0.5 after resampling (λ = 1e7/ν̃, definition)', () => {
		const nu: number[] = [];
		const y: number[] = [];
		for (let v = 50000; v >= 10000; v -= 10) {
			nu.push(v);
			y.push(Math.exp(-0.5 * ((v - 25000) / 1500) ** 2));
		}
		const r = normaliseSpectrum(raw(nu, y, { xUnit: 'cm-1' }));
		const s = ok(r);
		if (r.ok) expect(r.warnings.some((w) => w.code === 'resampled_from_wavenumber')).toBe(true);
		// uniform nm grid (resampled, not relabelled): constant step
		const step = s.x[1] - s.x[0];
		expect(Math.abs(s.x[s.x.length - 1] - s.x[s.x.length - 2] - step)).toBeLessThan(1e-9);
		expect(s.x[0]).toBeGreaterThanOrEqual(200 - 1e-9);
		expect(s.x[s.x.length - 1]).toBeLessThanOrEqual(1000 + 1e-9);
		expect(Math.abs(s.x[findMaxIndex(s.x, s.y)] - 400)).toBeLessThanOrEqual(0.5);
	});
	it('µm → nm and descending x → ascending', () => {
		const s = ok(normaliseSpectrum(raw([0.5, 0.4, 0.3, 0.2, 0.19], [1, 2, 3, 4, 5], { xUnit: 'um' })));
		expect(Array.from(s.x)).toEqual([190, 200, 300, 400, 500]);
		expect(Array.from(s.y)).toEqual([5, 4, 3, 2, 1]);
	});
	it('%T → T fraction for transmission; %T → A = 2 − log10(%T) for absorption (IUPAC Gold Book)', () => {
		const t = ok(normaliseSpectrum(raw([300, 301, 302, 303, 304], [100, 50, 10, 1, 0], { yUnit: 'transmittance-percent', kind: 'transmission' })));
		expect(Array.from(t.y)).toEqual([1, 0.5, 0.1, 0.01, 0]);
		expect(t.yUnit).toBe('transmittance');
		const a = normaliseSpectrum(raw([300, 301, 302, 303, 304], [100, 50, 10, 1, 0], { yUnit: 'transmittance-percent', kind: 'absorption' }));
		const s = ok(a);
		expect(s.y[2]).toBeCloseTo(1, 12);
		expect(s.y[3]).toBeCloseTo(2, 12);
		expect(s.y[1]).toBeCloseTo(2 - Math.log10(50), 12);
		expect(s.y[4]).toBe(10); // T = 0 capped at A = 10 with a warning (common practice)
		if (a.ok) expect(a.warnings[0].code).toBe('absorbance_capped');
	});
	it('log ε → ε; absorbance → ε = A/(c·l) when c and l are known (Beer–Lambert), else absorbance kept', () => {
		const e = ok(normaliseSpectrum(raw([300, 301, 302, 303, 304], [4, 3, 2, 1, 0], { yUnit: 'log-epsilon' })));
		expect(e.yUnit).toBe('epsilon');
		expect(e.y[0]).toBeCloseTo(1e4, 8);
		const a = ok(normaliseSpectrum(raw([300, 301, 302, 303, 304], [0.5, 1, 0.5, 0.2, 0.1], {}), { concentrationM: 1e-4, pathCm: 1 }));
		expect(a.yUnit).toBe('epsilon');
		expect(a.y[1]).toBeCloseTo(1e4, 8);
		expect(ok(normaliseSpectrum(raw([300, 301, 302, 303, 304], [0.5, 1, 0.5, 0.2, 0.1], { metadata: { pathCm: 1 } }))).yUnit).toBe('absorbance');
	});
	it('emission: counts kept as relative, W/m2/nm kept', () => {
		expect(ok(normaliseSpectrum(raw([300, 301, 302, 303, 304], [1, 2, 3, 2, 1], { yUnit: 'counts', kind: 'emission' }))).yUnit).toBe('relative');
		expect(ok(normaliseSpectrum(raw([300, 301, 302, 303, 304], [1, 2, 3, 2, 1], { yUnit: 'W/m2/nm', kind: 'emission' }))).yUnit).toBe('W/m2/nm');
	});
	it('refuses a negative concentration (422 in API.md)', () => {
		const r = normaliseSpectrum(raw([300, 301, 302, 303, 304], [1, 2, 3, 2, 1], {}), { concentrationM: -1, pathCm: 1 });
		expect(r.ok).toBe(false);
	});
});
