/** Lamp emission models (wavelengths in nm, power in W). */

/** LED: Gaussian or Ohno (2005) line shape; `skew` in (−1, 1) splits the FWHM unevenly (see led.ts). */
export interface LedModel { type: 'led'; peakNm: number; fwhmNm: number; shape?: 'gaussian' | 'ohno'; skew?: number }
/**
 * Mercury lamp: NIST line positions broadened to `lineWidthNm` FWHM (default 1 nm LP, 2 nm MP). powerW includes the
 * 185 nm line unless `powerWithout185nm` (then the line comes on top); see mercuryLines.ts.
 */
export interface MercuryModel { type: 'mercury-low-pressure' | 'mercury-medium-pressure'; ozoneFree?: boolean; lineWidthNm?: number; powerWithout185nm?: boolean }
export type ExcimerEmitter = 'Xe2' | 'KrCl' | 'KrF' | 'XeBr' | 'XeCl' | 'XeF';
/** Dielectric-barrier excimer/exciplex lamp: one Gaussian band at the emitter's peak. */
export interface ExcimerModel { type: 'excimer'; emitter: ExcimerEmitter; fwhmNm?: number }
/** Laser line; `widthNm` default 0.1 nm (widened to two grid steps so the line is resolved). */
export interface LaserModel { type: 'laser'; lineNm: number; widthNm?: number }
/** Planck blackbody between fromNm and toNm (default: the whole grid). */
export interface BlackbodyModel { type: 'blackbody'; temperatureK: number; fromNm?: number; toNm?: number }
/** Xenon-arc-like model: 6000 K blackbody 200–1100 nm plus near-IR Xe lines (a model, not a lamp). */
export interface XenonModel { type: 'xenon' }
/** Phosphor tube: Gaussian band, plus the visible Hg lines unless `mercuryLines` is false. */
export interface PhosphorModel { type: 'phosphor'; peakNm: number; fwhmNm: number; mercuryLines?: boolean }
/** Measured emission (any positive units per nm), area-normalised to the lamp power. */
export interface MeasuredEmissionModel { type: 'measured'; wavelengthNm: readonly number[]; power: readonly number[] }

export type LampModel =
	| LedModel | MercuryModel | ExcimerModel | LaserModel | BlackbodyModel | XenonModel | PhosphorModel | MeasuredEmissionModel;
export type LampType = LampModel['type'];

/** Uniform wavelength grid: fromNm + i·stepNm, i < count. */
export interface SpectralGrid { fromNm: number; stepNm: number; count: number }

/** Planner grid: 190–1100 nm, 0.5 nm. */
export const DEFAULT_LAMP_GRID: SpectralGrid = { fromNm: 190, stepNm: 0.5, count: 1821 };
/** Grid for safety checks: 150–1100 nm, 0.5 nm (keeps the 185 nm Hg line and 172 nm Xe₂* band). */
export const CAUTION_GRID: SpectralGrid = { fromNm: 150, stepNm: 0.5, count: 1901 };

export interface LampSpectrum {
	wavelengthNm: Float64Array;
	/** Spectral power, W nm⁻¹; trapezoid area = powerW × (1 − outsideGridFraction). */
	powerWPerNm: Float64Array;
	/** Share of the model's power that lies outside the grid (0–1): it is emitted, just not on this grid. */
	outsideGridFraction: number;
}

/** An un-normalised emission shape on the grid and the model's full area (on and off the grid). */
export interface ShapeOnGrid { values: Float64Array; totalArea: number }
