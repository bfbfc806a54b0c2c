/**
 * Derived values as the Library stores them: the core's `deriveSpectrum`, plus two guards seen in
 * real instrument exports —
 * 1. absorption data that are pure noise at the short end (solvent or cell cut-off, e.g. THF below
 *    ~235 nm): λmax is searched above the noisy stretch;
 * 2. a largest sample at the very end of the measured range is a band's flank, not its maximum
 *    (kinetics runs cut at 350 nm): λmax becomes the long-wavelength band's maximum when there is one.
 * Both add a warning so the user sees what was done.
 */
import { deriveSpectrum } from '../../spectra/derive';
import { localMaxima } from '../../spectra/peaks';
import type { NormalisedSpectrum, ParseIssue, SpectrumDerived } from '../../spectra/types';

/** Shortest wavelength above which the data stop being noise (undefined when they start clean). Common practice: second differences above 5 % of the spectrum's largest |y| mark noise. */
export function noisyLeadingEndNm(x: ArrayLike<number>, y: ArrayLike<number>): number | undefined {
	const n = x.length;
	if (n < 20) return undefined;
	let maxAbs = 0;
	for (let i = 0; i < n; i++) maxAbs = Math.max(maxAbs, Math.abs(y[i]));
	if (!(maxAbs > 0)) return undefined;
	const rough = (i: number) => Math.abs(y[i - 1] - 2 * y[i] + y[i + 1]) > 0.05 * maxAbs;
	let lastNoisy = -1;
	// Only a noisy stretch that starts at the short end counts; it ends at 10 smooth samples in a row.
	for (let i = 1; i < n - 1 && x[i] < 320; i++) {
		if (rough(i)) lastNoisy = i;
		else if (i - Math.max(lastNoisy, 0) > 10) break;
	}
	if (lastNoisy < 0) return undefined;
	return x[Math.min(n - 1, lastNoisy + 2)];
}

/**
 * The long-wavelength band: the longest-wavelength local maximum (±10 nm) away from both ends of the
 * data whose value is at least half the highest such maximum (tail noise never qualifies); -1 when none.
 */
function longWavelengthBandMaximum(x: ArrayLike<number>, y: ArrayLike<number>, fromNm: number): number {
	const n = x.length;
	const step = (x[n - 1] - x[0]) / Math.max(1, n - 1);
	const half = Math.max(2, Math.round(10 / step));
	const inner = localMaxima(y, half).filter((i) => i >= half && i <= n - 1 - half && x[i] >= fromNm && y[i] > 0);
	if (!inner.length) return -1;
	const highest = Math.max(...inner.map((i) => y[i]));
	return inner.filter((i) => y[i] >= 0.5 * highest).reduce((a, b) => (x[b] > x[a] ? b : a));
}

/** Derives λmax, edge, cut-offs, peaks and the search vector; returns warnings about the guards used. */
export function deriveForLibrary(spec: NormalisedSpectrum): { derived: SpectrumDerived; warnings: ParseIssue[] } {
	const warnings: ParseIssue[] = [];
	if (spec.kind === 'transmission') return { derived: deriveSpectrum(spec), warnings };
	const fromNm = spec.kind === 'absorption' ? noisyLeadingEndNm(spec.x, spec.y) : undefined;
	const derived = deriveSpectrum(spec, fromNm === undefined ? {} : { range: { fromNm } });
	if (fromNm !== undefined)
		warnings.push({ severity: 'warning', code: 'noisy_short_end', message: `the data below ${fromNm} nm are noise (solvent or cell cut-off); λmax and peaks were searched above ${fromNm} nm` });
	const { x, y } = spec;
	const n = x.length;
	const top = derived.lambdaMaxNm;
	if (top !== null && n > 2 && (top === x[0] || top === x[n - 1])) {
		const i = longWavelengthBandMaximum(x, y, fromNm ?? -Infinity);
		if (i >= 0) {
			warnings.push({ severity: 'warning', code: 'maximum_at_range_end', message: `the largest value lies at the end of the measured range (${top} nm); λmax is the maximum of the long-wavelength band, ${x[i]} nm` });
			derived.lambdaMaxNm = x[i];
			derived.valueAtMax = y[i];
		}
	}
	return { derived, warnings };
}
