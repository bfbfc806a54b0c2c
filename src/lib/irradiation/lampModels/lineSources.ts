/** Line sources: mercury low/medium pressure, excimer bands and lasers, as Gaussian-broadened lines. */
import { MERCURY_LOW_PRESSURE_LINES, MERCURY_LOW_PRESSURE_PEAK_NM, MERCURY_MEDIUM_PRESSURE_LINES, MERCURY_MEDIUM_PRESSURE_PEAK_NM } from '../mercuryLines';
import { addGaussianLines } from './grid';
import type { ExcimerEmitter, ExcimerModel, LaserModel, MercuryModel, ShapeOnGrid, SpectralGrid } from './types';

/** Below this wavelength "ozone-free" (doped) envelopes absorb the emission, nm (from memory). */
export const OZONE_FREE_ENVELOPE_CUTOFF_NM = 240;

/**
 * Excimer/exciplex emitters: peak and typical FWHM, nm (from memory; Kogelschatz, Plasma Chem. Plasma
 * Process. 23, 1 (2003); Lomaev et al., Phys.-Usp. 46, 193 (2003)).
 */
export const EXCIMER_EMITTERS: Record<ExcimerEmitter, { peakNm: number; fwhmNm: number }> = {
	Xe2: { peakNm: 172, fwhmNm: 14 },
	KrCl: { peakNm: 222, fwhmNm: 4 },
	KrF: { peakNm: 248, fwhmNm: 4 },
	XeBr: { peakNm: 282, fwhmNm: 4 },
	XeCl: { peakNm: 308, fwhmNm: 3.5 },
	XeF: { peakNm: 351, fwhmNm: 15 }
};

export function mercuryShape(model: MercuryModel, grid: SpectralGrid): ShapeOnGrid {
	const lp = model.type === 'mercury-low-pressure';
	const all = lp ? MERCURY_LOW_PRESSURE_LINES : MERCURY_MEDIUM_PRESSURE_LINES;
	const lines = model.ozoneFree ? all.filter((l) => l.wavelengthNm >= OZONE_FREE_ENVELOPE_CUTOFF_NM) : all;
	const values = new Float64Array(grid.count);
	let totalArea = addGaussianLines(values, grid, lines, model.lineWidthNm ?? (lp ? 1 : 2));
	// powerW without the 185 nm line (mercuryLines.ts convention): the line's power comes on top of powerW.
	if (model.powerWithout185nm) totalArea -= lines.filter((l) => l.wavelengthNm < 200).reduce((s, l) => s + l.relativePower, 0);
	return { values, totalArea };
}

/** The strongest line of a line source, at its own wavelength (nm); undefined for other models. */
export function lineSourcePeakNm(model: MercuryModel | ExcimerModel | LaserModel): number {
	if (model.type === 'mercury-low-pressure') return MERCURY_LOW_PRESSURE_PEAK_NM;
	if (model.type === 'mercury-medium-pressure') return MERCURY_MEDIUM_PRESSURE_PEAK_NM;
	if (model.type === 'excimer') return EXCIMER_EMITTERS[model.emitter].peakNm;
	return (model as LaserModel).lineNm;
}

export function excimerShape(model: ExcimerModel, grid: SpectralGrid): ShapeOnGrid {
	const e = EXCIMER_EMITTERS[model.emitter];
	const values = new Float64Array(grid.count);
	const totalArea = addGaussianLines(values, grid, [{ wavelengthNm: e.peakNm, relativePower: 1 }], model.fwhmNm ?? e.fwhmNm);
	return { values, totalArea };
}

export function laserShape(model: LaserModel, grid: SpectralGrid): ShapeOnGrid {
	const values = new Float64Array(grid.count);
	const totalArea = addGaussianLines(values, grid, [{ wavelengthNm: model.lineNm, relativePower: 1 }], model.widthNm ?? 0.1);
	return { values, totalArea };
}
