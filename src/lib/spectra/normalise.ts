/**
 * Normalisation to nm (ascending) and one y-quantity per kind (PRODUCT.md):
 * absorption → ε (M⁻¹ cm⁻¹) when concentration and path are known, else absorbance;
 * transmission → fraction 0–1; emission → the file's relative or absolute unit (W nm⁻¹, W m⁻² nm⁻¹, µmol s⁻¹ nm⁻¹,
 * µmol m⁻² s⁻¹ nm⁻¹; counts → relative, with `y_unit_original` = counts).
 * Wavenumber data are resampled onto a uniform nm grid (λ = 1e7/ν̃), never relabelled.
 */
import type { NormalisedSpectrum, ParseIssue, RawSpectrum, Result } from './types';
import { resampleToGrid } from './resample';
import { wavenumberStepNm } from './wavenumberStep';

export interface NormaliseOptions {
	/** Molar concentration, M (default: the file's metadata). */
	concentrationM?: number;
	/** Optical path, cm (default: the file's metadata). */
	pathCm?: number;
}

/** Largest absorbance produced from T = 0 (T floored at 1e-10, common practice for display). */
export const MAX_ABSORBANCE = 10;

const err = (code: string, message: string): Result<NormalisedSpectrum> => ({ ok: false, issues: [{ severity: 'error', code, message }] });

/** Converts y to the kind's quantity; returns the new unit. */
function convertY(raw: RawSpectrum, c: number | undefined, l: number | undefined, warnings: ParseIssue[]) {
	const n = raw.y.length;
	const y = new Float64Array(n);
	const u = raw.yUnit;
	let capped = 0;
	const toA = (t: number) => {
		if (t <= 1e-10) {
			capped++;
			return MAX_ABSORBANCE;
		}
		return -Math.log10(t);
	};
	// reflectance is never read as absorbance or transmittance, and nothing else is read as reflectance
	if (raw.kind === 'reflectance' || u === 'reflectance' || u === 'reflectance-percent') {
		if (raw.kind !== 'reflectance' || (u !== 'reflectance' && u !== 'reflectance-percent')) return undefined;
		for (let i = 0; i < n; i++) y[i] = u === 'reflectance-percent' ? raw.y[i] / 100 : raw.y[i];
		return { y, yUnit: 'reflectance' as const };
	}
	if (raw.kind === 'absorption') {
		for (let i = 0; i < n; i++) {
			const v = raw.y[i];
			// %T → A = 2 − log10(%T) = −log10(%T/100); T → A = −log10 T; log ε → ε = 10^(log ε).
			y[i] = u === 'transmittance-percent' ? toA(v / 100) : u === 'transmittance' ? toA(v) : u === 'log-epsilon' ? 10 ** v : v;
		}
		if (capped) warnings.push({ severity: 'warning', code: 'absorbance_capped', message: `${capped} points with T ≈ 0 set to A = ${MAX_ABSORBANCE}` });
		if (u === 'epsilon' || u === 'log-epsilon') return { y, yUnit: 'epsilon' as const };
		if (c !== undefined && l !== undefined) {
			// Beer–Lambert: ε = A / (c·l).
			for (let i = 0; i < n; i++) y[i] /= c * l;
			return { y, yUnit: 'epsilon' as const };
		}
		return { y, yUnit: 'absorbance' as const };
	}
	if (raw.kind === 'transmission') {
		for (let i = 0; i < n; i++) {
			const v = raw.y[i];
			y[i] = u === 'transmittance-percent' ? v / 100 : u === 'absorbance' ? 10 ** -v : v;
		}
		if (u !== 'transmittance' && u !== 'transmittance-percent' && u !== 'absorbance') return undefined;
		return { y, yUnit: 'transmittance' as const };
	}
	y.set(raw.y);
	// absolute power and photon densities keep their own unit (photon units are photon spectra: lampModels/measuredEmission.ts)
	if (u === 'W/nm' || u === 'W/m2/nm' || u === 'umol/s/nm' || u === 'umol/m2/s/nm') return { y, yUnit: u };
	if (u === 'relative' || u === 'counts') return { y, yUnit: 'relative' as const };
	return undefined;
}

/**
 * The uniform grid k·step that lies inside [first, last]: every grid point from + i·step (computed the way
 * resampleToGrid computes it) is ≥ first and ≤ last, so no resampled value falls outside the data.
 */
export function gridInside(first: number, last: number, step: number): { from: number; to: number } {
	let k = Math.ceil(first / step - 1e-9);
	while (k * step < first) k++;
	const from = k * step;
	let n = Math.floor((last - from) / step + 1e-9) + 1;
	while (n > 0 && from + (n - 1) * step > last) n--;
	return { from, to: from + (n - 1) * step };
}

/**
 * Normalises a parsed spectrum. Never throws.
 * @returns ok with x in nm strictly ascending; errors for impossible concentration/path or unit/kind pairs
 */
export function normaliseSpectrum(raw: RawSpectrum, opts: NormaliseOptions = {}): Result<NormalisedSpectrum> {
	try {
		const warnings: ParseIssue[] = [];
		const c = opts.concentrationM ?? raw.metadata.concentrationM;
		const l = opts.pathCm ?? raw.metadata.pathCm;
		if (c !== undefined && !(Number.isFinite(c) && c > 0)) return err('invalid_concentration', `concentrationM must be a positive number (got ${c})`);
		if (l !== undefined && !(Number.isFinite(l) && l > 0)) return err('invalid_path', `pathCm must be a positive number (got ${l})`);
		if (c !== undefined && l !== undefined && !(Number.isFinite(1 / (c * l)) && c * l > 0))
			return err('invalid_concentration', `concentrationM × pathCm = ${c} × ${l} is too small to divide by (ε would be infinite)`);
		const conv = convertY(raw, c, l, warnings);
		if (!conv) return err('unit_kind_mismatch', `y unit ${raw.yUnit} cannot be a ${raw.kind} spectrum`);
		for (let i = 0; i < conv.y.length; i++)
			if (!Number.isFinite(conv.y[i])) return err('not_finite', `y = ${raw.y[i]} (${raw.yUnit})${raw.lines?.[i] ? ` on line ${raw.lines[i]}` : ` at point ${i + 1}`} is not finite after conversion to ${conv.yUnit}`);
		const n = raw.x.length;
		const xNm = new Float64Array(n);
		for (let i = 0; i < n; i++) xNm[i] = raw.xUnit === 'um' ? raw.x[i] * 1000 : raw.xUnit === 'cm-1' ? 1e7 / raw.x[i] : raw.x[i];
		const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => xNm[a] - xNm[b]);
		let x: Float64Array = Float64Array.from(order, (i) => xNm[i]);
		let y: Float64Array = Float64Array.from(order, (i) => conv.y[i]);
		for (let i = 1; i < x.length; i++) if (!(x[i] > x[i - 1])) return err('duplicate_x', `two points at ${x[i]} nm`);
		if (raw.xUnit === 'cm-1') {
			if (raw.kind === 'emission' && (conv.yUnit === 'relative')) {
				// A spectral density per cm⁻¹ becomes one per nm: y_λ = y_ν̃ · |dν̃/dλ| = y_ν̃ · 10⁷/λ² (λ in nm).
				for (let i = 0; i < x.length; i++) y[i] *= 1e7 / (x[i] * x[i]);
				warnings.push({ severity: 'warning', code: 'wavenumber_density_converted', message: 'emission per cm⁻¹ converted to per nm (× 10⁷/λ²) before resampling' });
			}
			const step = wavenumberStepNm(x);
			const { from, to } = gridInside(x[0], x[x.length - 1], step);
			if (!(to >= from)) return err('too_few_points', 'the wavenumber range is too narrow to resample');
			const yg = resampleToGrid(x, y, from, to, step);
			x = Float64Array.from(yg, (_, i) => from + i * step);
			y = yg;
			warnings.push({ severity: 'warning', code: 'resampled_from_wavenumber', message: `wavenumber data resampled to ${x.length} points every ${step} nm (λ = 1e7/ν̃)` });
			if (x.length < 2) return err('too_few_points', 'the wavenumber range is too narrow to resample');
		}
		return { ok: true, value: { kind: raw.kind, x, y, yUnit: conv.yUnit }, warnings };
	} catch (e) {
		return err('internal_error', `normalisation failed: ${(e as Error)?.message ?? e}`);
	}
}
