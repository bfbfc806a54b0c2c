import { describe, expect, it } from 'vitest';
import { formatBytes, formatDuration, formatLengthCm, formatNm, formatPercent, formatPhotonFlux, formatSI, formatSig } from './format';

describe('site number formatter', () => {
	it('rounds to significant figures and never prints e+ notation', () => {
		expect(formatSig(3.0512e-6 * 1e6)).toBe('3.05');
		expect(formatSig(123456)).toBe('123000');
		expect(formatSig(999.96)).toBe('1000');
		expect(formatSig(0.001234)).toBe('0.00123');
		expect(formatSig(2.5e-9)).toBe('2.5 × 10⁻⁹');
		expect(formatSig(6.75e11)).toBe('6.75 × 10¹¹');
		expect(formatSig(1.5, 3, true)).toBe('1.50');
		expect(formatSig(NaN)).toBe('—');
		expect(formatSig(null)).toBe('—');
	});
	it('puts SI prefixes on units', () => {
		// prefixes: BIPM, The International System of Units (SI Brochure), 9th ed. 2019, Table 7
		expect(formatPhotonFlux(3.0512e-6)).toBe('3.05 µmol s⁻¹');
		expect(formatPhotonFlux(2.5e-9)).toBe('2.5 nmol s⁻¹');
		expect(formatPhotonFlux(9.9996e-7)).toBe('1 µmol s⁻¹');
		expect(formatSI(0.012, 'L')).toBe('12 mL');
		expect(formatSI(1500, 'W')).toBe('1.5 kW');
		expect(formatSI(0, 'W')).toBe('0 W');
		expect(formatSI(-4.2e-3, 'V')).toBe('-4.2 mV');
	});
	it('caps percentages at 100 % and keeps small ones readable', () => {
		expect(formatPercent(0.714)).toBe('71 %');
		expect(formatPercent(0.0123)).toBe('1.2 %');
		expect(formatPercent(0.00123)).toBe('0.12 %');
		expect(formatPercent(4e-7)).toBe('< 0.01 %');
		expect(formatPercent(1)).toBe('100 %');
		expect(formatPercent(1.0000001)).toBe('100 %');
		expect(formatPercent(0.99999)).toBe('> 99.9 %');
		expect(formatPercent(0.997)).toBe('99.7 %');
		expect(formatPercent(-0.001)).toBe('0 %');
	});
	it('says "more than a year" instead of 1e+11 d', () => {
		// a Julian year is 365.25 d (IAU; SI Brochure 9th ed., Table 8 note)
		expect(formatDuration(30)).toBe('30 s');
		expect(formatDuration(720)).toBe('12 min');
		expect(formatDuration(3.4 * 3600)).toBe('3.4 h');
		expect(formatDuration(2.1 * 86400)).toBe('2.1 d');
		expect(formatDuration(364 * 86400)).toBe('360 d');
		expect(formatDuration(6.75e11 * 86400)).toBe('more than a year');
		expect(formatDuration(0.25)).toBe('250 ms');
		expect(formatDuration(null)).toBe('—');
	});
	it('formats file sizes, wavelengths and depths', () => {
		expect(formatBytes(21504 * 1024)).toBe('22 MB');
		expect(formatBytes(840)).toBe('840 B');
		expect(formatNm(452.25)).toBe('452.5 nm');
		expect(formatNm(452)).toBe('452 nm');
		expect(formatLengthCm(0.042)).toBe('0.42 mm');
		expect(formatLengthCm(2.5)).toBe('2.5 cm');
		expect(formatLengthCm(500)).toBe('more than 1 m');
	});
});
