/**
 * Mercury emission lines. Positions: NIST Handbook of Basic Atomic Spectroscopic Data (Sansonetti &
 * Martin, J. Phys. Chem. Ref. Data 34, 1559 (2005)) and pencil-lamp values (Sansonetti, Salit & Reader,
 * Appl. Opt. 35, 74 (1996)); air wavelengths except 184.950 nm, which NIST gives in vacuum (< 200 nm).
 * Relative powers are lamp models, not catalogue intensities (those depend on the source).
 */
import type { ReferenceStatus } from './data/solvents';

export interface MercuryLine {
	wavelengthNm: number;
	medium: 'air' | 'vacuum';
	status: ReferenceStatus;
}

/** NIST Hg I line positions used by the lamp models. */
export const MERCURY_LINES: readonly MercuryLine[] = [
	{ wavelengthNm: 184.95, medium: 'vacuum', status: 'from memory' },
	{ wavelengthNm: 253.652, medium: 'air', status: 'from memory' },
	{ wavelengthNm: 296.728, medium: 'air', status: 'verified' },
	{ wavelengthNm: 302.15, medium: 'air', status: 'verified' },
	{ wavelengthNm: 312.567, medium: 'air', status: 'from memory' },
	{ wavelengthNm: 313.155, medium: 'air', status: 'from memory' },
	{ wavelengthNm: 313.184, medium: 'air', status: 'from memory' },
	{ wavelengthNm: 334.148, medium: 'air', status: 'verified' },
	{ wavelengthNm: 365.015, medium: 'air', status: 'verified' },
	{ wavelengthNm: 365.484, medium: 'air', status: 'verified' },
	{ wavelengthNm: 366.328, medium: 'air', status: 'verified' },
	{ wavelengthNm: 404.656, medium: 'air', status: 'verified' },
	{ wavelengthNm: 407.784, medium: 'air', status: 'verified' },
	{ wavelengthNm: 435.834, medium: 'air', status: 'verified' },
	{ wavelengthNm: 546.075, medium: 'air', status: 'verified' },
	{ wavelengthNm: 576.961, medium: 'air', status: 'verified' },
	{ wavelengthNm: 579.067, medium: 'air', status: 'verified' },
	{ wavelengthNm: 1013.975, medium: 'air', status: 'verified' }
];

/** A line (or blend) with a relative radiated power, arbitrary units. */
export interface WeightedLine {
	wavelengthNm: number;
	relativePower: number;
}

/**
 * Low-pressure (germicidal) lamp model: ≈ 85–90 % of the UV output at 253.652 nm and ≈ 8 % at
 * 184.950 nm when the envelope transmits it (from memory); weak lines elsewhere (model values).
 * The 184.950 nm line is listed first; ozone-free envelopes drop it.
 */
export const MERCURY_LOW_PRESSURE_LINES: readonly WeightedLine[] = [
	{ wavelengthNm: 184.95, relativePower: 9 },
	{ wavelengthNm: 253.652, relativePower: 100 },
	{ wavelengthNm: 296.728, relativePower: 0.3 },
	{ wavelengthNm: 302.15, relativePower: 0.1 },
	{ wavelengthNm: 312.567, relativePower: 0.3 },
	{ wavelengthNm: 313.155, relativePower: 0.4 },
	{ wavelengthNm: 365.015, relativePower: 1 },
	{ wavelengthNm: 404.656, relativePower: 1.5 },
	{ wavelengthNm: 435.834, relativePower: 3 },
	{ wavelengthNm: 546.075, relativePower: 2.5 },
	{ wavelengthNm: 576.961, relativePower: 0.3 },
	{ wavelengthNm: 579.067, relativePower: 0.3 }
];

/**
 * Medium-pressure lamp: radiated watts per band normalised to 365/366 nm = 100 (≈ 450 W immersion lamp;
 * Calvert & Pitts, Photochemistry, Wiley 1966, from memory). Bands shared by several lines are split
 * evenly between them (a model choice); lines not in MERCURY_LINES (289.4, 280.4, 265.2, 248.2,
 * 222.4 nm) are band positions from memory. The continuum is omitted.
 */
export const MERCURY_MEDIUM_PRESSURE_LINES: readonly WeightedLine[] = [
	{ wavelengthNm: 222.4, relativePower: 17 },
	{ wavelengthNm: 248.2, relativePower: 9 },
	{ wavelengthNm: 253.652, relativePower: 23 },
	{ wavelengthNm: 265.2, relativePower: 16 },
	{ wavelengthNm: 280.4, relativePower: 9 },
	{ wavelengthNm: 289.4, relativePower: 6 },
	{ wavelengthNm: 296.728, relativePower: 17 },
	{ wavelengthNm: 302.15, relativePower: 28 },
	{ wavelengthNm: 312.567, relativePower: 52 / 3 },
	{ wavelengthNm: 313.155, relativePower: 52 / 3 },
	{ wavelengthNm: 313.184, relativePower: 52 / 3 },
	{ wavelengthNm: 334.148, relativePower: 9 },
	{ wavelengthNm: 365.015, relativePower: 100 / 3 },
	{ wavelengthNm: 365.484, relativePower: 100 / 3 },
	{ wavelengthNm: 366.328, relativePower: 100 / 3 },
	{ wavelengthNm: 404.656, relativePower: 43 / 2 },
	{ wavelengthNm: 407.784, relativePower: 43 / 2 },
	{ wavelengthNm: 435.834, relativePower: 79 },
	{ wavelengthNm: 546.075, relativePower: 96 },
	{ wavelengthNm: 576.961, relativePower: 39 },
	{ wavelengthNm: 579.067, relativePower: 39 }
];

/** Hg lines that show through the phosphor of fluorescent tubes (visible lines, model weights). */
export const MERCURY_PHOSPHOR_TUBE_LINES: readonly WeightedLine[] = [
	{ wavelengthNm: 404.656, relativePower: 2 },
	{ wavelengthNm: 435.834, relativePower: 4 },
	{ wavelengthNm: 546.075, relativePower: 3 },
	{ wavelengthNm: 576.961, relativePower: 0.5 },
	{ wavelengthNm: 579.067, relativePower: 0.5 }
];
