/**
 * Vessel geometry: what fraction of the light that enters the liquid is absorbed, for a well-mixed liquid of
 * decadic absorption coefficient a (cm⁻¹, all absorbers and the solvent together).
 *
 * - slab (flat cell or layer of depth l, lit face-on, collimated):  F = 1 − 10^(−a·l)  (Beer–Lambert).
 * - cylinder (round tube or flask of inner diameter D, lit from one side by a collimated beam wider than the
 *   tube): every ray at height y crosses a chord 2√(R² − y²), so F = (1/D)·∫_{−R}^{R} (1 − 10^(−a·2√(R² − y²))) dy.
 *   With y = R·cos φ… written here as F(A) = ∫₀^{π/2} (1 − e^{−x·sin φ})·sin φ dφ, x = ln10·a·D (A = a·D).
 *   Its closed form is (π/2)·[I₁(x) − L₁(x)] (modified Bessel and Struve functions; Abramowitz & Stegun 12.2);
 *   the mean chord is πD/4. Refraction at the curved wall is neglected.
 * - annulus (immersion well: the lamp on the axis, the liquid between innerDiameterCm and outerDiameterCm):
 *   radial rays cross the gap g = (D_out − D_in)/2, so F = 1 − 10^(−a·g). Rays leaving a line lamp obliquely
 *   travel further (g/cos ψ), so this is a lower bound on the absorbed fraction.
 *
 * The mixture shares the absorbed light in proportion to each absorber's coefficient (every chord sees the same
 * composition), so species i absorbs (a_i/a)·F: the inner-filter code needs only g(A) = F(A)/A with A the
 * absorbance over the vessel's reference length (slab l, cylinder D, annulus g).
 *
 * Inner wall face: wall transmissions in this project assume two air faces, (1 − R_air)² (walls.ts). With liquid
 * inside, the inner face is glass/liquid, T → T·(1 − R_liq)/(1 − R_air) with R = ((n₁ − n₂)/(n₁ + n₂))²
 * (Fresnel at normal incidence; Born & Wolf, Principles of Optics).
 */
import { absorbedFractionPerAbsorbance } from './innerFilter';
import { fresnelReflectance } from './walls';

export type VesselSpec =
	| { shape: 'slab'; pathCm: number }
	| { shape: 'cylinder'; innerDiameterCm: number }
	| { shape: 'annulus'; innerDiameterCm: number; outerDiameterCm: number };

export interface VesselOptics {
	shape: VesselSpec['shape'];
	/** The length species absorbances are computed over: slab depth, cylinder diameter, annulus gap (cm). */
	referencePathCm: number;
	/** Mean optical path of the light through the liquid (cm): slab depth, cylinder πD/4, annulus gap. */
	meanPathCm: number;
	/** g(A) = F(A)/A, A = absorbance over referencePathCm; species i absorbs A_i·g(A_tot) of the light entering. */
	fractionPerAbsorbance: (absorbance: number) => number;
	/** F(A): fraction of the entering light absorbed by the whole mixture. */
	absorbedFraction: (absorbance: number) => number;
	/** One sentence for the page ("model: …"). */
	model: string;
}

export interface VesselIssue {
	field: string;
	message: string;
}

/** Problems with a vessel description, each naming the field (vessel.innerDiameterCm…). */
export function vesselIssues(v: VesselSpec, prefix = 'vessel'): VesselIssue[] {
	const out: VesselIssue[] = [];
	const pos = (field: string, x: number) => {
		if (!(typeof x === 'number' && Number.isFinite(x))) out.push({ field: `${prefix}.${field}`, message: `${prefix}.${field} must be a number` });
		else if (x <= 0) out.push({ field: `${prefix}.${field}`, message: `${prefix}.${field} must be above 0 cm` });
		else if (x > 1000) out.push({ field: `${prefix}.${field}`, message: `${prefix}.${field} must be at most 1000 cm` });
	};
	if (v.shape === 'slab') pos('pathCm', v.pathCm);
	else if (v.shape === 'cylinder') pos('innerDiameterCm', v.innerDiameterCm);
	else if (v.shape === 'annulus') {
		pos('innerDiameterCm', v.innerDiameterCm);
		pos('outerDiameterCm', v.outerDiameterCm);
		if (!out.length && !(v.outerDiameterCm > v.innerDiameterCm)) out.push({ field: `${prefix}.outerDiameterCm`, message: `${prefix}.outerDiameterCm (${v.outerDiameterCm} cm) must be larger than ${prefix}.innerDiameterCm (${v.innerDiameterCm} cm): the liquid fills the gap between them` });
	} else out.push({ field: `${prefix}.shape`, message: `${prefix}.shape must be slab, cylinder or annulus` });
	return out;
}

// 10-point Gauss–Legendre nodes and weights on [−1, 1] (Abramowitz & Stegun, Table 25.4).
const GL_X = [0.1488743389816312, 0.4333953941292472, 0.6794095682990244, 0.8650633666889845, 0.9739065285171717];
const GL_W = [0.2955242247147529, 0.2692667193099963, 0.219086362515982, 0.1494513491505806, 0.0666713443086881];

function gaussLegendre(f: (t: number) => number, a: number, b: number): number {
	const m = 0.5 * (a + b), h = 0.5 * (b - a);
	let s = 0;
	for (let k = 0; k < 5; k++) s += GL_W[k] * (f(m - h * GL_X[k]) + f(m + h * GL_X[k]));
	return s * h;
}

/**
 * Cylinder absorbed fraction F(A), A = a·D, by composite Gauss–Legendre on φ ∈ [0, π/2] of (1 − e^{−x sin φ}) sin φ
 * (x = A·ln10) with panels [0, 1/x], [1/x, 2/x], [2/x, 4/x], … that resolve the layer near grazing chords; the
 * deficit 1 − F is integrated directly (∫ e^{−x sin φ} sin φ dφ) so that F near 1 keeps its digits.
 */
export function cylinderAbsorbedFraction(absorbance: number): number {
	if (!(absorbance > 0)) return 0;
	const x = absorbance * Math.LN10;
	const half = Math.PI / 2;
	if (x < 1) {
		// small x: 1 − e^{−x sin φ} has no cancellation problem when computed with expm1
		return gaussLegendre((p) => -Math.expm1(-x * Math.sin(p)) * Math.sin(p), 0, half);
	}
	let deficit = 0;
	let lo = 0;
	let hi = Math.min(half, 1 / x);
	while (lo < half) {
		deficit += gaussLegendre((p) => Math.exp(-x * Math.sin(p)) * Math.sin(p), lo, hi);
		lo = hi;
		hi = Math.min(half, hi * 2);
	}
	return 1 - deficit;
}

// g(A) = F(A)/A of the cylinder, tabulated on s = ln(1 + A) for A ≤ TABLE_MAX and read by cubic (Catmull–Rom)
// interpolation; beyond, F is computed directly. Table error < 1e-9 relative (checked in vessels.test.ts).
const TABLE_MAX = 400;
const TABLE_N = 4096;
let cylTable: Float64Array | null = null;
const TABLE_H = Math.log1p(TABLE_MAX) / (TABLE_N - 1);

function cylinderTable(): Float64Array {
	if (cylTable) return cylTable;
	const t = new Float64Array(TABLE_N + 2);
	// t[k + 1] = g(A_k), A_k = e^{k·h} − 1; t[0] and t[N + 1] are extrapolation guards
	for (let k = 0; k < TABLE_N; k++) {
		const a = Math.expm1(k * TABLE_H);
		t[k + 1] = k === 0 ? (Math.LN10 * Math.PI) / 4 : cylinderAbsorbedFraction(a) / a;
	}
	t[0] = 3 * t[1] - 3 * t[2] + t[3]; // quadratic extrapolation guards at both ends
	t[TABLE_N + 1] = 3 * t[TABLE_N] - 3 * t[TABLE_N - 1] + t[TABLE_N - 2];
	cylTable = t;
	return t;
}

/** g(A) = F(A)/A of the side-lit cylinder (A over the diameter); → ln10·π/4 as A → 0 (mean chord πD/4). */
export function cylinderFractionPerAbsorbance(absorbance: number): number {
	if (!(absorbance > 1e-12)) return (Math.LN10 * Math.PI) / 4;
	if (absorbance >= TABLE_MAX) return cylinderAbsorbedFraction(absorbance) / absorbance;
	const t = cylinderTable();
	const s = Math.log1p(absorbance) / TABLE_H;
	const k = Math.min(TABLE_N - 2, Math.floor(s));
	const u = s - k;
	const p0 = t[k], p1 = t[k + 1], p2 = t[k + 2], p3 = t[k + 3];
	// Catmull–Rom between p1 (node k) and p2 (node k + 1)
	return p1 + 0.5 * u * (p2 - p0 + u * (2 * p0 - 5 * p1 + 4 * p2 - p3 + u * (3 * (p1 - p2) + p3 - p0)));
}

const slabFraction = (a: number) => -Math.expm1(-Math.LN10 * Math.max(0, a));

/** Optics of a vessel description (call vesselIssues first: invalid sizes throw RangeError here). */
export function vesselOptics(v: VesselSpec): VesselOptics {
	const issues = vesselIssues(v);
	if (issues.length) throw new RangeError(issues[0].message);
	if (v.shape === 'slab') {
		return { shape: 'slab', referencePathCm: v.pathCm, meanPathCm: v.pathCm, fractionPerAbsorbance: absorbedFractionPerAbsorbance, absorbedFraction: slabFraction, model: `flat layer ${v.pathCm} cm deep, lit face-on by a collimated beam (Beer–Lambert)` };
	}
	if (v.shape === 'cylinder') {
		const d = v.innerDiameterCm;
		return {
			shape: 'cylinder',
			referencePathCm: d,
			meanPathCm: (Math.PI * d) / 4,
			fractionPerAbsorbance: cylinderFractionPerAbsorbance,
			absorbedFraction: (a) => cylinderAbsorbedFraction(a),
			model: `round vessel ${d} cm inside diameter, lit from one side by a collimated beam: absorbed fraction averaged over the chords (mean chord ${round3((Math.PI * d) / 4)} cm; refraction at the curved wall neglected)`
		};
	}
	const gap = (v.outerDiameterCm - v.innerDiameterCm) / 2;
	return {
		shape: 'annulus',
		referencePathCm: gap,
		meanPathCm: gap,
		fractionPerAbsorbance: absorbedFractionPerAbsorbance,
		absorbedFraction: slabFraction,
		model: `immersion well: lamp on the axis, liquid in a ${round3(gap)} cm gap between ${v.innerDiameterCm} and ${v.outerDiameterCm} cm diameters; radial rays (oblique rays travel further, so absorption is if anything higher)`
	};
}

const round3 = (x: number) => Math.round(x * 1000) / 1000;

/**
 * Factor that turns a wall transmission measured or modelled with two air faces into the transmission into a
 * liquid of index nLiquid: (1 − R(n_wall, n_liquid))/(1 − R(n_wall, 1)). 1 when either index is unknown.
 */
export function innerFaceCorrection(nWall: number | null | undefined, nLiquid: number | null | undefined): number {
	if (!(typeof nWall === 'number' && nWall >= 1 && typeof nLiquid === 'number' && nLiquid >= 1)) return 1;
	return (1 - fresnelReflectance(nWall, nLiquid)) / (1 - fresnelReflectance(nWall, 1));
}

/** Wall transmission into the liquid on the grid: T·innerFaceCorrection (a new array, ≤ 1). */
export function wallTransmissionIntoLiquid(t: ArrayLike<number>, nWall: number | null | undefined, nLiquid: number | null | undefined): Float64Array {
	const k = innerFaceCorrection(nWall, nLiquid);
	const out = new Float64Array(t.length);
	for (let i = 0; i < t.length; i++) out[i] = Math.min(1, t[i] * k);
	return out;
}

/**
 * Penetration depth: the depth (cm) of a flat layer of the mixture at which 90 % of the photons entering it have
 * been absorbed, Σ w_i·(1 − 10^(−a_i·d)) = 0.9·Σ w_i, solved by bisection in log d. `weights` are photon fluxes per
 * grid point (lamp × wall × trapezoid weight), `absorbancePerCm` the mixture's a(λ). Null when even 10 m of liquid
 * absorbs less than 90 % (the lamp emits where the mixture is transparent).
 */
export function penetrationDepth90Cm(weights: ArrayLike<number>, absorbancePerCm: ArrayLike<number>, fraction = 0.9): number | null {
	let total = 0;
	for (let i = 0; i < weights.length; i++) total += weights[i];
	if (!(total > 0)) return null;
	const absorbed = (d: number) => {
		let s = 0;
		for (let i = 0; i < weights.length; i++) if (weights[i] > 0) s += weights[i] * -Math.expm1(-Math.LN10 * absorbancePerCm[i] * d);
		return s / total;
	};
	let lo = Math.log(1e-7), hi = Math.log(1000);
	if (absorbed(Math.exp(hi)) < fraction) return null;
	if (absorbed(Math.exp(lo)) >= fraction) return Math.exp(lo);
	for (let k = 0; k < 80; k++) {
		const mid = 0.5 * (lo + hi);
		if (absorbed(Math.exp(mid)) >= fraction) hi = mid;
		else lo = mid;
	}
	return Math.exp(0.5 * (lo + hi));
}
