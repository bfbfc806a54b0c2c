/**
 * What a JCAMP-DX block is, from its ##DATA TYPE (JCAMP-DX 4.24 §4: INFRARED SPECTRUM, UV/VIS SPECTRUM, NMR SPECTRUM,
 * MASS SPECTRUM, RAMAN SPECTRUM, LINK, and what instrument software writes instead).
 */
import type { SpectrumKind } from '../types';

export interface DataTypeClass {
	/** Set when the block is not an optical absorption/transmission/emission spectrum: what it is instead. */
	notOptical?: string;
	/** A short name for messages ("infrared spectrum", "UV–vis spectrum", "spectrum"). */
	name: string;
	kind?: SpectrumKind;
	infrared?: boolean;
}

/** Classifies a ##DATA TYPE value (case and spacing ignored). */
export function classifyDataType(dataType: string | undefined): DataTypeClass {
	const s = (dataType ?? '').toUpperCase();
	if (!s.trim()) return { name: 'spectrum' };
	if (/NMR|NUCLEAR MAGNETIC/.test(s)) return { notOptical: 'an NMR spectrum', name: 'NMR spectrum' };
	if (/MASS|\bMS\b|\bGC-?MS\b|\bLC-?MS\b/.test(s)) return { notOptical: 'a mass spectrum', name: 'mass spectrum' };
	if (/\bI-?V\b|\bC-?V\b|VOLTAMM|ELECTROCHEM|POLAROG|CURRENT|IMPEDANCE/.test(s)) return { notOptical: 'a current–voltage (electrochemical) curve', name: 'current–voltage curve' };
	if (/CHROMATOGRAM|\bGC\b|HPLC|\bLC\b|ELECTROPHEROGRAM/.test(s)) return { notOptical: 'a chromatogram', name: 'chromatogram' };
	if (/TITRAT/.test(s)) return { notOptical: 'a titration curve', name: 'titration curve' };
	if (/X-?RAY|\bXRD\b|DIFFRACT/.test(s)) return { notOptical: 'an X-ray diffractogram', name: 'diffractogram' };
	if (/\bEPR\b|\bESR\b|ELECTRON (PARA|SPIN)/.test(s)) return { notOptical: 'an EPR spectrum', name: 'EPR spectrum' };
	if (/\bDSC\b|\bTGA\b|THERMO|CALORIM/.test(s)) return { notOptical: 'a thermal analysis curve', name: 'thermal analysis curve' };
	if (/RAMAN/.test(s)) return { notOptical: 'a Raman spectrum (its x is a Raman shift from the laser line, not a wavelength)', name: 'Raman spectrum' };
	if (/INFRARED|FT-?IR|\bN?IR\b|\bATR\b/.test(s)) return { name: 'infrared spectrum', infrared: true };
	if (/EMISSION|FLUORESC|LUMINESC|PHOSPHORESC/.test(s)) return { name: 'emission spectrum', kind: 'emission' };
	if (/TRANSMI/.test(s)) return { name: 'transmission spectrum', kind: 'transmission' };
	if (/UV|VIS|ABSORPTION|ABSORBANCE/.test(s)) return { name: 'UV–vis spectrum', kind: 'absorption' };
	return { name: 'spectrum' };
}

/** "452–3794 cm⁻¹ (2.6–22 µm)", "233.8–275 nm": a range for messages, in µm above 1100 nm. */
export function describeNmRange(minNm: number, maxNm: number): string {
	const sig = (v: number, p: number) => String(Number(v.toPrecision(p)));
	for (let p = 2; p <= 6; p++) {
		const [a, b] = minNm >= 1100 ? [sig(minNm / 1000, p), sig(maxNm / 1000, p)] : [sig(minNm, p + 2), sig(maxNm, p + 2)];
		if (a !== b || p === 6) return minNm >= 1100 ? `${a}–${b} µm` : `${a}–${b} nm`;
	}
	return '';
}
