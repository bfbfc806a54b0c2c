/**
 * Wall (vessel) transmittance. Slab in air, normal incidence, multiple reflections ignored:
 *   T_wall(λ) = (1 − R)²·exp(−α(λ)·d),  R = ((n − 1)/(n + 1))²,  α = 4πk/λ   (Born & Wolf, Principles of Optics);
 * from a measured total curve T₀ at d₀:  T(d) = (1 − R)²·(T₀/(1 − R)²)^(d/d₀)  (Beer–Lambert on the internal part).
 */
import { xyInterpolateLinear } from 'ml-spectra-processing';
import { edgeModelTransmissionOnGrid, type EdgeMaterial } from './materialEdgeModel';

export type { EdgeMaterial } from './materialEdgeModel';

/** Tabulated extinction coefficient k(λ); below the first wavelength the wall is taken as opaque (no data). */
export interface KTableMaterial {
	model: 'k';
	kTable: { wavelengthNm: readonly number[]; k: readonly number[] };
	n: number;
}

/** Measured total transmittance (0–1, Fresnel included) at `thicknessMm`; held constant outside its range. */
export interface MeasuredMaterial {
	model: 'measured';
	wavelengthNm: readonly number[];
	transmittance: readonly number[];
	thicknessMm: number;
	n: number;
}

export type WallMaterialModel = KTableMaterial | MeasuredMaterial | EdgeMaterial;

/** Fresnel reflectance at normal incidence between media of index n and nMedium (default air, 1). */
export function fresnelReflectance(n: number, nMedium = 1): number {
	return ((n - nMedium) / (n + nMedium)) ** 2;
}

function interpolateClamped(x: readonly number[], y: readonly number[], targets: Float64Array): Float64Array {
	const lo = x[0];
	const hi = x[x.length - 1];
	const clamped = new Float64Array(targets.length);
	for (let i = 0; i < targets.length; i++) clamped[i] = Math.min(hi, Math.max(lo, targets[i]));
	return xyInterpolateLinear({ x: x as number[], y: y as number[] }, clamped);
}

function checkTable(x: readonly number[], y: readonly number[], field: string): void {
	if (x.length < 2 || x.length !== y.length) throw new RangeError(`${field}: need ≥ 2 points and equal lengths`);
	for (let i = 0; i < x.length; i++) {
		if (!Number.isFinite(x[i]) || !Number.isFinite(y[i])) throw new RangeError(`${field}: point ${i} is not a finite number`);
		if (i > 0 && !(x[i] > x[i - 1])) throw new RangeError(`${field}: wavelengths must ascend (point ${i})`);
	}
}

/**
 * Total transmittance (0–1) of a wall `thicknessMm` thick on the uniform grid fromNm + i·stepNm, i < count.
 * Throws RangeError naming the field for an invalid material or thickness.
 */
export function wallTransmissionOnGrid(material: WallMaterialModel, thicknessMm: number, fromNm: number, stepNm: number, count: number): Float64Array {
	if (!(thicknessMm >= 0) || !Number.isFinite(thicknessMm)) throw new RangeError(`thicknessMm must be ≥ 0, got ${thicknessMm}`);
	if (!(material.n >= 1)) throw new RangeError(`n must be ≥ 1, got ${material.n}`);
	if (material.model === 'edge') return edgeModelTransmissionOnGrid(material, thicknessMm, fromNm, stepNm, count);
	const fresnel = (1 - fresnelReflectance(material.n)) ** 2;
	const grid = new Float64Array(count);
	for (let i = 0; i < count; i++) grid[i] = fromNm + i * stepNm;
	const out = new Float64Array(count);
	if (material.model === 'k') {
		const { wavelengthNm, k } = material.kTable;
		checkTable(wavelengthNm, k, 'kTable');
		const kOnGrid = interpolateClamped(wavelengthNm, k, grid);
		for (let i = 0; i < count; i++) {
			// α = 4πk/λ with λ in nm and d in mm: α·d = 4πk·d·1e6/λ.
			out[i] = grid[i] < wavelengthNm[0] ? 0 : fresnel * Math.exp((-4 * Math.PI * Math.max(0, kOnGrid[i]) * thicknessMm * 1e6) / grid[i]);
		}
		return out;
	}
	checkTable(material.wavelengthNm, material.transmittance, 'transmittance');
	if (!(material.thicknessMm > 0)) throw new RangeError(`thicknessMm of the measured curve must be > 0, got ${material.thicknessMm}`);
	const t0 = interpolateClamped(material.wavelengthNm, material.transmittance, grid);
	const ratio = thicknessMm / material.thicknessMm;
	for (let i = 0; i < count; i++) {
		const internal = Math.min(1, Math.max(0, t0[i]) / fresnel);
		out[i] = fresnel * internal ** ratio;
	}
	return out;
}

/** Total wall transmittance at one wavelength (nm). */
export function wallTransmission(material: WallMaterialModel, thicknessMm: number, wavelengthNm: number): number {
	return wallTransmissionOnGrid(material, thicknessMm, wavelengthNm, 1, 1)[0];
}

/**
 * Shortest wavelength above which T stays ≥ `threshold` up to the end of the arrays, interpolated linearly.
 * Returns the first wavelength when T never drops below the threshold (the true cut-off is at or below it)
 * and null when T is below the threshold at the last wavelength.
 */
export function transmissionCutoffNm(wavelengthNm: ArrayLike<number>, transmittance: ArrayLike<number>, threshold: number): number | null {
	const last = wavelengthNm.length - 1;
	if (last < 0 || transmittance[last] < threshold) return null;
	for (let i = last - 1; i >= 0; i--) {
		if (transmittance[i] < threshold) {
			const t0 = transmittance[i];
			const t1 = transmittance[i + 1];
			return wavelengthNm[i] + ((threshold - t0) / (t1 - t0)) * (wavelengthNm[i + 1] - wavelengthNm[i]);
		}
	}
	return wavelengthNm[0];
}

export interface WallCutoffOptions {
	/** Grid start, nm (default 190). */
	fromNm?: number;
	/** Upper end of the search, nm (default 800). */
	toNm?: number;
	/** Grid step, nm (default 0.1). */
	stepNm?: number;
}

/**
 * 10 % and 50 % cut-offs (nm) of a wall; see transmissionCutoffNm for the conventions. Searched only where the
 * material has data (k tables and measured curves start somewhere; the edge model has no lower limit): when T stays
 * above the threshold down to the first wavelength with data, the cut-off lies below the data range and is null, with
 * a note such as "below the data range, T(300 nm) = 81 %" (never the data limit reported as a cut-off).
 */
export function wallCutoffsNm(
	material: WallMaterialModel, thicknessMm: number, options: WallCutoffOptions = {}
): { cutoff10Nm: number | null; cutoff50Nm: number | null; cutoff10Note?: string; cutoff50Note?: string; dataFromNm: number } {
	const { toNm = 800, stepNm = 0.1 } = options;
	const dataFrom = material.model === 'k' ? material.kTable.wavelengthNm[0] : material.model === 'measured' ? material.wavelengthNm[0] : -Infinity;
	const fromNm = Math.max(options.fromNm ?? 190, dataFrom);
	const count = Math.floor((toNm - fromNm) / stepNm + 1e-9) + 1;
	const t = wallTransmissionOnGrid(material, thicknessMm, fromNm, stepNm, count);
	const x = new Float64Array(count);
	for (let i = 0; i < count; i++) x[i] = fromNm + i * stepNm;
	const pct = (v: number) => `${(v * 100).toFixed(v < 0.1 ? 1 : 0)} %`;
	const one = (threshold: number): [number | null, string | undefined] => {
		const c = transmissionCutoffNm(x, t, threshold);
		if (c === null) return [null, `above the data range, T(${toNm} nm) = ${pct(t[count - 1])}`];
		if (c === x[0] && t[0] >= threshold) return [null, `below the data range, T(${Math.round(fromNm * 10) / 10} nm) = ${pct(t[0])}`];
		return [c, undefined];
	};
	const [c10, n10] = one(0.1);
	const [c50, n50] = one(0.5);
	return { cutoff10Nm: c10, cutoff50Nm: c50, ...(n10 ? { cutoff10Note: n10 } : {}), ...(n50 ? { cutoff50Note: n50 } : {}), dataFromNm: fromNm };
}
