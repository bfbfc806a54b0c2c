/**
 * A stored emission spectrum → the relative spectral power P(λ) per nm that a 'measured' lamp model takes.
 *
 * - Power units (W/nm, W/m2/nm, relative — a relative spectral power distribution, common practice for lamp data)
 *   are power spectra. Photon units (umol/s/nm, umol/m2/s/nm) and raw detector counts (array spectrometers count
 *   photo-electrons) are photon spectra: P(λ) ∝ q(λ)·hcN_A/λ, so that the lamp's photon flux q = ∫P·λ/(hcN_A) dλ gives
 *   back the file's own photon shape — never weighted by λ a second time.
 * - Counts are per detector pixel: divided by the pixel's width in nm to become a density per nm.
 * - Axis Jacobian (y given per unit of the original axis): per cm⁻¹ → per nm multiplies by |dν̃/dλ| = 10⁷/λ²;
 *   per eV → per nm multiplies by |dE/dλ| = hc/λ² (hc = 1239.84 eV nm, CODATA 2018).
 * - A dark floor (raw counts without dark subtraction) is estimated robustly (iterative median ± 3·1.4826·MAD clipping,
 *   Hampel/MAD estimator, common practice) and removed by default for counts; points within 3σ of the floor become 0.
 *   A floor is a flat level (σ < 10 % of it) under at least a quarter of the points, between 0.5 % and 50 % of the peak.
 */
import { HC_EV_NM } from '../constants';

export type EmissionQuantity = 'power' | 'photon';
export type FloorChoice = 'remove' | 'keep';

const PHOTON_UNITS = new Set(['umol/s/nm', 'umol/m2/s/nm', 'counts']);

/** Whether a stored y unit (API.md yUnit) is a photon or a power spectrum. */
export function emissionQuantityOf(yUnit: string): EmissionQuantity {
	return PHOTON_UNITS.has(yUnit) ? 'photon' : 'power';
}

export interface StoredEmission {
	/** Original x values in `xUnit` (any order). */
	x: ArrayLike<number>;
	y: ArrayLike<number>;
	xUnit: string;
	yUnit: string;
	/** Default: 'remove' for counts, 'keep' otherwise. */
	floor?: FloorChoice;
}

export interface FloorEstimate {
	/** Floor level in the file's y units (0 when none was found). */
	level: number;
	/** Noise σ of the floor points (1.4826·MAD). */
	noise: number;
	/** level / peak of the file's y. */
	fractionOfPeak: number;
	/** Share of points that make up the floor. */
	pointShare: number;
	removed: boolean;
}

export interface MeasuredEmissionShape {
	wavelengthNm: number[];
	/** Relative spectral power per nm (≥ 0). */
	power: number[];
	quantity: EmissionQuantity;
	floor: FloorEstimate;
	warnings: string[];
}

const median = (a: number[]) => {
	const s = [...a].sort((p, q) => p - q);
	const m = s.length >> 1;
	return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

/** Robust floor: iterative clipping of points above median + 3σ (σ = 1.4826·MAD) until the set stops shrinking. */
export function estimateFloor(y: ArrayLike<number>): { level: number; noise: number; pointShare: number } {
	let pts = Array.from(y).filter(Number.isFinite);
	const n = pts.length;
	if (n < 20) return { level: 0, noise: 0, pointShare: 0 };
	for (let iter = 0; iter < 30; iter++) {
		const m = median(pts);
		const sigma = 1.4826 * median(pts.map((v) => Math.abs(v - m)));
		const kept = pts.filter((v) => v <= m + 3 * Math.max(sigma, 1e-12 * Math.abs(m)));
		if (kept.length === pts.length || kept.length < 10) break;
		pts = kept;
	}
	const level = median(pts);
	return { level, noise: 1.4826 * median(pts.map((v) => Math.abs(v - level))), pointShare: pts.length / n };
}

function toNm(x: number, unit: string): number {
	if (unit === 'um') return x * 1000;
	if (unit === 'cm-1') return 1e7 / x;
	if (unit === 'eV') return HC_EV_NM / x;
	return x;
}

/** The stored spectrum as relative power per nm on ascending wavelengths, with its floor handled. */
export function measuredEmissionShape(s: StoredEmission): MeasuredEmissionShape {
	const n = Math.min(s.x.length, s.y.length);
	const quantity = emissionQuantityOf(s.yUnit);
	const warnings: string[] = [];
	const idx = Array.from({ length: n }, (_, i) => i).filter((i) => Number.isFinite(s.x[i]) && s.x[i] > 0 && Number.isFinite(s.y[i]));
	const pts = idx.map((i) => ({ nm: toNm(s.x[i], s.xUnit), y: s.y[i] })).sort((a, b) => a.nm - b.nm);
	let peak = 0;
	for (const p of pts) if (p.y > peak) peak = p.y;
	const est = estimateFloor(pts.map((p) => p.y));
	const fractionOfPeak = peak > 0 ? est.level / peak : 0;
	// A floor: a flat level (noise < 10 % of it) holding at least a quarter of the points, above 0.5 % of the peak and
	// well below it (a flat or broad spectrum is signal, not floor).
	const hasFloor = est.pointShare >= 0.25 && fractionOfPeak > 0.005 && fractionOfPeak < 0.5 && est.noise < 0.1 * est.level;
	const choice = s.floor ?? (s.yUnit === 'counts' ? 'remove' : 'keep');
	const removed = hasFloor && choice === 'remove';
	if (hasFloor && !removed) {
		warnings.push(`The spectrum sits on a flat floor of about ${(fractionOfPeak * 100).toPrecision(2)} % of its peak over ${Math.round(pts[0].nm)}–${Math.round(pts[pts.length - 1].nm)} nm (raw counts without dark subtraction?). It is kept and counted as light.`);
	}
	const wavelengthNm: number[] = [];
	const power: number[] = [];
	for (let k = 0; k < pts.length; k++) {
		const { nm } = pts[k];
		if (k > 0 && !(nm > pts[k - 1].nm)) continue; // duplicate wavelength: keep the first
		let v = pts[k].y;
		if (removed) v = v - est.level <= 3 * est.noise ? 0 : v - est.level;
		v = Math.max(0, v);
		if (s.yUnit === 'counts' && s.xUnit === 'nm') {
			// counts per pixel → per nm: divide by the pixel width (half the distance to both neighbours)
			const left = k > 0 ? nm - pts[k - 1].nm : pts[k + 1].nm - nm;
			const right = k < pts.length - 1 ? pts[k + 1].nm - nm : left;
			v /= (left + right) / 2;
		}
		if (s.xUnit === 'cm-1') v *= 1e7 / (nm * nm);
		else if (s.xUnit === 'eV') v *= HC_EV_NM / (nm * nm);
		if (quantity === 'photon') v /= nm; // P ∝ q/λ (the constant hcN_A cancels in the normalisation to the lamp power)
		wavelengthNm.push(nm);
		power.push(v);
	}
	return { wavelengthNm, power, quantity, floor: { level: hasFloor ? est.level : 0, noise: est.noise, fractionOfPeak: hasFloor ? fractionOfPeak : 0, pointShare: est.pointShare, removed }, warnings };
}
