/**
 * Safety cautions for an emission spectrum (any grid, W nm⁻¹): the CIE bands that carry ≥ 1 % of its
 * power, actinic UV with the ICNIRP 2004 weighting, ozone, retinal blue-light hazard, and lamp-type hazards
 * (heat, high voltage, pressure, mercury, laser). Guidance only; the list always ends with the deferral
 * to local regulations and the institution's safety officer.
 */
import { actinicEffectiveFraction } from './icnirp';
import { formatDuration, formatSig } from '../format';
import { exposureAtDistance, type ExposureAtDistance, type ExposureInput } from './exposure';
import { integrateSpectrum, type EmissionSpectrum } from './spectrumIntegral';

export type { EmissionSpectrum };
import { CAUTION_GRID, lampSpectrum, type LampModel, type LampType } from './lamps';

export type BandName = 'UV-C' | 'UV-B' | 'UV-A' | 'blue' | 'visible' | 'IR';
export type CautionSeverity = 'danger' | 'warning' | 'info';
export interface Caution { code: string; band?: BandName; severity: CautionSeverity; title: string; text: string; source: string }
export interface BandShare { band: BandName; fromNm: number; toNm: number; powerW: number; fraction: number }

/** CIE/ISO bands: UV-C 100–280, UV-B 280–315, UV-A 315–400 nm; blue 400–500; rest of visible to 780; IR beyond. */
export const SPECTRAL_BANDS: readonly { band: BandName; fromNm: number; toNm: number }[] = [
	{ band: 'UV-C', fromNm: 100, toNm: 280 }, { band: 'UV-B', fromNm: 280, toNm: 315 }, { band: 'UV-A', fromNm: 315, toNm: 400 },
	{ band: 'blue', fromNm: 400, toNm: 500 }, { band: 'visible', fromNm: 500, toNm: 780 }, { band: 'IR', fromNm: 780, toNm: Infinity }
];

export const SAFETY_DEFERRAL_TEXT =
	'Values are for guidance only. Photobiological limits, risk-group assignments and laboratory rules are set by national regulations and your institution. Consult your institutional safety officer before operating any light source.';

const ICNIRP = 'ICNIRP, Health Phys. 87, 171–186 (2004); CIE band limits';
const PRACTICE = 'common practice';

/** Power (W) between fromNm and toNm: exact integral of the piecewise-linear spectrum. */
export const powerInRangeW = (s: EmissionSpectrum, fromNm: number, toNm: number): number => integrateSpectrum(s, fromNm, toNm);

/** Bands carrying at least `minFraction` (default 1 %) of the spectrum's power. */
export function spectralBandShares(s: EmissionSpectrum, minFraction = 0.01): BandShare[] {
	const total = powerInRangeW(s, 0, Infinity);
	if (!(total > 0)) return [];
	return SPECTRAL_BANDS.map((b) => ({ ...b, powerW: powerInRangeW(s, b.fromNm, b.toNm), fraction: powerInRangeW(s, b.fromNm, b.toNm) / total }))
		.filter((b) => b.fraction >= minFraction);
}

export interface CautionOptions {
	/** Lamp model type, for lamp hazards (heat, high voltage, pressure, mercury, laser). */
	lampType?: LampType;
	/** Smallest power share for a band to count (default 0.01). */
	minBandFraction?: number;
	/** Power share below `ozoneBelowNm` that triggers the ozone caution (default 0.001). */
	ozoneFraction?: number;
	/** Ozone wavelength limit, nm (default 240; O₂ photodissociation threshold ≈ 242 nm). */
	ozoneBelowNm?: number;
	/** Optical power in 400–500 nm from which the blue-light caution applies, W (default 1). */
	blueLightThresholdW?: number;
	/** A stated distance to the person (and a radiometer reading there): adds the irradiance there and the limit times. */
	exposure?: ExposureInput | null;
}

const pct = (f: number) => (f >= 0.995 ? '100 %' : f >= 0.1 ? `${(f * 100).toFixed(0)} %` : `${(f * 100).toPrecision(2)} %`);
const UV_TEXT: Record<'UV-C' | 'UV-B' | 'UV-A', [CautionSeverity, string]> = {
	'UV-C': ['danger', 'UV-C burns skin and eyes (erythema, photokeratitis) within seconds to minutes at close range and is invisible. Enclose the source with interlocks; wear a UV-rated face shield, gloves and covered skin.'],
	'UV-B': ['danger', 'UV-B causes skin erythema and photokeratitis; the effect appears hours later. Enclose the source; wear UV-rated eye and face protection and covered skin.'],
	'UV-A': ['warning', 'UV-A reaches the eye lens and is barely visible; ICNIRP also limits unweighted UV-A to the eye. Shield the source and wear UV-rated eyewear.']
};

/** Cautions for one emission spectrum (W nm⁻¹ on any grid); the deferral caution is always last. */
export function cautionsForSpectrum(s: EmissionSpectrum, options: CautionOptions = {}): Caution[] {
	const { lampType, minBandFraction = 0.01, ozoneFraction = 0.001, ozoneBelowNm = 240, blueLightThresholdW = 1 } = options;
	const out: Caution[] = [];
	const total = powerInRangeW(s, 0, Infinity);
	for (const b of spectralBandShares(s, minBandFraction)) {
		if (b.band !== 'UV-C' && b.band !== 'UV-B' && b.band !== 'UV-A') continue;
		const [severity, advice] = UV_TEXT[b.band];
		const actinic = actinicEffectiveFraction(s.wavelengthNm, s.powerWPerNm, b.fromNm, b.toNm);
		out.push({ code: `uv-${b.band.slice(3).toLowerCase()}`, band: b.band, severity, title: `${b.band} radiation: skin and eye hazard`,
			text: `${b.band} (${b.fromNm}–${b.toNm} nm) carries ${pct(b.fraction)} of the optical power; its ICNIRP actinic-weighted effective fraction is ${actinic.toPrecision(2)} of the total power. ${advice}`, source: ICNIRP });
	}
	const below = total > 0 ? powerInRangeW(s, 0, ozoneBelowNm) / total : 0;
	if (below >= ozoneFraction) {
		out.push({ code: 'ozone', band: 'UV-C', severity: 'warning', title: 'Ozone in air',
			text: `${pct(below)} of the power lies below ${ozoneBelowNm} nm, where O₂ is split (threshold ≈ 242 nm): the lamp makes ozone in air. Ventilate or purge with N₂; the occupational limit is ≈ 0.1 ppm (8 h).`,
			source: 'O₂ photodissociation threshold and OSHA PEL for ozone (from memory)' });
	}
	const blueW = powerInRangeW(s, 400, 500);
	if (blueW >= blueLightThresholdW) {
		out.push({ code: 'blue-light', band: 'blue', severity: 'warning', title: 'Retinal blue-light hazard',
			text: `About ${blueW.toPrecision(2)} W of optical power in 400–500 nm: photochemical retinal hazard (weighting peaks near 435–440 nm). Never look into the source; use orange or amber filter shields.`,
			source: 'IEC 62471:2006; ICNIRP, Health Phys. 105, 74 (2013)' });
	}
	if (options.exposure) {
		const e = exposureAtDistance(s, options.exposure, lampType);
		if (e) out.push(exposureCaution(e));
	}
	out.push(...lampTypeCautions(lampType, total));
	return finish(out);
}

/** A limit time as a person reads it; beyond a working day the limit is not reached in one. */
const limitTime = (s: number) => (s >= 8 * 3600 ? 'more than an 8 h working day' : formatDuration(s));
const GROUP: Record<string, string> = { exempt: 'the exempt group', RG1: 'risk group 1', RG2: 'risk group 2', RG3: 'risk group 3' };

/** The irradiance at the stated distance and the ICNIRP limit times (exposure.ts), as one caution. */
function exposureCaution(e: ExposureAtDistance): Caution {
	const uv = e.actinicEffectiveWPerM2 > 0 || e.uvaWPerM2 > 0;
	const actinicShort = e.actinicLimitS !== null && e.actinicLimitS < 8 * 3600;
	const severity: CautionSeverity = (e.actinicLimitS !== null && e.actinicLimitS < 3600) || e.uvaLimitS !== null ? 'danger' : actinicShort ? 'warning' : 'info';
	const parts = [`At ${e.distanceCm} cm the lamp gives ${formatSig(e.irradianceWPerM2)} W m⁻² (${e.basisLabel}).`];
	if (uv) {
		parts.push(
			`Actinic UV ${formatSig(e.actinicEffectiveWPerM2, 2)} W m⁻² effective: the ICNIRP daily limit of 30 J m⁻² is reached in ${e.actinicLimitS !== null ? limitTime(e.actinicLimitS) : '—'}.`,
			`UV-A ${formatSig(e.uvaWPerM2, 2)} W m⁻²: ${e.uvaLimitS !== null ? `the eye limit of 10 kJ m⁻² is reached in ${limitTime(e.uvaLimitS)}` : 'below the 10 W m⁻² limit for long exposures'}.`,
			`For orientation only, IEC 62471 would put these values in ${GROUP[e.actinicGroup]} (actinic UV) and ${GROUP[e.uvaGroup]} (UV-A, eye); the standard assesses at its own distance.`
		);
	}
	if (e.blueWPerM2 >= 0.01 * e.irradianceWPerM2) parts.push(`400–500 nm: ${formatSig(e.blueWPerM2)} W m⁻²; the retinal blue-light hazard depends on the source's radiance, not assessed here: never look into the source.`);
	return {
		code: 'exposure-at-distance',
		severity,
		title: `Exposure at ${e.distanceCm} cm`,
		text: parts.join(' '),
		source: 'ICNIRP, Health Phys. 87, 171–186 (2004) (limits from memory); IEC 62471:2006 risk-group values (from memory); geometry model common practice'
	};
}

function lampTypeCautions(type: LampType | undefined, powerW: number): Caution[] {
	const out: Caution[] = [];
	const arc = type === 'mercury-medium-pressure' || type === 'xenon';
	if (arc || type === 'blackbody') out.push({ code: 'heat', severity: 'warning', title: 'Hot lamp', source: PRACTICE,
		text: 'The envelope runs at hundreds of °C and most input power becomes heat: use a cooled immersion well with a coolant-flow interlock, keep solvents and flammables away, and let the lamp cool before handling.' });
	if (type === 'led' && powerW >= 5) out.push({ code: 'heat', severity: 'info', title: 'LED heat', source: PRACTICE,
		text: 'High-power LED arrays need heat sinking; measure the reaction temperature rather than assuming room temperature.' });
	if (arc || type === 'excimer') out.push({ code: 'high-voltage', severity: 'warning', title: 'High voltage', source: PRACTICE,
		text: 'Arc igniters deliver pulses of several to tens of kV and barrier-discharge drivers run kV AC: keep cooling water and electrics apart and use interlocked enclosures.' });
	if (arc) out.push({ code: 'pressure', severity: 'warning', title: 'Lamp under pressure', source: PRACTICE,
		text: 'Hot arc bulbs are under high pressure and can burst: change them only cold, wearing a face shield.' });
	if (type === 'mercury-low-pressure' || type === 'mercury-medium-pressure' || type === 'phosphor') out.push({ code: 'mercury', severity: 'info', title: 'Contains mercury', source: PRACTICE,
		text: 'Keep a mercury-spill procedure at hand and dispose of lamps as hazardous waste.' });
	if (type === 'laser') out.push({ code: 'laser', severity: 'warning', title: 'Laser', source: 'IEC 60825-1 (laser product safety)',
		text: 'Laser-class rules apply: beam enclosures, wavelength-rated goggles and the institution\'s laser safety officer.' });
	return out;
}

const RANK: Record<CautionSeverity, number> = { danger: 0, warning: 1, info: 2 };
const DEFERRAL: Caution = { code: 'consult-safety-officer', severity: 'info', title: 'Local rules apply', text: SAFETY_DEFERRAL_TEXT, source: 'Windowsill safety policy: local regulations and the institution’s safety officer decide' };

function finish(list: Caution[]): Caution[] {
	return [...list.filter((c) => c.code !== DEFERRAL.code)].sort((a, b) => RANK[a.severity] - RANK[b.severity]).concat(DEFERRAL);
}

/** Merges the cautions of several lamps: one per code and band (first text kept, highest severity), deferral last. */
export function mergeCautions(...lists: Caution[][]): Caution[] {
	const byKey = new Map<string, Caution>();
	for (const c of lists.flat()) {
		const key = `${c.code}|${c.band ?? ''}`;
		const prev = byKey.get(key);
		if (!prev) byKey.set(key, c);
		else if (RANK[c.severity] < RANK[prev.severity]) byKey.set(key, { ...prev, severity: c.severity });
	}
	return finish([...byKey.values()]);
}

/** A caution of one named lamp. */
export interface LampCaution extends Caution { lampId?: string | number; lampName?: string }

/**
 * Cautions of several lamps, each kept with the lamp it belongs to (lampId, lampName, and the lamp's name leading the
 * title) — never merged across lamps; severest first, the deferral to local rules once at the end.
 */
export function cautionsPerLamp(entries: { lampId: string | number; lampName: string; cautions: Caution[] }[]): LampCaution[] {
	const out: LampCaution[] = [];
	for (const e of entries) {
		for (const c of e.cautions) if (c.code !== DEFERRAL.code) out.push({ ...c, lampId: e.lampId, lampName: e.lampName, title: `${e.lampName}: ${c.title}` });
	}
	return [...out.sort((a, b) => RANK[a.severity] - RANK[b.severity]), DEFERRAL];
}

/** Cautions for a lamp model at `powerW`, computed on CAUTION_GRID (150–1100 nm, keeps VUV lines). */
export function cautionsForLamp(model: LampModel, powerW: number, options: Omit<CautionOptions, 'lampType'> = {}): Caution[] {
	return cautionsForSpectrum(lampSpectrum(model, powerW, CAUTION_GRID), { ...options, lampType: model.type });
}
