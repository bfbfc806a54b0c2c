/**
 * Sensitised route: when the substrate has no usable window, suggest photocatalysts that absorb
 * inside a window of their own (computed as in window.ts with the catalyst as the absorber and the
 * substrate + other species as competitors) and whose triplet energy exceeds the substrate's by a
 * margin, so that triplet–triplet energy transfer is exergonic (IUPAC Glossary of Terms Used in
 * Photochemistry, 3rd ed., Pure Appl. Chem. 79, 293 (2007): "photosensitization", "energy
 * transfer"). The default 10 kJ mol⁻¹ margin is common practice for near-diffusion-controlled transfer.
 */
import { speciesAbsorbance } from './innerFilter';
import { findWindows, type WavelengthRange, type WindowThresholds } from './window';
import type { NumberArray, WavelengthGrid } from './wavelengthGrid';

export interface CatalystCandidate {
	id: string;
	name: string;
	/** Molar absorptivity on the grid, M⁻¹ cm⁻¹. */
	epsilon: NumberArray;
	/** Loading to evaluate, M; default `catalystConcentrationM` of the input. */
	concentrationM?: number;
	tripletEnergyKJPerMol?: number;
	/** Excited-state redox potentials, V (reference electrode as stored); passed through for the photoredox view. */
	excitedStatePotentials?: { oxidationV?: number; reductionV?: number };
}

export interface SensitisedInput {
	grid: WavelengthGrid;
	pathCm: number;
	wallTransmission: NumberArray;
	/** Solvent absorbance over the path. */
	solventAbsorbance: NumberArray;
	/** Substrate (+ every other species) absorbance over the path: the catalyst's competitors. */
	competingAbsorbance: NumberArray;
	substrateTripletEnergyKJPerMol?: number;
	candidates: CatalystCandidate[];
	/** Default catalyst loading, M (default 0.001 M, common practice for 0.1–1 mol % photocatalysis). */
	catalystConcentrationM?: number;
	/** Required E_T(catalyst) − E_T(substrate), kJ mol⁻¹; default 10. */
	marginKJPerMol?: number;
	thresholds?: Partial<WindowThresholds>;
}

export interface CatalystVerdict {
	id: string;
	name: string;
	windows: WavelengthRange[];
	tripletEnergyKJPerMol?: number;
	excitedStatePotentials?: CatalystCandidate['excitedStatePotentials'];
	/** Why it is suggested, held back or rejected. */
	reason: string;
	/** Data that would decide the case (only for `needsData`). */
	missing?: string[];
}

export interface SensitisedResult {
	/** Absorbs in a window and E_T exceeds the substrate's by the margin; widest window first. */
	suggestions: CatalystVerdict[];
	/** Absorbs in a window but an energy is unknown: never suggested until the data exist. */
	needsData: CatalystVerdict[];
	/** No window, or triplet energy too low. */
	rejected: CatalystVerdict[];
}

/** Sort candidates into suggestions, needs-data and rejected. */
export function suggestPhotocatalysts(input: SensitisedInput): SensitisedResult {
	const margin = input.marginKJPerMol ?? 10;
	const eSub = input.substrateTripletEnergyKJPerMol;
	const out: SensitisedResult = { suggestions: [], needsData: [], rejected: [] };
	for (const c of input.candidates) {
		const a = speciesAbsorbance(c.epsilon, c.concentrationM ?? input.catalystConcentrationM ?? 0.001, input.pathCm);
		const windows = findWindows(
			{ grid: input.grid, wallTransmission: input.wallTransmission, solventAbsorbance: input.solventAbsorbance, substrateAbsorbance: a, otherAbsorbance: input.competingAbsorbance },
			input.thresholds
		);
		const base = { id: c.id, name: c.name, windows, tripletEnergyKJPerMol: c.tripletEnergyKJPerMol, excitedStatePotentials: c.excitedStatePotentials };
		if (windows.length === 0) {
			out.rejected.push({ ...base, reason: `${c.name} has no usable window through this wall and solvent` });
			continue;
		}
		const missing: string[] = [];
		if (eSub === undefined) missing.push('triplet energy of the substrate (kJ mol⁻¹)');
		if (c.tripletEnergyKJPerMol === undefined) missing.push(`triplet energy of ${c.name} (kJ mol⁻¹)`);
		if (missing.length) {
			out.needsData.push({ ...base, missing, reason: `${c.name} absorbs in a window, but energy transfer cannot be judged: missing ${missing.join(' and ')}` });
			continue;
		}
		const excess = (c.tripletEnergyKJPerMol as number) - (eSub as number);
		if (excess >= margin) {
			out.suggestions.push({ ...base, reason: `${c.name}: E_T ${fmt(c.tripletEnergyKJPerMol)} kJ mol⁻¹ is ${fmt(excess)} kJ mol⁻¹ above the substrate's; absorbs at ${describe(windows)}` });
		} else {
			out.rejected.push({ ...base, reason: `${c.name}: E_T ${fmt(c.tripletEnergyKJPerMol)} kJ mol⁻¹ is not at least ${fmt(margin)} kJ mol⁻¹ above the substrate's ${fmt(eSub)} kJ mol⁻¹` });
		}
	}
	const width = (v: CatalystVerdict) => v.windows.reduce((s, w) => s + w.toNm - w.fromNm, 0);
	out.suggestions.sort((x, y) => width(y) - width(x));
	return out;
}

const fmt = (x: number | undefined) => (x === undefined ? '?' : String(Math.round(x * 10) / 10));
const describe = (ws: WavelengthRange[]) => ws.map((w) => `${w.fromNm}–${w.toNm} nm`).join(', ');
