/** Unit recognition and conversions. Constants: CODATA 2018 (NIST SP 961, 2019). */
import { describe, expect, it } from 'vitest';
import { absorbanceToPercentT, epsilonToLogEpsilon, fromAxis, HC_EV_NM, logEpsilonToEpsilon, parseXUnit, parseYUnit, percentTToAbsorbance, photonUnit, toAxis } from './units';

describe('axis conversions', () => {
	it('hc/e = 1239.841984 eV nm (CODATA 2018, exact h, c, e)', () => {
		expect(HC_EV_NM).toBeCloseTo(1239.841984, 6);
	});
	it('400 nm = 25 000 cm⁻¹ (ν̃ = 1e7/λ, definition) = 3.0996 eV (hc/λ)', () => {
		expect(toAxis(400, 'cm-1')).toBeCloseTo(25000, 9);
		expect(toAxis(400, 'eV')).toBeCloseTo(3.099605, 6);
		expect(fromAxis(toAxis(365, 'eV'), 'eV')).toBeCloseTo(365, 9);
		expect(fromAxis(25000, 'cm-1')).toBeCloseTo(400, 9);
	});
	it('A ↔ %T: A = 2 − log10(%T) (IUPAC Gold Book); ε ↔ log ε', () => {
		expect(percentTToAbsorbance(10)).toBeCloseTo(1, 12);
		expect(absorbanceToPercentT(2)).toBeCloseTo(1, 12);
		expect(logEpsilonToEpsilon(epsilonToLogEpsilon(12345))).toBeCloseTo(12345, 8);
	});
});

describe('unit names as instruments write them (MANIFEST files and common practice)', () => {
	it.each([
		['nm', 'nm'], ['NANOMETERS', 'nm'], ['nanometers', 'nm'], ['Wavelength (nm)', 'nm'],
		['1/CM', 'cm-1'], ['cm-1', 'cm-1'], ['MICROMETERS', 'um'], ['µm', 'um']
	])('x %s → %s', (label, unit) => expect(parseXUnit(label)).toBe(unit));
	it.each([
		['A', 'absorbance'], ['ABSORBANCE', 'absorbance'], ['%T', 'transmittance-percent'], ['Transmittance(%)', 'transmittance-percent'],
		['TRANSMITTANCE', 'transmittance'], ['MOLAR ABSORPTIVITY (M-1 CM-1)', 'epsilon'], ['log ε', 'log-epsilon'],
		['W m-2 nm-1', 'W/m2/nm'], ['counts', 'counts'], ['RELATIVE INTENSITY', 'relative'], ['Emission', 'relative'],
		['µW/cm²/nm', 'relative'], ['mW/nm', 'relative'], ['W/nm', 'W/nm'], ['µmol m-2 s-1 nm-1', 'umol/m2/s/nm'], ['µmol photons m⁻² s⁻¹ nm⁻¹', 'umol/m2/s/nm'], ['umol/s/nm', 'umol/s/nm'], ['MICROMOL PHOTONS/M2/S/NM', 'umol/m2/s/nm'], ['photon irradiance (µmol m-2 s-1 nm-1)', 'umol/m2/s/nm'], ['µmol m-2 s-1', 'relative'], ['Trans.', 'transmittance'], ['OD', 'absorbance']
	])('y %s → %s', (label, unit) => expect(parseYUnit(label)?.yUnit).toBe(unit));
	it('VARIANCE and standard deviation are not spectra; ARBITRARY UNITS gives no hint', () => {
		expect(parseYUnit('VARIANCE')?.notSpectrum).toBe(true);
		expect(parseYUnit('Std.Dev.')?.notSpectrum).toBe(true);
		expect(parseYUnit('ARBITRARY UNITS')).toBeUndefined();
		expect(parseYUnit('R%')).toBeUndefined(); // reflectance must not be read as %T
	});
});

describe('photon-flux units with their factor to µmol (SI prefixes; Avogadro constant CODATA 2018, exact)', () => {
	const NA = 6.02214076e23; // CODATA 2018, exact
	it.each([
		['µmol m-2 s-1 nm-1', 'umol/m2/s/nm', 1],
		['mol m^-2 s^-1 nm^-1', 'umol/m2/s/nm', 1e6],
		['nmol cm-2 s-1 nm-1', 'umol/m2/s/nm', 1e-3 * 1e4],
		['µE m-2 s-1 nm-1', 'umol/m2/s/nm', 1], // einstein = one mole of photons (IUPAC Gold Book)
		['photons cm-2 s-1 nm-1', 'umol/m2/s/nm', (1e6 / NA) * 1e4],
		['µmol m-2 s-1 µm-1', 'umol/m2/s/nm', 1e-3],
		['µmol/s/nm', 'umol/s/nm', 1]
	])('%s → %s × %d', (label, unit, scale) => {
		const p = photonUnit(label)!;
		expect(p.yUnit).toBe(unit);
		expect(p.scale / scale).toBeCloseTo(1, 12);
	});
	it('an integral (no per-wavelength part) or a non-photon label is not a photon-flux density', () => {
		expect(photonUnit('µmol m-2 s-1')).toBeUndefined();
		expect(photonUnit('mol L-1')).toBeUndefined();
		expect(photonUnit('absorbance')).toBeUndefined();
		expect(photonUnit('E (V vs SCE)')).toBeUndefined();
	});
});
