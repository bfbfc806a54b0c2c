/** Unit and kind labels written by the exporters; each one reads back through parseXUnit / parseYUnit. */
import type { NormalisedSpectrum, SpectrumKind } from '../types';

export const JCAMP_Y_UNITS: Record<NormalisedSpectrum['yUnit'], string> = {
	absorbance: 'ABSORBANCE',
	epsilon: 'MOLAR ABSORPTIVITY (M-1 CM-1)',
	transmittance: 'TRANSMITTANCE',
	reflectance: 'REFLECTANCE',
	relative: 'RELATIVE INTENSITY',
	'W/nm': 'W/NM',
	'W/m2/nm': 'W/M2/NM',
	'umol/s/nm': 'MICROMOL PHOTONS/S/NM',
	'umol/m2/s/nm': 'MICROMOL PHOTONS/M2/S/NM',
	counts: 'COUNTS'
};

export const CSV_Y_HEADERS: Record<NormalisedSpectrum['yUnit'], string> = {
	absorbance: 'absorbance',
	epsilon: 'epsilon (M-1 cm-1)',
	transmittance: 'transmittance (fraction)',
	reflectance: 'reflectance (fraction)',
	relative: 'relative emission',
	'W/nm': 'W/nm',
	'W/m2/nm': 'W/m2/nm',
	'umol/s/nm': 'umol/s/nm',
	'umol/m2/s/nm': 'umol/m2/s/nm',
	counts: 'counts'
};

export const JCAMP_DATA_TYPE: Record<SpectrumKind, string> = {
	absorption: 'UV/VIS SPECTRUM',
	transmission: 'UV/VIS SPECTRUM',
	emission: 'EMISSION SPECTRUM',
	reflectance: 'UV/VIS REFLECTANCE SPECTRUM'
};
