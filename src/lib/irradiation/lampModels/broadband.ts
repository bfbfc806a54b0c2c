/** Broadband sources: Planck blackbody, a xenon-arc-like model, phosphor tubes and measured spectra. */
import { PLANCK_J_S, SPEED_OF_LIGHT_M_S, BOLTZMANN_J_K } from '../constants';
import { MERCURY_PHOSPHOR_TUBE_LINES } from '../mercuryLines';
import { addGaussianLines, trapezoidArea } from './grid';
import { ledShape } from './led';
import type { BlackbodyModel, MeasuredEmissionModel, PhosphorModel, ShapeOnGrid, SpectralGrid } from './types';

/** Second radiation constant c₂ = hc/k in nm·K (CODATA 2018 exact constants). */
const C2_NM_K = ((PLANCK_J_S * SPEED_OF_LIGHT_M_S) / BOLTZMANN_J_K) * 1e9;

/** Planck spectral radiance, relative: λ⁻⁵/(exp(c₂/λT) − 1) (λ in µm to keep numbers moderate). */
export function planckRelative(wavelengthNm: number, temperatureK: number): number {
	const um = wavelengthNm / 1000;
	return 1 / (um ** 5 * Math.expm1(C2_NM_K / (wavelengthNm * temperatureK)));
}

function planckArea(fromNm: number, toNm: number, temperatureK: number): number {
	const n = Math.max(2, Math.ceil((toNm - fromNm) / 0.5) + 1);
	const h = (toNm - fromNm) / (n - 1);
	const y = new Float64Array(n);
	for (let i = 0; i < n; i++) y[i] = planckRelative(fromNm + i * h, temperatureK);
	return trapezoidArea(y, h);
}

export function blackbodyShape(model: BlackbodyModel, grid: SpectralGrid, scale = 1): ShapeOnGrid {
	const from = model.fromNm ?? grid.fromNm;
	const to = model.toNm ?? grid.fromNm + (grid.count - 1) * grid.stepNm;
	const values = new Float64Array(grid.count);
	for (let i = 0; i < grid.count; i++) {
		const wl = grid.fromNm + i * grid.stepNm;
		if (wl >= from && wl <= to) values[i] = planckRelative(wl, model.temperatureK);
	}
	const area = planckArea(from, to, model.temperatureK);
	for (let i = 0; i < grid.count; i++) values[i] *= scale / area;
	return { values, totalArea: scale };
}

/** Xe I lines added to the xenon model (positions from memory; weights are model values). */
export const XENON_MODEL_LINES = [
	{ wavelengthNm: 467.12, relativePower: 3 },
	{ wavelengthNm: 823.16, relativePower: 20 },
	{ wavelengthNm: 828.01, relativePower: 15 },
	{ wavelengthNm: 881.94, relativePower: 25 },
	{ wavelengthNm: 895.23, relativePower: 8 },
	{ wavelengthNm: 904.54, relativePower: 12 },
	{ wavelengthNm: 916.27, relativePower: 8 },
	{ wavelengthNm: 979.97, relativePower: 10 },
	{ wavelengthNm: 992.32, relativePower: 15 }
];
/** Share of the xenon model's power in its lines. */
export const XENON_LINE_SHARE = 0.1;

export function xenonShape(grid: SpectralGrid): ShapeOnGrid {
	const bb = blackbodyShape({ type: 'blackbody', temperatureK: 6000, fromNm: 200, toNm: 1100 }, grid, 1 - XENON_LINE_SHARE);
	const lineSum = XENON_MODEL_LINES.reduce((s, l) => s + l.relativePower, 0);
	addGaussianLines(bb.values, grid, XENON_MODEL_LINES, 2, XENON_LINE_SHARE / lineSum);
	return { values: bb.values, totalArea: 1 };
}

/** Share of a phosphor tube's power in the Hg lines when `mercuryLines` is on (model value). */
export const PHOSPHOR_MERCURY_SHARE = 0.05;

export function phosphorShape(model: PhosphorModel, grid: SpectralGrid): ShapeOnGrid {
	const band = ledShape({ type: 'led', peakNm: model.peakNm, fwhmNm: model.fwhmNm }, grid);
	const withLines = model.mercuryLines ?? true;
	const bandShare = withLines ? 1 - PHOSPHOR_MERCURY_SHARE : 1;
	for (let i = 0; i < grid.count; i++) band.values[i] *= bandShare / band.totalArea;
	if (withLines) {
		const lineSum = MERCURY_PHOSPHOR_TUBE_LINES.reduce((s, l) => s + l.relativePower, 0);
		addGaussianLines(band.values, grid, MERCURY_PHOSPHOR_TUBE_LINES, 1.5, PHOSPHOR_MERCURY_SHARE / lineSum);
	}
	return { values: band.values, totalArea: 1 };
}

/**
 * Measured emission resampled linearly onto the grid (0 outside its range, negatives set to 0). `totalArea` is scaled
 * so that the off-grid share equals the file's own share of power outside the grid (resampling error cancels).
 */
export function measuredShape(model: MeasuredEmissionModel, grid: SpectralGrid): ShapeOnGrid {
	const x = model.wavelengthNm;
	const y = model.power;
	const values = new Float64Array(grid.count);
	let j = 0;
	for (let i = 0; i < grid.count; i++) {
		const wl = grid.fromNm + i * grid.stepNm;
		if (wl < x[0] || wl > x[x.length - 1]) continue;
		while (j < x.length - 2 && x[j + 1] < wl) j++;
		const t = (wl - x[j]) / (x[j + 1] - x[j]);
		values[i] = Math.max(0, y[j] + t * (y[j + 1] - y[j]));
	}
	const lo = grid.fromNm;
	const hi = grid.fromNm + (grid.count - 1) * grid.stepNm;
	let fileTotal = 0;
	let fileInside = 0;
	for (let i = 1; i < x.length; i++) {
		const seg = ((Math.max(0, y[i]) + Math.max(0, y[i - 1])) / 2) * (x[i] - x[i - 1]);
		fileTotal += seg;
		const a = Math.max(x[i - 1], lo);
		const b = Math.min(x[i], hi);
		if (b > a) fileInside += seg * ((b - a) / (x[i] - x[i - 1]));
	}
	const gridArea = trapezoidArea(values, grid.stepNm);
	const totalArea = fileInside > 0 ? (gridArea * fileTotal) / fileInside : fileTotal;
	return { values, totalArea };
}
