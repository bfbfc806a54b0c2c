/**
 * What the Window finder page says about a POST /api/window answer (pure; unit-tested beside this file):
 * the verdict sentence, each lamp's photon budget, lamp sorting, the band maximum headline and the curves as CSV.
 * Fields from API.md "Reaction modes, vessels and photostationary states" are optional here, so the page reads
 * answers with and without them.
 */
import { formatDuration, formatNm, formatPercent, formatPhotonFlux } from '$lib/format';
import type { ReactionType } from './windowQuery';

export interface LampAnswer {
	id: number;
	name: string;
	peakNm?: number | null;
	photonFluxBasis?: string | null;
	incidentPhotonFluxEinsteinPerS: number;
	absorbedPhotonFluxEinsteinPerS: number;
	absorbedByIntendedEinsteinPerS?: number;
	selectivity: number;
	shares: { wall: number; solvent: number; species: { name: string; share: number }[]; transmitted: number };
	timeTo50PctS?: number | null;
	timeTo90PctS: number | null;
	timeTo99PctS?: number | null;
	initialRateTimeTo90PctS?: number | null;
	unreachableReason?: string | null;
	photostationaryProductFraction?: number | null;
	timeTo90PctOfStationaryS?: number | null;
	/** Depth (cm) in which 90 % of this lamp's photons entering the mixture are absorbed; null when they never are. */
	penetrationDepth90Cm?: number | null;
	/** Highest conversion reachable under this lamp (photostationary state or catalyst bleaching). */
	limitConversion?: number | null;
	timeCourse?: { timeS: number[]; conversion: number[] } | null;
}

export interface Curves {
	x: number[];
	substrateAbsorbance: number[];
	others: { id: number; name: string; absorbance: number[] }[];
	solventAbsorbance: number[];
	wallTransmission: number[];
	lamps: { id: number; name: string; emission: number[]; photonFluxPerNm?: number[] }[];
	photocatalystAbsorbance?: number[];
	productAbsorbanceAtFullConversion?: number[];
}

/** The photons a lamp sends to the vessel, by where they end up (fractions of the photons reaching the wall). */
export interface BudgetSegment {
	key: 'wall' | 'solvent' | 'other' | 'intended' | 'through';
	label: string;
	share: number;
}

/** Flux absorbed by the intended absorber: the substrate (direct, reversible) or the photocatalyst. */
export const intendedFlux = (l: LampAnswer) => l.absorbedByIntendedEinsteinPerS ?? l.absorbedPhotonFluxEinsteinPerS;

/** The five parts of a lamp's photon budget; they add up to 1 (rounding aside). */
export function budgetOf(l: LampAnswer, intendedName: string): BudgetSegment[] {
	const speciesTotal = l.shares.species.reduce((s, x) => s + x.share, 0);
	let intended = l.shares.species.find((s) => s.name === intendedName)?.share;
	if (intended === undefined) intended = l.incidentPhotonFluxEinsteinPerS > 0 ? intendedFlux(l) / l.incidentPhotonFluxEinsteinPerS : 0;
	const other = Math.max(0, speciesTotal - intended);
	return [
		{ key: 'wall', label: 'lost in the wall', share: l.shares.wall },
		{ key: 'solvent', label: 'absorbed by the solvent', share: l.shares.solvent },
		{ key: 'other', label: 'absorbed by other species', share: other },
		{ key: 'intended', label: `absorbed by ${intendedName}`, share: intended },
		{ key: 'through', label: 'pass through', share: l.shares.transmitted }
	];
}

export type LampSort = 'rank' | 'intended' | 'selectivity' | 'time' | 'wall' | 'name';
export const LAMP_SORTS: { key: LampSort; label: string }[] = [
	{ key: 'rank', label: 'ranking (photons to the absorber × selectivity)' },
	{ key: 'intended', label: 'photons to the absorber' },
	{ key: 'selectivity', label: 'selectivity' },
	{ key: 'time', label: 'time to 90 %' },
	{ key: 'wall', label: 'least lost in the wall' },
	{ key: 'name', label: 'name' }
];

/** Lamps in the chosen order; the server's rank (1 = first in the ranking) is kept beside each; 'rank' keeps that order. */
export function sortLamps(lamps: LampAnswer[], key: LampSort): { lamp: LampAnswer; rank: number }[] {
	const ranked = lamps.map((lamp, i) => ({ lamp, rank: i + 1 }));
	const time = (l: LampAnswer) => l.timeTo90PctOfStationaryS ?? l.timeTo90PctS ?? Infinity;
	const by: Record<LampSort, (a: LampAnswer, b: LampAnswer) => number> = {
		rank: () => 0,
		intended: (a, b) => intendedFlux(b) - intendedFlux(a),
		selectivity: (a, b) => b.selectivity - a.selectivity,
		time: (a, b) => time(a) - time(b),
		wall: (a, b) => a.shares.wall - b.shares.wall,
		name: (a, b) => a.name.localeCompare(b.name)
	};
	return ranked.sort((a, b) => by[key](a.lamp, b.lamp) || a.rank - b.rank);
}

/**
 * The longest-wavelength absorption band maximum of a curve: the reddest local maximum standing at least 10 % of the
 * curve's highest value above the valley to its red side (so a shoulder or noise is not taken for a band).
 */
export function longestBandMaximum(x: number[], a: number[]): number | null {
	const n = Math.min(x.length, a.length);
	if (n < 3) return null;
	let max = 0;
	for (let i = 0; i < n; i++) if (a[i] > max) max = a[i];
	if (!(max > 0)) return null;
	let valley = Infinity;
	for (let i = n - 2; i >= 1; i--) {
		valley = Math.min(valley, a[i + 1]);
		if (a[i] >= a[i - 1] && a[i] >= a[i + 1] && a[i] - Math.min(valley, a[n - 1]) >= 0.1 * max && a[i] >= 0.05 * max) return x[i];
	}
	return null;
}

/** Wall T at a wavelength of the curves' 1 nm grid (nearest point). */
export function valueAtNm(x: number[], y: number[], nm: number): number | null {
	let best = -1;
	let d = Infinity;
	for (let i = 0; i < x.length; i++) if (Math.abs(x[i] - nm) < d) ((d = Math.abs(x[i] - nm)), (best = i));
	return best >= 0 && d <= 1 ? y[best] : null;
}

export interface VerdictInput {
	reaction: ReactionType;
	intendedName: string;
	wallName: string;
	windows: { fromNm: number; toNm: number }[];
	best: LampAnswer | undefined;
	bandMax: { wavelengthNm: number; transmission: number } | null;
	productName?: string;
	hasVolume: boolean;
}

const windowText = (w: { fromNm: number; toNm: number }[]) => w.map((x) => `${x.fromNm}–${x.toNm} nm`).join(' and ');

/** One sentence: the window, the best lamp, the wall's transmission at the band maximum and the time. */
export function verdictSentence(v: VerdictInput): string {
	if (!v.windows.length) {
		const wall = v.bandMax ? ` (the wall passes ${formatPercent(v.bandMax.transmission)} at ${formatNm(v.bandMax.wavelengthNm)})` : '';
		return `No usable window for ${v.intendedName} through ${v.wallName}${wall}: see why below, or change the wall, the solvent or the absorber.`;
	}
	const parts = [`Window ${windowText(v.windows)}`];
	if (v.best) parts.push(`best lamp: ${v.best.name}`);
	if (v.bandMax) parts.push(`the wall passes ${formatPercent(v.bandMax.transmission)} at the band maximum (${formatNm(v.bandMax.wavelengthNm)})`);
	parts.push(timeClause(v));
	return `${parts.filter(Boolean).join('; ')}.`;
}

function timeClause(v: VerdictInput): string {
	const b = v.best;
	if (!b) return 'the group has no lamp to rank';
	if (v.reaction === 'reversible' && b.photostationaryProductFraction !== undefined && b.photostationaryProductFraction !== null) {
		const pss = `it drives the mixture to ${formatPercent(b.photostationaryProductFraction)} ${v.productName ?? 'product'} at the photostationary state`;
		const t = b.timeTo90PctOfStationaryS;
		return t !== null && t !== undefined ? `${pss}, 90 % of the way there in ${formatDuration(t)}` : pss;
	}
	if (!v.hasVolume) return 'give the volume for a time';
	if (b.timeTo90PctS === null) return `90 % conversion is not reachable${b.unreachableReason ? ` (${b.unreachableReason})` : ''}`;
	return `90 % conversion in ${formatDuration(b.timeTo90PctS)}`;
}

/** The headline question: "At its band maximum (452 nm) the wall passes 91 %". */
export const bandMaxHeadline = (b: { wavelengthNm: number; transmission: number }) =>
	`At its band maximum (${formatNm(b.wavelengthNm)}) the wall passes ${formatPercent(b.transmission)}`;

/** Number cells for a lamp row. */
export function lampNumbers(l: LampAnswer, reaction: ReactionType) {
	return {
		intended: formatPhotonFlux(intendedFlux(l)),
		selectivity: formatPercent(l.selectivity),
		time:
			reaction === 'reversible' && l.photostationaryProductFraction !== undefined && l.photostationaryProductFraction !== null
				? `PSS ${formatPercent(l.photostationaryProductFraction)}`
				: l.timeTo90PctS === null
					? l.unreachableReason !== undefined && l.unreachableReason !== null
						? 'not reachable'
						: '—'
					: formatDuration(l.timeTo90PctS)
	};
}

const csvCell = (s: string) => (/[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);

/** The plotted curves as CSV on their 1 nm grid: wall T, solvent A, each species' A, each lamp's photon flux. */
export function curvesToCsv(c: Curves, names: { substrate: string; solvent: string; wall: string; photocatalyst?: string; product?: string; pathCm: number }): string {
	const cols: { head: string; y: (number | null)[] }[] = [
		{ head: `wall T (${names.wall})`, y: c.wallTransmission },
		{ head: `solvent A over ${names.pathCm} cm (${names.solvent})`, y: c.solventAbsorbance },
		{ head: `A over ${names.pathCm} cm: ${names.substrate}`, y: c.substrateAbsorbance },
		...(c.photocatalystAbsorbance ? [{ head: `A over ${names.pathCm} cm: ${names.photocatalyst ?? 'photocatalyst'}`, y: c.photocatalystAbsorbance }] : []),
		...(c.productAbsorbanceAtFullConversion ? [{ head: `A over ${names.pathCm} cm: ${names.product ?? 'product'} at full conversion`, y: c.productAbsorbanceAtFullConversion }] : []),
		...c.others.map((o) => ({ head: `A over ${names.pathCm} cm: ${o.name}`, y: o.absorbance })),
		...c.lamps.map((l) =>
			l.photonFluxPerNm
				? { head: `${l.name}: photon flux reaching the wall (einstein s-1 nm-1)`, y: l.photonFluxPerNm }
				: { head: `${l.name}: photon flux relative to its peak`, y: l.emission }
		)
	];
	const lines = [['wavelength (nm)', ...cols.map((k) => k.head)].map(csvCell).join(',')];
	for (let i = 0; i < c.x.length; i++) lines.push([String(c.x[i]), ...cols.map((k) => (k.y[i] === null || k.y[i] === undefined ? '' : String(k.y[i])))].join(','));
	return lines.join('\r\n') + '\r\n';
}

/**
 * Depth of liquid (cm) in which 90 % of the light entering the mixture is absorbed, from the plotted curves:
 * absorbed fraction F(d) = Σ w(λ)·(1 − 10^(−a(λ)·d)) / Σ w(λ) with w = lamp photons × wall T and a = total absorbance
 * per cm (species + solvent; Beer–Lambert law), solved for F(d) = 0.9 by bisection. Null when even `maxCm` absorbs
 * less than 90 %, or nothing enters. Monochromatic check: d = 1/a.
 */
export function penetrationDepthFromCurves(weights: number[], absorbancePerCm: number[], maxCm = 1000): number | null {
	let total = 0;
	for (const w of weights) total += w > 0 ? w : 0;
	if (!(total > 0)) return null;
	const fraction = (d: number) => {
		let f = 0;
		for (let i = 0; i < weights.length; i++) if (weights[i] > 0) f += weights[i] * (1 - Math.pow(10, -Math.max(0, absorbancePerCm[i]) * d));
		return f / total;
	};
	if (fraction(maxCm) < 0.9) return null;
	let lo = 0;
	let hi = maxCm;
	for (let k = 0; k < 200 && hi - lo > 1e-9 * Math.max(1, hi); k++) {
		const mid = (lo + hi) / 2;
		if (fraction(mid) >= 0.9) hi = mid;
		else lo = mid;
	}
	return (lo + hi) / 2;
}

/** The penetration depth in words, against the liquid depth the light has to cross. */
export function penetrationWords(depthCm: number | null, liquidDepthCm: number, formatDepth: (cm: number) => string, what = 'the light that enters'): string {
	if (depthCm === null) return `Less than 90 % of ${what} is absorbed, however deep the liquid: most of it passes through.`;
	const where = depthCm < liquidDepthCm / 10 ? ' — a thin lit layer at the wall: stir hard, or use a narrower vessel' : depthCm > liquidDepthCm ? `, more than the ${formatDepth(liquidDepthCm)} of liquid, so part of the light leaves the vessel` : '';
	return `90 % of ${what} is absorbed within ${formatDepth(depthCm)} of the wall${where}.`;
}
