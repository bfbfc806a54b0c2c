/**
 * Peak picking and band descriptors of a normalised spectrum (x in nm, strictly ascending).
 */
import { gsd } from 'ml-gsd';
import type { NormalisedSpectrum } from './types';

export interface PeakOptions {
	/** Peaks below this fraction of the largest value are dropped (default 0.05). */
	minRelativeHeight?: number;
}

export interface Peak {
	wavelengthNm: number;
	value: number;
}

/** Local maxima within ±halfWindow samples (ties: first sample), the fallback and the edge's band finder. */
export function localMaxima(y: ArrayLike<number>, halfWindow = 1): number[] {
	const out: number[] = [];
	for (let i = 0; i < y.length; i++) {
		let ok = true;
		for (let k = Math.max(0, i - halfWindow); k <= Math.min(y.length - 1, i + halfWindow) && ok; k++) {
			if (k < i ? y[k] >= y[i] : k > i ? y[k] > y[i] : false) ok = false;
		}
		if (ok) out.push(i);
	}
	return out;
}

/**
 * Peaks: candidates from ml-gsd (global spectral deconvolution) with
 * `{ maxCriteria: true, smoothY: false, realTopDetection: false, peakDetectionAlgorithm: 'auto',
 *   sgOptions: { windowSize: 9, polynomial: 3 }, minMaxRatio, noiseLevel: 0 }` — Savitzky–Golay
 * derivatives over 9 samples; 'auto' takes first-derivative zero crossings and second-derivative
 * minima (shoulders); gsd needs increasing x, which normalised spectra have. `noiseLevel: 0` because
 * gsd's automatic estimate drops clear bands of smooth tabulated spectra (the 452 nm pump of a CIE LED
 * illuminant); 'first' alone missed the 541 nm band of a noisy instrument file.
 * Each candidate then climbs to the largest measured sample within ±2 nm, repeatedly, so shoulders
 * end on their band's maximum; candidates that end on the first or last sample (a rising edge, not a
 * band) are dropped, duplicates merged, and values below `minRelativeHeight` × max removed.
 * Fewer than 9 points or a gsd failure fall back to local maxima. Transmission has no peaks ([]).
 */
export function findPeaks(spec: NormalisedSpectrum, options: PeakOptions = {}): Peak[] {
	const ratio = options.minRelativeHeight ?? 0.05;
	const { x, y } = spec;
	const n = x.length;
	if (spec.kind === 'transmission' || n < 3) return [];
	let max = -Infinity;
	for (let i = 0; i < n; i++) if (y[i] > max) max = y[i];
	if (!(max > 0)) return [];
	let idx: number[];
	try {
		if (n < 9) throw new RangeError('too few points for gsd');
		const found = gsd({ x, y }, { maxCriteria: true, smoothY: false, realTopDetection: false, peakDetectionAlgorithm: 'auto', sgOptions: { windowSize: 9, polynomial: 3 }, minMaxRatio: ratio, noiseLevel: 0 });
		idx = found.map((p) => nearestIndex(x, p.x));
	} catch {
		idx = localMaxima(y, 2);
	}
	const stepNm = (x[n - 1] - x[0]) / (n - 1);
	const half = Math.max(1, Math.round(2 / stepNm));
	const seen = new Set<number>();
	const peaks: Peak[] = [];
	for (const start of idx) {
		const i = climb(y, start, half);
		if (i === 0 || i === n - 1 || seen.has(i) || !(y[i] >= ratio * max)) continue;
		seen.add(i);
		peaks.push({ wavelengthNm: x[i], value: y[i] });
	}
	return peaks.sort((a, b) => a.wavelengthNm - b.wavelengthNm);
}

/** Moves to the largest sample within ±half until it no longer moves. */
function climb(y: ArrayLike<number>, start: number, half: number): number {
	let i = start;
	for (let guard = 0; guard < y.length; guard++) {
		let best = i;
		for (let k = Math.max(0, i - half); k <= Math.min(y.length - 1, i + half); k++) if (y[k] > y[best]) best = k;
		if (best === i) return i;
		i = best;
	}
	return i;
}

/** Index of the sample nearest to wavelength w (x ascending). */
export function nearestIndex(x: ArrayLike<number>, w: number): number {
	let lo = 0;
	let hi = x.length - 1;
	while (hi - lo > 1) {
		const mid = (lo + hi) >> 1;
		if (x[mid] <= w) lo = mid;
		else hi = mid;
	}
	return Math.abs(x[hi] - w) < Math.abs(x[lo] - w) ? hi : lo;
}
