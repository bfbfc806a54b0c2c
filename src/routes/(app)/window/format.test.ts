import { describe, expect, it } from 'vitest';
import { fmtDuration, fmtFlux, fmtPct } from './format';

describe('Window finder formats', () => {
	it('formats photon flux, fractions and durations', () => {
		expect(fmtFlux(3.0512e-6)).toBe('3.05 µmol s⁻¹');
		expect(fmtFlux(2.5e-9)).toBe('2.50 nmol s⁻¹');
		expect(fmtPct(0.714)).toBe('71 %');
		expect(fmtPct(0.0123)).toBe('1.2 %');
		expect(fmtDuration(30)).toBe('30 s');
		expect(fmtDuration(720)).toBe('12.0 min');
		expect(fmtDuration(3.4 * 3600)).toBe('3.40 h');
		expect(fmtDuration(null)).toBe('—');
	});
});
