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
 * Power convention: a mercury lamp's `powerW` is its total optical output over all lines the envelope lets out —
 * including 184.950 nm for an envelope that transmits it — unless the model says `powerWithout185nm: true` (the
 * usual datasheet "UV-C output at 254 nm" figure), in which case the 185 nm line comes on top of powerW. On the planner
 * grid (from 190 nm) the 185 nm line lies outside; its power is reported as outside the grid, never handed to the
 * other lines.
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
 * Medium-pressure (≈ 450 W immersion) lamp: radiated watts per line group, the complete table as widely reproduced from
 * Calvert & Pitts, Photochemistry, Wiley 1966 (from memory; REFERENCE.md §3.2 gives the same groups normalised to
 * 365/366 nm = 100): 1367.3 2.6, 1128.7 3.3, 1014.0 10.5, 577/579 20.0, 546.1 24.5, 435.8 20.2, 404.7/407.8 11.0,
 * 365/366 25.6, 334.1 2.4, 313 13.2, 302.5 7.2, 296.7 4.3, 289.4 1.6, 280.4 2.4, 275.3 0.7, 270.0 1.0, 265.2 4.0,
 * 257.1 1.5, 253.7 5.8 (self-reversed), 248.2 2.3, 240.0 1.9, 238.0 2.3, 236.0 2.3, 232.0 0.8, 222.4 4.3 W.
 * A group's power is shared between its NIST component lines in proportion to their NIST "strong lines" relative
 * intensities (a model choice); groups without listed components sit at the table's wavelength. The continuum is
 * omitted. `peakNm` is the strongest group (365/366 nm) at its strongest component, 365.015 nm.
 */
export interface MercuryGroup { labelNm: number; watts: number; components: readonly { wavelengthNm: number; weight: number }[] }
export const MERCURY_MEDIUM_PRESSURE_GROUPS: readonly MercuryGroup[] = [
	{ labelNm: 222.4, watts: 4.3, components: [{ wavelengthNm: 222.4, weight: 1 }] },
	{ labelNm: 232.0, watts: 0.8, components: [{ wavelengthNm: 232.0, weight: 1 }] },
	{ labelNm: 236.0, watts: 2.3, components: [{ wavelengthNm: 236.0, weight: 1 }] },
	{ labelNm: 238.0, watts: 2.3, components: [{ wavelengthNm: 238.0, weight: 1 }] },
	{ labelNm: 240.0, watts: 1.9, components: [{ wavelengthNm: 240.0, weight: 1 }] },
	{ labelNm: 248.2, watts: 2.3, components: [{ wavelengthNm: 248.2, weight: 1 }] },
	{ labelNm: 253.7, watts: 5.8, components: [{ wavelengthNm: 253.652, weight: 1 }] },
	{ labelNm: 257.1, watts: 1.5, components: [{ wavelengthNm: 257.1, weight: 1 }] },
	{ labelNm: 265.2, watts: 4.0, components: [{ wavelengthNm: 265.2, weight: 1 }] },
	{ labelNm: 270.0, watts: 1.0, components: [{ wavelengthNm: 270.0, weight: 1 }] },
	{ labelNm: 275.3, watts: 0.7, components: [{ wavelengthNm: 275.3, weight: 1 }] },
	{ labelNm: 280.4, watts: 2.4, components: [{ wavelengthNm: 280.4, weight: 1 }] },
	{ labelNm: 289.4, watts: 1.6, components: [{ wavelengthNm: 289.4, weight: 1 }] },
	{ labelNm: 296.7, watts: 4.3, components: [{ wavelengthNm: 296.728, weight: 1 }] },
	{ labelNm: 302.5, watts: 7.2, components: [{ wavelengthNm: 302.15, weight: 1 }] },
	{ labelNm: 313, watts: 13.2, components: [{ wavelengthNm: 312.567, weight: 400 }, { wavelengthNm: 313.155, weight: 320 }, { wavelengthNm: 313.184, weight: 320 }] },
	{ labelNm: 334.1, watts: 2.4, components: [{ wavelengthNm: 334.148, weight: 1 }] },
	{ labelNm: 366, watts: 25.6, components: [{ wavelengthNm: 365.015, weight: 2800 }, { wavelengthNm: 365.484, weight: 300 }, { wavelengthNm: 366.328, weight: 240 }] },
	{ labelNm: 404.5, watts: 11.0, components: [{ wavelengthNm: 404.656, weight: 1800 }, { wavelengthNm: 407.784, weight: 150 }] },
	{ labelNm: 435.8, watts: 20.2, components: [{ wavelengthNm: 435.834, weight: 1 }] },
	{ labelNm: 546.1, watts: 24.5, components: [{ wavelengthNm: 546.075, weight: 1 }] },
	{ labelNm: 578, watts: 20.0, components: [{ wavelengthNm: 576.961, weight: 240 }, { wavelengthNm: 579.067, weight: 280 }] },
	{ labelNm: 1014, watts: 10.5, components: [{ wavelengthNm: 1013.975, weight: 1 }] },
	{ labelNm: 1128.7, watts: 3.3, components: [{ wavelengthNm: 1128.7, weight: 1 }] },
	{ labelNm: 1367.3, watts: 2.6, components: [{ wavelengthNm: 1367.3, weight: 1 }] }
];

/** The medium-pressure groups as weighted lines (watts shared between components). */
export const MERCURY_MEDIUM_PRESSURE_LINES: readonly WeightedLine[] = MERCURY_MEDIUM_PRESSURE_GROUPS.flatMap((g) => {
	const sum = g.components.reduce((s, c) => s + c.weight, 0);
	return g.components.map((c) => ({ wavelengthNm: c.wavelengthNm, relativePower: (g.watts * c.weight) / sum }));
});

/** Strongest medium-pressure group, reported at its strongest component line (nm). */
export const MERCURY_MEDIUM_PRESSURE_PEAK_NM = (() => {
	const g = [...MERCURY_MEDIUM_PRESSURE_GROUPS].sort((a, b) => b.watts - a.watts)[0];
	return [...g.components].sort((a, b) => b.weight - a.weight)[0].wavelengthNm;
})();

/** Strongest low-pressure line (nm): 253.652 nm (air). */
export const MERCURY_LOW_PRESSURE_PEAK_NM = 253.652;

/** Hg lines that show through the phosphor of fluorescent tubes (visible lines, model weights). */
export const MERCURY_PHOSPHOR_TUBE_LINES: readonly WeightedLine[] = [
	{ wavelengthNm: 404.656, relativePower: 2 },
	{ wavelengthNm: 435.834, relativePower: 4 },
	{ wavelengthNm: 546.075, relativePower: 3 },
	{ wavelengthNm: 576.961, relativePower: 0.5 },
	{ wavelengthNm: 579.067, relativePower: 0.5 }
];
