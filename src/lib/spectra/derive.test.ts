/**
 * Longest-wavelength band, saturated and noise stretches, cut-off notes.
 * Real files: ../shared/external (MANIFEST.md gives the check values, computed there by an independent script).
 */
import { describe, expect, it } from 'vitest';
import { deriveSpectrum, cutoffNotes } from './derive';
import { norm, parseExternal } from './__fixtures__/external';
import type { NormalisedSpectrum } from './types';

const grid = (from: number, to: number, step = 1) => Float64Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => from + i * step);
const gauss = (x: number, c: number, s: number, h: number) => h * Math.exp(-0.5 * ((x - c) / s) ** 2);
const spec = (x: Float64Array, f: (l: number) => number, yUnit: NormalisedSpectrum['yUnit'] = 'absorbance'): NormalisedSpectrum => ({ kind: 'absorption', x, y: x.map(f), yUnit });
/** Deterministic pseudo-noise (LCG), standard deviation ≈ s. */
const noise = (seed: number) => {
	let v = seed;
	return (s: number) => {
		v = (v * 1664525 + 1013904223) % 4294967296;
		return (v / 4294967296 - 0.5) * s * 3.46;
	};
};

describe('longest-wavelength band (the band one irradiates)', () => {
	it('two bands: a π→π* band of ε 12 000 at 238 nm and an n→π* band of ε 45 at 340 nm → 340, λmax stays 238', () => {
		// orders of magnitude: π→π* 10³–10⁵, n→π* 10–100 M⁻¹ cm⁻¹ (common practice; IUPAC Gold Book "n→π* transition")
		const s = spec(grid(200, 500), (l) => gauss(l, 238, 12, 12000) + gauss(l, 340, 14, 45), 'epsilon');
		const d = deriveSpectrum(s);
		expect(d.lambdaMaxNm).toBe(238);
		expect(d.longestBandNm).toBe(340);
		expect(d.longestBandValue!).toBeCloseTo(45, 0);
		expect(d.peaks.some((p) => p.wavelengthNm === 340)).toBe(true);
	});
	it('the same two bands with noise σ = 0.001 A: still 340 nm, no noise peak beyond it', () => {
		const r = noise(7);
		const s = spec(grid(200, 700), (l) => gauss(l, 238, 12, 1.2) + gauss(l, 340, 14, 0.05) + r(0.001));
		expect(Math.abs(deriveSpectrum(s).longestBandNm! - 340)).toBeLessThanOrEqual(3);
	});
	it('a neat-solvent cut-off edge (A rising to 4 at the short end) has no band', () => {
		const s = spec(grid(190, 600), (l) => Math.min(4, 10 ** ((233 - l) / 10)));
		const d = deriveSpectrum(s);
		expect(d.longestBandNm).toBeNull();
		expect(d.excluded!.some((e) => e.reason === 'saturated' && e.fromNm === 190)).toBe(true);
	});
	it('a saturated plateau (A capped at 3.8) is excluded: no peak on it, the n→π* band beside it is found', () => {
		const s = spec(grid(200, 500), (l) => Math.min(3.8, gauss(l, 250, 15, 9) + gauss(l, 330, 15, 0.4)));
		const d = deriveSpectrum(s);
		const sat = d.excluded!.find((e) => e.reason === 'saturated')!;
		expect(sat.fromNm).toBeLessThan(250);
		expect(sat.toNm).toBeGreaterThan(250);
		expect(d.peaks.every((p) => p.wavelengthNm < sat.fromNm - 2 || p.wavelengthNm > sat.toNm + 2)).toBe(true);
		expect(d.longestBandNm).toBe(330);
		expect(d.lambdaMaxNm! < sat.fromNm || d.lambdaMaxNm! > sat.toNm).toBe(true);
	});
	it('ε data: saturation is judged from A = ε·c·l only when c·l is given', () => {
		const s = spec(grid(200, 500), (l) => gauss(l, 260, 15, 30000), 'epsilon');
		expect(deriveSpectrum(s).excluded).toEqual([]);
		// 30 000 M⁻¹ cm⁻¹ × 1e-4 M × 1 cm = A 3 > 2.5
		expect(deriveSpectrum(s, { absorbancePerY: 1e-4 }).excluded!.some((e) => e.reason === 'saturated')).toBe(true);
	});
});

describe('longest band in real files (../shared/external)', () => {
	it('THF dye file (cheminfo/jcampconverter uv.jdx): 541 nm, A 0.312 (MANIFEST), past the cut-off noise and the lamp-line spikes', () => {
		const s = norm(parseExternal('jcamp/uv-vis-thf-link-absorbance-plus-variance.jdx').value[0]);
		const d = deriveSpectrum(s);
		expect(Math.abs(d.longestBandNm! - 541)).toBeLessThanOrEqual(1);
		expect(d.longestBandValue!).toBeCloseTo(0.312, 3);
		// MANIFEST: "below ~230 nm noise (solvent cut-off)"
		const first = d.excluded!.find((e) => e.reason === 'noise')!;
		expect(first.fromNm).toBe(190);
		expect(first.toNm).toBeGreaterThanOrEqual(225);
		// deuterium-lamp Balmer lines (486.0, 656.1 nm; common practice) are one- or two-sample spikes, not bands
		expect(d.bands!.some((b) => Math.abs(b.wavelengthNm - 656) <= 2)).toBe(false);
	});
	it('UV file written with three decimals (cheminfo/jcampconverter uv_ACD.jdx): its one band is the saturated 216 nm maximum (MANIFEST), not a one-digit step in the tail', () => {
		const s = norm(parseExternal('jcamp/uv-mislabelled-as-infrared-1-per-cm.jdx').value[0]);
		const d = deriveSpectrum(s);
		// MANIFEST: max y 3.076 at 216.0–216.5; the tail from 500 nm on reads 0.005, 0.004, 0.003 (steps of 0.001)
		expect(d.longestBandNm).toBe(216);
		expect(d.longestBandSaturated).toBe(true);
		expect(d.bands!.filter((b) => b.wavelengthNm > 300)).toEqual([]);
		// rounding noise of a 0.001 step: σ = 0.001/√12 (uniform error; common practice)
		expect(d.noiseSigma).toBeCloseTo(0.001 / Math.sqrt(12), 9);
	});
	it('cobalt aquation, 5 blocks (nzhagen/jcamp blckpac1.jdx): d–d band t1 614 nm → t5 596 nm (MANIFEST)', () => {
		const r = parseExternal('jcamp/cobalt-aquation-kinetics-5-blocks.jdx');
		expect(Math.abs(deriveSpectrum(norm(r.value[0])).longestBandNm! - 614)).toBeLessThanOrEqual(2);
		expect(Math.abs(deriveSpectrum(norm(r.value[4])).longestBandNm! - 596)).toBeLessThanOrEqual(2);
	});
	it('cobalt aquation, 20 blocks (JSpecView aquation20.jdx): t1 610 nm, t20 product band 505 nm (MANIFEST)', () => {
		const r = parseExternal('jcamp/cobalt-aquation-kinetics-20-blocks.jdx');
		expect(Math.abs(deriveSpectrum(norm(r.value[0])).longestBandNm! - 610)).toBeLessThanOrEqual(1);
		expect(Math.abs(deriveSpectrum(norm(r.value[19])).longestBandNm! - 505)).toBeLessThanOrEqual(1);
	});
	it('nanoparticle growth (usnistgov/NanoUV-VIS): column "4" band at 388 nm, A 0.1832 (MANIFEST)', () => {
		const r = parseExternal('csv/nanoparticle-growth-35-spectra-descending.csv');
		const d = deriveSpectrum(norm(r.value[0]));
		expect(Math.abs(d.longestBandNm! - 388)).toBeLessThanOrEqual(1);
	});
});

describe('cut-off notes', () => {
	it('T never below 50 % in the data: "below the data range, T(300 nm) = 81 %"', () => {
		const x = grid(300, 800);
		const t = x.map((l) => 0.81 + (0.1 * (l - 300)) / 500);
		expect(cutoffNotes(x, t).cutoff50).toBe('below the data range, T(300 nm) = 81 %');
		const d = deriveSpectrum({ kind: 'transmission', x, y: t, yUnit: 'transmittance' });
		expect(d.cutoff50Nm).toBeNull();
		expect(d.cutoffNotes!.cutoff10).toMatch(/^below the data range/);
	});
});
