/**
 * Window finder orchestrator: everything POST /api/window answers, from arrays already on the grid
 * (the server resamples wall T(λ), solvent A(λ) and lamp q(λ) elsewhere). Physics: PRODUCT.md —
 * Beer–Lambert absorbances, inner-filter fractions (IUPAC Glossary of Terms Used in Photochemistry,
 * 3rd ed., Pure Appl. Chem. 79, 293 (2007)), windows (window.ts), absorbed flux (innerFilter.ts),
 * time course (timeCourse.ts), ranking (rank.ts). Cautions come from another module: `cautions`
 * is left empty for the caller to fill.
 */
import { nameInSentence } from './names';
import { absorbedPhotonFlux, scaleAbsorbance, speciesAbsorbance } from './innerFilter';
import { longestWavelengthBand } from './intendedBand';
import { percent, type ReactionTimes } from './reactions/kinetics';
import { photocatalyticTimes, preparePhotocatalytic } from './reactions/photocatalytic';
import { photostationaryCurve, prepareReversible, reversibleTimes, type PhotostationaryCurve, type ReversibleTimes } from './reactions/reversible';
import { penetrationDepth90Cm, vesselIssues, vesselOptics, type VesselOptics, type VesselSpec } from './vessels';
import { rankCombinations, rankedEntries, type RankedCombination, type RankLamp, type RankSolvent, type RankWall } from './rank';
import { prepareKinetics, simulateTimeCourse } from './timeCourse';
import { DEFAULT_WINDOW_THRESHOLDS, findWindows, type WavelengthRange, type WindowThresholds } from './window';
import type { NumberArray, WavelengthGrid } from './wavelengthGrid';

/** A competing species: ε (M⁻¹ cm⁻¹) with its concentration, or an absorbance spectrum measured over `measuredPathCm` at the reaction concentration. */
export interface OtherSpecies {
	id?: string;
	name: string;
	epsilon?: NumberArray;
	concentrationM?: number;
	absorbance?: NumberArray;
	measuredPathCm?: number;
}

export interface ComputeWindowInput {
	grid: WavelengthGrid;
	substrate: { name?: string; epsilon: NumberArray; concentrationM: number };
	others?: OtherSpecies[];
	/** Product that builds up and absorbs (time course only); ν mol product per mol substrate, default 1. */
	product?: { name?: string; epsilon: NumberArray; productPerSubstrate?: number };
	solventAbsorbancePerCm: NumberArray;
	wallTransmission: NumberArray;
	pathCm: number;
	lamps: RankLamp[];
	/** Φ of substrate conversion; default 1 (an upper bound on the rate, said so in the explanation). */
	quantumYield?: number;
	amountMol?: number;
	/** Irradiated volume, L; without it no times are given. */
	volumeL?: number;
	thresholds?: Partial<WindowThresholds>;
	/** Display names used in the sentences, e.g. { wall: '2 mm borosilicate 3.3', solvent: 'acetonitrile' }. */
	names?: { wall?: string; solvent?: string };
	/** Reaction mode (API.md "Reaction modes"); default direct photolysis of the substrate. */
	reaction?: ReactionSpec;
	/** Vessel shape; default a flat layer `pathCm` deep. For cylinder and annulus `pathCm` is not used. */
	vessel?: VesselShape;
}

/** Reaction modes with their spectra on the grid. */
export type ReactionSpec =
	| { type: 'direct' }
	| { type: 'photocatalytic'; photocatalyst: { name?: string; epsilon: NumberArray; concentrationM: number }; bleachingQuantumYield?: number }
	| { type: 'reversible'; product: { name?: string; epsilon: NumberArray }; quantumYieldBack: number; thermalBackRateConstantPerS?: number };

/** Vessel as the API gives it: a slab takes the top-level pathCm. */
export type VesselShape = { shape: 'slab' } | Exclude<VesselSpec, { shape: 'slab' }>;

/** Upper limit on Φ: radical chains reach 10³–10⁴ (API.md). */
export const MAX_QUANTUM_YIELD = 1e4;

export interface WindowIssue {
	field: string;
	/** 'invalid' → HTTP 400, 'physically-invalid' → 422 (API.md). */
	code: 'invalid' | 'physically-invalid';
	message: string;
}

export interface LampResult {
	id: string;
	name: string;
	incidentPhotonFluxEinsteinPerS: number;
	absorbedPhotonFluxEinsteinPerS: number;
	selectivity: number;
	fractionOfLampPhotonsToSubstrate: number;
	/** Shares of the lamp's photons: lost in the wall, absorbed by the solvent, by each species, transmitted (sum 1). */
	shares: { wall: number; solvent: number; species: { name: string; share: number }[]; transmitted: number };
	perSpecies: { name: string; absorbedPhotonFluxEinsteinPerS: number }[];
	initialRateTimeTo90PctS: number | null;
	timeTo50PctS: number | null;
	timeTo90PctS: number | null;
	timeTo99PctS: number | null;
	timeCourse: { timeS: number[]; conversion: number[] } | null;
	sentence: string;
	/** Photon flux absorbed by the intended absorber (substrate; photocatalyst in photocatalytic mode), einstein s⁻¹. */
	absorbedByIntendedEinsteinPerS: number;
	/** Why timeTo50/90/99PctS are null (photostationary state, bleached catalyst, no light absorbed, no volume). */
	unreachableReason: string | null;
	/** Highest conversion reachable under this lamp (1 unless a PSS or bleaching limits it); null without times. */
	limitConversion: number | null;
	/** Reversible mode: product/(substrate + product) at the photostationary state under this lamp. */
	photostationaryProductFraction: number | null;
	timeTo50PctOfStationaryS: number | null;
	timeTo90PctOfStationaryS: number | null;
	timeTo99PctOfStationaryS: number | null;
	/** Depth of the mixture (cm) in which 90 % of this lamp's photons entering it are absorbed (initial composition). */
	penetrationDepth90Cm: number | null;
}

export interface WindowAnswer {
	/** Headline: wall transmission at the intended absorber's longest-wavelength band maximum. */
	wallTransmissionAtBandMaximum: { wavelengthNm: number; transmission: number; epsilon: number } | null;
	/** Depth where 90 % of monochromatic light at that band maximum is absorbed (a·d = 1), cm. */
	penetrationDepth90AtBandMaximumCm: number | null;
	reaction: { type: ReactionSpec['type']; intendedAbsorber: string; notes: string[] };
	vessel: { shape: VesselSpec['shape']; referencePathCm: number; meanPathCm: number; model: string };
	/** Reversible mode: monochromatic PSS over wavelength and the wavelength with most product where the wall and solvent allow. */
	photostationaryCurve: PhotostationaryCurve | null;
	bestPhotostationaryWavelength: { wavelengthNm: number; productFraction: number } | null;
	windows: WavelengthRange[];
	thresholds: WindowThresholds;
	/** Best first (absorbed substrate photon flux). */
	lamps: LampResult[];
	explanation: string[];
	/** Filled by the cautions module (bands in use); left empty here. */
	cautions: unknown[];
}

export type WindowOutcome<T> = { ok: true; value: T } | { ok: false; issues: WindowIssue[] };

/** Check the prepared input; issues name the field. */
export function validateWindowInput(input: Omit<ComputeWindowInput, 'wallTransmission' | 'solventAbsorbancePerCm'> & { wallTransmission?: NumberArray; solventAbsorbancePerCm?: NumberArray }): WindowIssue[] {
	const issues: WindowIssue[] = [];
	const n = input.grid?.count;
	if (!(Number.isInteger(n) && n >= 2 && input.grid.stepNm > 0)) return [{ field: 'grid', code: 'invalid', message: 'grid needs count ≥ 2 and stepNm > 0' }];
	const arr = (field: string, a: NumberArray | undefined, required = true) => {
		if (a === undefined) {
			if (required) issues.push({ field, code: 'invalid', message: `${field} is missing` });
			return;
		}
		if (a.length !== n) return void issues.push({ field, code: 'invalid', message: `${field} has ${a.length} points; the grid has ${n}` });
		for (let i = 0; i < n; i++) {
			if (!Number.isFinite(a[i])) return void issues.push({ field, code: 'invalid', message: `${field} has a non-finite value at ${input.grid.fromNm + i * input.grid.stepNm} nm` });
			if (a[i] < 0) return void issues.push({ field, code: 'physically-invalid', message: `${field} is negative at ${input.grid.fromNm + i * input.grid.stepNm} nm` });
		}
	};
	const num = (field: string, v: number | undefined, { required = false, positive = true } = {}) => {
		if (v === undefined) return void (required && issues.push({ field, code: 'invalid', message: `${field} is missing` }));
		if (typeof v !== 'number' || !Number.isFinite(v)) return void issues.push({ field, code: 'invalid', message: `${field} must be a number` });
		if (positive ? v <= 0 : v < 0) issues.push({ field, code: 'physically-invalid', message: `${field} must be ${positive ? 'positive' : 'zero or positive'}` });
	};
	arr('substrate.epsilon', input.substrate?.epsilon);
	num('substrate.concentrationM', input.substrate?.concentrationM, { required: true, positive: false });
	arr('wallTransmission', input.wallTransmission, 'wallTransmission' in input);
	arr('solventAbsorbancePerCm', input.solventAbsorbancePerCm, 'solventAbsorbancePerCm' in input);
	const slab = !input.vessel || input.vessel.shape === 'slab';
	if (slab) num('pathCm', input.pathCm, { required: true });
	else for (const v of vesselIssues(input.vessel as VesselSpec)) issues.push({ field: v.field, code: /must be a number|shape/.test(v.message) ? 'invalid' : 'physically-invalid', message: v.message });
	num('quantumYield', input.quantumYield);
	if (typeof input.quantumYield === 'number' && input.quantumYield > MAX_QUANTUM_YIELD) issues.push({ field: 'quantumYield', code: 'physically-invalid', message: `quantumYield must be at most 10⁴ (the longest radical chains); got ${input.quantumYield}` });
	const rx = input.reaction;
	if (rx && rx.type === 'photocatalytic') {
		arr('reaction.photocatalyst.epsilon', rx.photocatalyst?.epsilon);
		num('reaction.photocatalyst.concentrationM', rx.photocatalyst?.concentrationM, { required: true });
		num('reaction.bleachingQuantumYield', rx.bleachingQuantumYield, { positive: false });
	} else if (rx && rx.type === 'reversible') {
		arr('reaction.product.epsilon', rx.product?.epsilon);
		num('reaction.quantumYieldBack', rx.quantumYieldBack, { required: true, positive: false });
		if (typeof rx.quantumYieldBack === 'number' && rx.quantumYieldBack > MAX_QUANTUM_YIELD) issues.push({ field: 'reaction.quantumYieldBack', code: 'physically-invalid', message: 'reaction.quantumYieldBack must be at most 10⁴' });
		num('reaction.thermalBackRateConstantPerS', rx.thermalBackRateConstantPerS, { positive: false });
	} else if (rx && rx.type !== 'direct') issues.push({ field: 'reaction.type', code: 'invalid', message: 'reaction.type must be direct, photocatalytic or reversible' });
	num('amountMol', input.amountMol);
	num('volumeL', input.volumeL);
	(input.others ?? []).forEach((o, k) => {
		if (o.epsilon) {
			arr(`others[${k}].epsilon`, o.epsilon);
			num(`others[${k}].concentrationM`, o.concentrationM, { required: true, positive: false });
		} else {
			arr(`others[${k}].absorbance`, o.absorbance);
			num(`others[${k}].measuredPathCm`, o.measuredPathCm, { required: true });
		}
	});
	if (input.product) arr('product.epsilon', input.product.epsilon);
	input.lamps.forEach((l, k) => arr(`lamps[${k}].photonFluxPerNm`, l.photonFluxPerNm));
	const th = input.thresholds ?? {};
	for (const key of Object.keys(th) as (keyof WindowThresholds)[]) num(`thresholds.${key}`, th[key], { positive: false });
	return issues;
}


/** The vessel optics of an input (a slab takes the top-level pathCm). */
export function opticsOf(input: Pick<ComputeWindowInput, 'vessel' | 'pathCm'>): VesselOptics {
	const v = input.vessel;
	return vesselOptics(!v || v.shape === 'slab' ? { shape: 'slab', pathCm: input.pathCm } : v);
}

interface Absorbers {
	/** Length the absorbances are over (vessel reference path), cm. */
	pathCm: number;
	intendedName: string;
	/** 'substrate' or 'photocatalyst', for sentences. */
	intendedWord: string;
	intendedEpsilon: NumberArray;
	/** Absorbance of the intended absorber over pathCm. */
	aI: Float64Array;
	/** The other absorbers, in answer order (photocatalytic mode: the substrate first). */
	competitors: { name: string; a: Float64Array }[];
	competitorSum: Float64Array;
	/** Substrate absorbance over pathCm (also in competitors in photocatalytic mode). */
	aS: Float64Array;
	/** Σ others' absorbance (the user's `others` only). */
	othersSum: Float64Array;
}

function absorbers(input: ComputeWindowInput, optics: VesselOptics): Absorbers {
	const L = optics.referencePathCm;
	const n = input.grid.count;
	const aS = speciesAbsorbance(input.substrate.epsilon, input.substrate.concentrationM, L);
	const others = (input.others ?? []).map((o) => ({
		name: o.name,
		a: o.epsilon ? speciesAbsorbance(o.epsilon, o.concentrationM ?? 0, L) : scaleAbsorbance(o.absorbance as NumberArray, o.measuredPathCm as number, L)
	}));
	const othersSum = new Float64Array(n);
	for (const o of others) for (let i = 0; i < n; i++) othersSum[i] += o.a[i];
	const substrateName = input.substrate.name ?? 'substrate';
	const rx = input.reaction;
	let out: Omit<Absorbers, 'competitorSum' | 'pathCm' | 'aS' | 'othersSum'>;
	if (rx?.type === 'photocatalytic') {
		out = {
			intendedName: rx.photocatalyst.name ?? 'photocatalyst',
			intendedWord: 'photocatalyst',
			intendedEpsilon: rx.photocatalyst.epsilon,
			aI: speciesAbsorbance(rx.photocatalyst.epsilon, rx.photocatalyst.concentrationM, L),
			competitors: [{ name: substrateName, a: aS }, ...others]
		};
	} else {
		out = { intendedName: substrateName, intendedWord: 'substrate', intendedEpsilon: input.substrate.epsilon, aI: aS, competitors: others };
	}
	const competitorSum = new Float64Array(n);
	for (const c of out.competitors) for (let i = 0; i < n; i++) competitorSum[i] += c.a[i];
	return { ...out, competitorSum, pathCm: L, aS, othersSum };
}

const scaled = (a: NumberArray, k: number) => {
	const out = new Float64Array(a.length);
	for (let i = 0; i < a.length; i++) out[i] = a[i] * k;
	return out;
};
const pct = (x: number) => `${Math.round(x * 100)} %`;
const finiteOrNull = (x: number) => (Number.isFinite(x) ? x : null);

/** Human duration for sentences (s, min, h, d). */
function duration(s: number): string {
	if (s < 120) return `${s.toPrecision(2)} s`;
	if (s < 7200) return `${(s / 60).toPrecision(2)} min`;
	if (s < 172800) return `${(s / 3600).toPrecision(2)} h`;
	return `${(s / 86400).toPrecision(2)} d`;
}
const cm = (d: number) => (d < 0.1 ? `${(d * 10).toPrecision(2)} mm` : `${d.toPrecision(2)} cm`);

type Times = ReactionTimes & Partial<Pick<ReversibleTimes, 'photostationaryProductFraction' | 'timeTo50PctOfStationaryS' | 'timeTo90PctOfStationaryS' | 'timeTo99PctOfStationaryS'>>;

/** The time course of the chosen mode under one lamp (q_in = lamp × wall); null when no volume is given (direct, photocatalytic). */
function timesFor(input: ComputeWindowInput, ab: Absorbers, optics: VesselOptics, fixed: Float64Array, qIn: Float64Array, phi: number): Times | null {
	const rx = input.reaction;
	const common = { stepNm: input.grid.stepNm, photonFluxInMixturePerNm: qIn, pathCm: ab.pathCm, amountMol: input.amountMol, fixedAbsorbance: fixed, quantumYield: phi, fractionPerAbsorbance: optics.fractionPerAbsorbance };
	if (rx?.type === 'reversible') {
		const thermal = rx.thermalBackRateConstantPerS ?? 0;
		// Without a thermal step the PSS does not depend on the amount, so it is given even without a volume.
		if (input.volumeL === undefined && thermal > 0) return null;
		const p = prepareReversible({ ...common, volumeL: input.volumeL ?? 1, substrateEpsilon: input.substrate.epsilon, substrateConcentrationM: input.substrate.concentrationM, productEpsilon: rx.product.epsilon, quantumYieldBack: rx.quantumYieldBack, thermalBackRateConstantPerS: thermal });
		const t = reversibleTimes(p);
		if (input.volumeL !== undefined) return t;
		return { ...t, initialRateTimeTo90PctS: null, timeTo50PctS: null, timeTo90PctS: null, timeTo99PctS: null, timeTo50PctOfStationaryS: null, timeTo90PctOfStationaryS: null, timeTo99PctOfStationaryS: null, curve: { timeS: [], conversion: [] } };
	}
	if (input.volumeL === undefined) return null;
	if (rx?.type === 'photocatalytic') {
		const p = preparePhotocatalytic({
			...common, volumeL: input.volumeL,
			catalystEpsilon: rx.photocatalyst.epsilon, catalystConcentrationM: rx.photocatalyst.concentrationM, catalystBleachingQuantumYield: rx.bleachingQuantumYield,
			substrateEpsilon: input.substrate.epsilon, substrateConcentrationM: input.substrate.concentrationM,
			productEpsilon: input.product?.epsilon, productPerSubstrate: input.product?.productPerSubstrate
		});
		return photocatalyticTimes(p);
	}
	const k = prepareKinetics({
		...common, volumeL: input.volumeL,
		substrateEpsilon: input.substrate.epsilon, substrateConcentrationM: input.substrate.concentrationM,
		productEpsilon: input.product?.epsilon, productPerSubstrate: input.product?.productPerSubstrate
	});
	if (!(k.substrateAbsorbedFlux(0) > 0)) {
		return { initialRateTimeTo90PctS: null, timeTo50PctS: null, timeTo90PctS: null, timeTo99PctS: null, unreachableReason: 'the substrate absorbs none of this lamp’s light', limitConversion: 0, curve: { timeS: [0], conversion: [0] } };
	}
	const tc = simulateTimeCourse(k);
	return {
		initialRateTimeTo90PctS: finiteOrNull(tc.initialRateTimeTo90PctS),
		timeTo50PctS: finiteOrNull(tc.timeTo50PctS),
		timeTo90PctS: finiteOrNull(tc.timeTo90PctS),
		timeTo99PctS: finiteOrNull(tc.timeTo99PctS),
		unreachableReason: null,
		limitConversion: 1,
		curve: { timeS: Array.from(tc.curve.timeS), conversion: Array.from(tc.curve.conversion) }
	};
}

/** The whole Window finder answer for one wall and one solvent. */
export function computeWindow(input: ComputeWindowInput): WindowOutcome<WindowAnswer> {
	const issues = validateWindowInput(input);
	if (issues.length) return { ok: false, issues };
	const { grid } = input;
	const optics = opticsOf(input);
	const thresholds = { ...DEFAULT_WINDOW_THRESHOLDS, ...input.thresholds };
	const ab = absorbers(input, optics);
	const L = ab.pathCm;
	const solv = scaleAbsorbance(input.solventAbsorbancePerCm, 1, L);
	// windows judge absorbances over the mean path of the light through the liquid
	const k = optics.meanPathCm / L;
	const windows = findWindows({ grid, wallTransmission: input.wallTransmission, solventAbsorbance: scaled(solv, k), substrateAbsorbance: scaled(ab.aI, k), otherAbsorbance: scaled(ab.competitorSum, k) }, thresholds);
	const names = [ab.intendedName, ...ab.competitors.map((c) => c.name)];
	const phi = input.quantumYield ?? 1;
	// absorbance that does not change with conversion: solvent + the user's other species
	const fixed = new Float64Array(grid.count);
	for (let i = 0; i < grid.count; i++) fixed[i] = solv[i] + ab.othersSum[i];
	const mixturePerCm = new Float64Array(grid.count);
	for (let i = 0; i < grid.count; i++) mixturePerCm[i] = (ab.aI[i] + ab.competitorSum[i] + solv[i]) / L;
	const wallName = input.names?.wall ? ` through ${input.names.wall}` : '';
	const species = [ab.aI, ...ab.competitors.map((c) => c.a)];

	const lamps: LampResult[] = input.lamps.map((lamp) => {
		const flux = absorbedPhotonFlux({ stepNm: grid.stepNm, photonFluxPerNm: lamp.photonFluxPerNm, wallTransmission: input.wallTransmission, speciesAbsorbance: species, solventAbsorbance: solv, fractionPerAbsorbance: optics.fractionPerAbsorbance });
		const intended = flux.perSpeciesEinsteinPerS[0];
		const fraction = flux.incidentEinsteinPerS > 0 ? intended / flux.incidentEinsteinPerS : 0;
		const qIn = new Float64Array(grid.count);
		const weights = new Float64Array(grid.count);
		for (let i = 0; i < grid.count; i++) {
			qIn[i] = lamp.photonFluxPerNm[i] * input.wallTransmission[i];
			weights[i] = qIn[i] * (i === 0 || i === grid.count - 1 ? 0.5 : 1);
		}
		const times = intended > 0 || input.reaction?.type === 'reversible' ? timesFor(input, ab, optics, fixed, qIn, phi) : null;
		const noLight = intended > 0 ? null : `the ${ab.intendedWord} absorbs none of this lamp’s light`;
		return {
			id: lamp.id,
			name: lamp.name,
			incidentPhotonFluxEinsteinPerS: flux.incidentEinsteinPerS,
			absorbedPhotonFluxEinsteinPerS: intended,
			absorbedByIntendedEinsteinPerS: intended,
			selectivity: flux.selectivity,
			fractionOfLampPhotonsToSubstrate: fraction,
			shares: { wall: flux.shares.wall, solvent: flux.shares.solvent, species: names.map((name, j) => ({ name, share: flux.shares.species[j] })), transmitted: flux.shares.transmitted },
			perSpecies: names.map((name, j) => ({ name, absorbedPhotonFluxEinsteinPerS: flux.perSpeciesEinsteinPerS[j] })),
			initialRateTimeTo90PctS: times?.initialRateTimeTo90PctS ?? null,
			timeTo50PctS: times?.timeTo50PctS ?? null,
			timeTo90PctS: times?.timeTo90PctS ?? null,
			timeTo99PctS: times?.timeTo99PctS ?? null,
			unreachableReason: times?.unreachableReason ?? noLight,
			limitConversion: times ? times.limitConversion : null,
			photostationaryProductFraction: times?.photostationaryProductFraction ?? null,
			timeTo50PctOfStationaryS: times?.timeTo50PctOfStationaryS ?? null,
			timeTo90PctOfStationaryS: times?.timeTo90PctOfStationaryS ?? null,
			timeTo99PctOfStationaryS: times?.timeTo99PctOfStationaryS ?? null,
			timeCourse: times && times.curve.timeS.length > 1 ? times.curve : null,
			penetrationDepth90Cm: penetrationDepth90Cm(weights, mixturePerCm),
			sentence: `the ${nameInSentence(lamp.name)}${wallName}: ${pct(fraction)} of its photons reach the ${ab.intendedWord}`
		};
	});
	lamps.sort((x, y) => y.absorbedByIntendedEinsteinPerS - x.absorbedByIntendedEinsteinPerS || y.selectivity - x.selectivity);

	const band = longestWavelengthBand(grid, ab.intendedEpsilon);
	const wallAtBand = band ? { wavelengthNm: band.wavelengthNm, transmission: input.wallTransmission[band.index], epsilon: band.epsilon } : null;
	const depthAtBand = band && mixturePerCm[band.index] > 0 ? 1 / mixturePerCm[band.index] : null;
	let curve: PhotostationaryCurve | null = null;
	let bestPss: WindowAnswer['bestPhotostationaryWavelength'] = null;
	const rx = input.reaction;
	if (rx?.type === 'reversible') {
		curve = photostationaryCurve(grid, input.substrate.epsilon, rx.product.epsilon, phi, rx.quantumYieldBack);
		for (let i = 0; i < grid.count; i++) {
			const f = input.substrate.epsilon[i] * phi, b = rx.product.epsilon[i] * rx.quantumYieldBack;
			if (!(f > 0) || input.wallTransmission[i] < thresholds.minWallTransmission || solv[i] * k > thresholds.maxSolventAbsorbance || ab.aI[i] * k < thresholds.minSubstrateAbsorbance) continue;
			const x = f / (f + b);
			if (!bestPss || x > bestPss.productFraction + 1e-12) bestPss = { wavelengthNm: grid.fromNm + i * grid.stepNm, productFraction: x };
		}
	}
	const notes = reactionNotes(input, ab, phi, lamps[0]);
	const explanation = explain(input, optics, ab, windows, thresholds, lamps, solv, k, phi, wallAtBand, depthAtBand, bestPss);
	return {
		ok: true,
		value: {
			wallTransmissionAtBandMaximum: wallAtBand,
			penetrationDepth90AtBandMaximumCm: depthAtBand,
			reaction: { type: rx?.type ?? 'direct', intendedAbsorber: ab.intendedName, notes },
			vessel: { shape: optics.shape, referencePathCm: optics.referencePathCm, meanPathCm: optics.meanPathCm, model: optics.model },
			photostationaryCurve: curve,
			bestPhotostationaryWavelength: bestPss,
			windows,
			thresholds,
			lamps,
			explanation,
			cautions: []
		}
	};
}

/** What the chosen mode assumes, in sentences a chemist checks before trusting the times. */
function reactionNotes(input: ComputeWindowInput, ab: Absorbers, phi: number, best: LampResult | undefined): string[] {
	const out: string[] = [];
	const rx = input.reaction;
	if (phi > 1) out.push(`Φ = ${phi} > 1 means a chain reaction: each absorbed photon converts ${phi} molecules. Chain lengths depend on purity, oxygen, temperature and initiator — measure Φ under your conditions.`);
	if (rx?.type === 'photocatalytic') {
		out.push(`Photocatalytic mode: the ${ab.intendedName} absorbs the light and is not consumed${rx.bleachingQuantumYield ? ` except by bleaching (Φ_dec = ${rx.bleachingQuantumYield})` : ''}; the substrate is converted at Φ × the photons the ${ab.intendedName} absorbs.`);
		out.push('Φ is taken as independent of the substrate concentration; at low substrate concentration quenching of the excited photocatalyst becomes less efficient, so the last part of the conversion is slower than shown.');
		const subsShare = best?.shares.species[1]?.share;
		if (best && subsShare !== undefined && subsShare > 0.05) out.push(`The substrate itself absorbs ${pct(subsShare)} of the ${nameInSentence(best.name)}’s photons and competes with the ${ab.intendedName} (direct photolysis of the substrate is not counted as product).`);
	} else if (rx?.type === 'reversible') {
		out.push(`Reversible mode: the product photoreverts with Φ_back = ${rx.quantumYieldBack}${rx.thermalBackRateConstantPerS ? ` and thermally with k = ${rx.thermalBackRateConstantPerS} s⁻¹` : ''}; irradiation approaches a photostationary state that depends on the lamp's spectrum.`);
	}
	return out;
}

function explain(
	input: ComputeWindowInput, optics: VesselOptics, ab: Absorbers, windows: WavelengthRange[], th: WindowThresholds, lamps: LampResult[], solv: Float64Array, k: number, phi: number,
	wallAtBand: WindowAnswer['wallTransmissionAtBandMaximum'], depthAtBand: number | null, bestPss: WindowAnswer['bestPhotostationaryWavelength']
): string[] {
	const out: string[] = [];
	const word = ab.intendedWord;
	if (wallAtBand) {
		const eps = wallAtBand.epsilon >= 1000 ? `${(wallAtBand.epsilon / 1000).toPrecision(3)} × 10³` : wallAtBand.epsilon.toPrecision(3);
		out.push(`At its band maximum (${wallAtBand.wavelengthNm} nm) the wall passes ${pct(wallAtBand.transmission)} — the longest-wavelength band of the ${word} (ε ≈ ${eps} M⁻¹ cm⁻¹)${input.names?.wall ? `, ${input.names.wall}` : ''}.`);
	} else out.push(`The ${word} shows no absorption band on the grid: check its spectrum.`);
	const path = optics.shape === 'slab' ? `${optics.meanPathCm} cm` : `a mean path of ${optics.meanPathCm.toPrecision(3)} cm (${optics.shape})`;
	const where = `over ${path} (wall T ≥ ${th.minWallTransmission}, solvent A ≤ ${th.maxSolventAbsorbance}, ${word} A ≥ ${th.minSubstrateAbsorbance}, selectivity ≥ ${th.minSelectivity})`;
	if (windows.length) {
		out.push(`Usable window${windows.length > 1 ? 's' : ''}: ${windows.map((w) => `${w.fromNm}–${w.toNm} nm`).join(', ')} ${where}.`);
	} else {
		let absorbs = 0, wall = 0, solvent = 0, competition = 0;
		for (let i = 0; i < ab.aI.length; i++) {
			const a = ab.aI[i] * k, s = solv[i] * k, o = ab.competitorSum[i] * k;
			if (a < th.minSubstrateAbsorbance) continue;
			absorbs++;
			if (input.wallTransmission[i] < th.minWallTransmission) wall++;
			if (s > th.maxSolventAbsorbance) solvent++;
			if (a / (a + s + o) < th.minSelectivity) competition++;
		}
		const reasons = absorbs === 0 ? [`the ${word} absorbs too weakly everywhere at this concentration and path`] : [];
		if (absorbs && wall) reasons.push(`the wall blocks ${pct(wall / absorbs)} of the wavelengths where the ${word} absorbs`);
		if (absorbs && solvent) reasons.push(`the solvent absorbs at ${pct(solvent / absorbs)} of them`);
		if (absorbs && competition) reasons.push(`other species out-absorb the ${word} at ${pct(competition / absorbs)} of them`);
		out.push(`No usable window ${where}: ${reasons.join('; ')}. Consider another wall, solvent, or a sensitised route.`);
	}
	const best = lamps[0];
	if (best) {
		out.push(`${best.sentence[0].toUpperCase()}${best.sentence.slice(1)} (selectivity ${pct(best.selectivity)}).`);
		const others = best.shares.species.slice(1).reduce((s, x) => s + x.share, 0);
		out.push(`Of its photons ${pct(best.shares.wall)} are lost in the wall, ${pct(best.shares.solvent)} absorbed by the solvent, ${pct(others)} by other species and ${pct(best.shares.transmitted)} pass through unabsorbed.`);
		if (best.penetrationDepth90Cm !== null) {
			const d = best.penetrationDepth90Cm;
			const thin = d < 0.1 * optics.meanPathCm;
			out.push(`Penetration depth: 90 % of its light entering the liquid is absorbed within ${cm(d)}${thin ? ` of the wall — a thin layer of a ${cm(optics.meanPathCm)} mean path, so stir hard (or use a thinner layer or flow)` : ''}.`);
		} else if (best.shares.transmitted > 0.1) out.push('More than 10 % of its light passes through the liquid unabsorbed at any depth: the lamp emits where the mixture is transparent.');
		if (best.photostationaryProductFraction !== null) {
			const t90 = best.timeTo90PctOfStationaryS;
			out.push(`Under the ${nameInSentence(best.name)} the photostationary state holds ${percent(best.photostationaryProductFraction, 1)} product${t90 !== null ? `, 90 % of it reached after ${duration(t90)}` : ''}.`);
		}
		if (best.unreachableReason) out.push(`${best.unreachableReason[0].toUpperCase()}${best.unreachableReason.slice(1)}.`);
	}
	if (bestPss) out.push(`Most product at a photostationary state: ${percent(bestPss.productFraction, 1)} at ${bestPss.wavelengthNm} nm (monochromatic light, where the wall and solvent allow).`);
	if (depthAtBand !== null && wallAtBand) out.push(`At ${wallAtBand.wavelengthNm} nm 90 % of the light is absorbed within ${cm(depthAtBand)} of the mixture.`);
	out.push(`Vessel model: ${optics.model}.`);
	if (input.volumeL === undefined) out.push('Give the irradiated volume to estimate irradiation times.');
	else if (input.quantumYield === undefined) out.push('Times assume a quantum yield of 1 (the fastest single-photon case); give Φ for a real estimate.');
	return out;
}

export interface RankingInput extends Omit<ComputeWindowInput, 'wallTransmission' | 'solventAbsorbancePerCm' | 'names'> {
	walls: RankWall[];
	solvents: RankSolvent[];
	/** How many ranked combinations to return (default 20). */
	limit?: number;
}

export interface RankingAnswer {
	combinations: RankedCombination[];
	/** Windows for every wall × solvent pair. */
	windows: { wallId: string; solventId: string; windows: WavelengthRange[] }[];
	totalCombinations: number;
}

/** Rank every lamp × wall × solvent the server passes (walls and solvents with names), by the intended absorber's flux. */
export function computeWindowRanking(input: RankingInput): WindowOutcome<RankingAnswer> {
	const issues = validateWindowInput(input);
	input.walls.forEach((w, k) => issues.push(...validateWindowInput({ ...input, lamps: [], wallTransmission: w.transmission }).filter((x) => x.field === 'wallTransmission').map((x) => ({ ...x, field: `walls[${k}].transmission` }))));
	input.solvents.forEach((s, k) => issues.push(...validateWindowInput({ ...input, lamps: [], solventAbsorbancePerCm: s.absorbancePerCm }).filter((x) => x.field === 'solventAbsorbancePerCm').map((x) => ({ ...x, field: `solvents[${k}].absorbancePerCm` }))));
	if (issues.length) return { ok: false, issues };
	const optics = opticsOf(input);
	const ab = absorbers({ ...input, wallTransmission: [], solventAbsorbancePerCm: [] }, optics);
	const rankInput = { stepNm: input.grid.stepNm, pathCm: ab.pathCm, substrateAbsorbance: ab.aI, otherAbsorbance: ab.competitorSum, lamps: input.lamps, walls: input.walls, solvents: input.solvents, fractionPerAbsorbance: optics.fractionPerAbsorbance };
	const ranking = rankCombinations(rankInput);
	const k = optics.meanPathCm / ab.pathCm;
	const windows: RankingAnswer['windows'] = [];
	for (const s of input.solvents) {
		const solv = scaleAbsorbance(s.absorbancePerCm, 1, optics.meanPathCm);
		for (const w of input.walls) {
			windows.push({ wallId: w.id, solventId: s.id, windows: findWindows({ grid: input.grid, wallTransmission: w.transmission, solventAbsorbance: solv, substrateAbsorbance: scaled(ab.aI, k), otherAbsorbance: scaled(ab.competitorSum, k) }, input.thresholds) });
		}
	}
	return { ok: true, value: { combinations: rankedEntries(rankInput, ranking, input.limit ?? 20, ab.intendedWord), windows, totalCombinations: ranking.order.length } };
}
