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
}

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
}

export interface WindowAnswer {
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
	num('pathCm', input.pathCm, { required: true });
	num('quantumYield', input.quantumYield);
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

/** Absorbance over the path of the substrate and each other species. */
function absorbances(input: ComputeWindowInput) {
	const aS = speciesAbsorbance(input.substrate.epsilon, input.substrate.concentrationM, input.pathCm);
	const others = (input.others ?? []).map((o) =>
		o.epsilon ? speciesAbsorbance(o.epsilon, o.concentrationM ?? 0, input.pathCm) : scaleAbsorbance(o.absorbance as NumberArray, o.measuredPathCm as number, input.pathCm)
	);
	const otherSum = new Float64Array(aS.length);
	for (const a of others) for (let i = 0; i < a.length; i++) otherSum[i] += a[i];
	return { aS, others, otherSum };
}

const pct = (x: number) => `${Math.round(x * 100)} %`;
const finiteOrNull = (x: number) => (Number.isFinite(x) ? x : null);

/** The whole Window finder answer for one wall and one solvent. */
export function computeWindow(input: ComputeWindowInput): WindowOutcome<WindowAnswer> {
	const issues = validateWindowInput(input);
	if (issues.length) return { ok: false, issues };
	const { grid, pathCm } = input;
	const thresholds = { ...DEFAULT_WINDOW_THRESHOLDS, ...input.thresholds };
	const { aS, others, otherSum } = absorbances(input);
	const solv = scaleAbsorbance(input.solventAbsorbancePerCm, 1, pathCm);
	const windows = findWindows({ grid, wallTransmission: input.wallTransmission, solventAbsorbance: solv, substrateAbsorbance: aS, otherAbsorbance: otherSum }, thresholds);
	const names = [input.substrate.name ?? 'substrate', ...(input.others ?? []).map((o) => o.name)];
	const phi = input.quantumYield ?? 1;
	const fixed = new Float64Array(grid.count);
	for (let i = 0; i < grid.count; i++) fixed[i] = solv[i] + otherSum[i];
	const qIn = new Float64Array(grid.count);
	const wallName = input.names?.wall ? ` through ${input.names.wall}` : '';

	const lamps: LampResult[] = input.lamps.map((lamp) => {
		const flux = absorbedPhotonFlux({ stepNm: grid.stepNm, photonFluxPerNm: lamp.photonFluxPerNm, wallTransmission: input.wallTransmission, speciesAbsorbance: [aS, ...others], solventAbsorbance: solv });
		const subs = flux.perSpeciesEinsteinPerS[0];
		const fraction = flux.incidentEinsteinPerS > 0 ? subs / flux.incidentEinsteinPerS : 0;
		let times: ReturnType<typeof simulateTimeCourse> | null = null;
		if (input.volumeL !== undefined && subs > 0) {
			for (let i = 0; i < grid.count; i++) qIn[i] = lamp.photonFluxPerNm[i] * input.wallTransmission[i];
			const kinetics = prepareKinetics({
				stepNm: grid.stepNm, photonFluxInMixturePerNm: qIn, pathCm, volumeL: input.volumeL, amountMol: input.amountMol,
				substrateEpsilon: input.substrate.epsilon, substrateConcentrationM: input.substrate.concentrationM,
				productEpsilon: input.product?.epsilon, productPerSubstrate: input.product?.productPerSubstrate,
				fixedAbsorbance: fixed, quantumYield: phi
			});
			times = simulateTimeCourse(kinetics);
		}
		return {
			id: lamp.id,
			name: lamp.name,
			incidentPhotonFluxEinsteinPerS: flux.incidentEinsteinPerS,
			absorbedPhotonFluxEinsteinPerS: subs,
			selectivity: flux.selectivity,
			fractionOfLampPhotonsToSubstrate: fraction,
			shares: { wall: flux.shares.wall, solvent: flux.shares.solvent, species: names.map((name, j) => ({ name, share: flux.shares.species[j] })), transmitted: flux.shares.transmitted },
			perSpecies: names.map((name, j) => ({ name, absorbedPhotonFluxEinsteinPerS: flux.perSpeciesEinsteinPerS[j] })),
			initialRateTimeTo90PctS: times ? finiteOrNull(times.initialRateTimeTo90PctS) : null,
			timeTo50PctS: times ? finiteOrNull(times.timeTo50PctS) : null,
			timeTo90PctS: times ? finiteOrNull(times.timeTo90PctS) : null,
			timeTo99PctS: times ? finiteOrNull(times.timeTo99PctS) : null,
			timeCourse: times ? { timeS: Array.from(times.curve.timeS), conversion: Array.from(times.curve.conversion) } : null,
			sentence: `the ${nameInSentence(lamp.name)}${wallName}: ${pct(fraction)} of its photons reach the substrate`
		};
	});
	lamps.sort((x, y) => y.absorbedPhotonFluxEinsteinPerS - x.absorbedPhotonFluxEinsteinPerS || y.selectivity - x.selectivity);
	const explanation = explain(input, windows, thresholds, lamps, aS, solv, otherSum, phi);
	return { ok: true, value: { windows, thresholds, lamps, explanation, cautions: [] } };
}

function explain(input: ComputeWindowInput, windows: WavelengthRange[], th: WindowThresholds, lamps: LampResult[], aS: Float64Array, solv: Float64Array, other: Float64Array, phi: number): string[] {
	const out: string[] = [];
	const where = `over ${input.pathCm} cm (wall T ≥ ${th.minWallTransmission}, solvent A ≤ ${th.maxSolventAbsorbance}, substrate A ≥ ${th.minSubstrateAbsorbance}, selectivity ≥ ${th.minSelectivity})`;
	if (windows.length) {
		out.push(`Usable window${windows.length > 1 ? 's' : ''}: ${windows.map((w) => `${w.fromNm}–${w.toNm} nm`).join(', ')} ${where}.`);
	} else {
		// Where the substrate absorbs enough, count what else fails, to say why there is no window.
		let absorbs = 0, wall = 0, solvent = 0, competition = 0;
		for (let i = 0; i < aS.length; i++) {
			if (aS[i] < th.minSubstrateAbsorbance) continue;
			absorbs++;
			if (input.wallTransmission[i] < th.minWallTransmission) wall++;
			if (solv[i] > th.maxSolventAbsorbance) solvent++;
			if (aS[i] / (aS[i] + solv[i] + other[i]) < th.minSelectivity) competition++;
		}
		const reasons = absorbs === 0 ? ['the substrate absorbs too weakly everywhere at this concentration and path'] : [];
		if (absorbs && wall) reasons.push(`the wall blocks ${pct(wall / absorbs)} of the wavelengths where the substrate absorbs`);
		if (absorbs && solvent) reasons.push(`the solvent absorbs at ${pct(solvent / absorbs)} of them`);
		if (absorbs && competition) reasons.push(`other species out-absorb the substrate at ${pct(competition / absorbs)} of them`);
		out.push(`No usable window ${where}: ${reasons.join('; ')}. Consider another wall, solvent, or a sensitised route.`);
	}
	const best = lamps[0];
	if (best) {
		out.push(`${best.sentence[0].toUpperCase()}${best.sentence.slice(1)} (selectivity ${pct(best.selectivity)}).`);
		const others = best.shares.species.slice(1).reduce((s, x) => s + x.share, 0);
		out.push(`Of its photons ${pct(best.shares.wall)} are lost in the wall, ${pct(best.shares.solvent)} absorbed by the solvent, ${pct(others)} by other species and ${pct(best.shares.transmitted)} pass through unabsorbed.`);
	}
	if (input.volumeL === undefined) out.push('Give the irradiated volume to estimate irradiation times.');
	else if (input.quantumYield === undefined) out.push('Times assume a quantum yield of 1 (the fastest possible); give Φ for a real estimate.');
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

/** Rank every lamp × wall × solvent the server passes (walls and solvents with names). */
export function computeWindowRanking(input: RankingInput): WindowOutcome<RankingAnswer> {
	const issues = validateWindowInput(input);
	input.walls.forEach((w, k) => issues.push(...validateWindowInput({ ...input, lamps: [], wallTransmission: w.transmission }).filter((x) => x.field === 'wallTransmission').map((x) => ({ ...x, field: `walls[${k}].transmission` }))));
	input.solvents.forEach((s, k) => issues.push(...validateWindowInput({ ...input, lamps: [], solventAbsorbancePerCm: s.absorbancePerCm }).filter((x) => x.field === 'solventAbsorbancePerCm').map((x) => ({ ...x, field: `solvents[${k}].absorbancePerCm` }))));
	if (issues.length) return { ok: false, issues };
	const { aS, otherSum } = absorbances({ ...input, wallTransmission: [], solventAbsorbancePerCm: [] });
	const rankInput = { stepNm: input.grid.stepNm, pathCm: input.pathCm, substrateAbsorbance: aS, otherAbsorbance: otherSum, lamps: input.lamps, walls: input.walls, solvents: input.solvents };
	const ranking = rankCombinations(rankInput);
	const windows: RankingAnswer['windows'] = [];
	for (const s of input.solvents) {
		const solv = scaleAbsorbance(s.absorbancePerCm, 1, input.pathCm);
		for (const w of input.walls) {
			windows.push({ wallId: w.id, solventId: s.id, windows: findWindows({ grid: input.grid, wallTransmission: w.transmission, solventAbsorbance: solv, substrateAbsorbance: aS, otherAbsorbance: otherSum }, input.thresholds) });
		}
	}
	return { ok: true, value: { combinations: rankedEntries(rankInput, ranking, input.limit ?? 20), windows, totalCombinations: ranking.order.length } };
}
