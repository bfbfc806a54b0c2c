/**
 * Approximate wall material from two edge wavelengths (λ where total T = 10 % and 50 % at a stated
 * thickness), for materials without open k data.
 *
 * Shape chosen: a log-linear (exponential, Urbach-like) absorption edge in wavelength,
 *   a(λ) = a₅₀ · 10^((λ₅₀ − λ)/w)   (decadic internal absorbance per mm),
 *   T(λ, d) = T_max · 10^(−a(λ)·d),   T_max = (1 − R)² by default (two air faces).
 * a₅₀ and w follow from T(λ₅₀, d₀) = 0.5 and T(λ₁₀, d₀) = 0.1:
 *   A₅₀ = log10(T_max/0.5), A₁₀ = log10(T_max/0.1), w = (λ₅₀ − λ₁₀)/log10(A₁₀/A₅₀), a₅₀ = A₅₀/d₀.
 * Because a(λ) is a per-length coefficient, the curve scales with thickness by Beer–Lambert.
 */

export interface EdgeMaterial {
	model: 'edge';
	/** λ (nm) where total T = 10 % at `atThicknessMm`. */
	edge10Nm: number;
	/** λ (nm) where total T = 50 % at `atThicknessMm`. */
	edge50Nm: number;
	atThicknessMm: number;
	/** Refractive index (≈ 589 nm). */
	n: number;
	/** Long-wavelength total transmittance; default (1 − R)² from n. */
	maxT?: number;
}

export interface EdgeModelParameters {
	/** Decadic internal absorbance per mm at edge50Nm. */
	absorbance50PerMm: number;
	/** Edge width w, nm per decade of absorption coefficient. */
	widthNmPerDecade: number;
	maxT: number;
}

/** Derives the edge-model parameters; RangeError naming the field when the edge is not physical. */
export function edgeModelParameters(edge: EdgeMaterial): EdgeModelParameters {
	const r = ((edge.n - 1) / (edge.n + 1)) ** 2;
	const maxT = edge.maxT ?? (1 - r) ** 2;
	if (!(edge.n >= 1)) throw new RangeError(`n must be ≥ 1, got ${edge.n}`);
	if (!(maxT > 0.5 && maxT <= 1)) throw new RangeError(`maxT must be in (0.5, 1], got ${maxT}`);
	if (!(edge.atThicknessMm > 0)) throw new RangeError(`atThicknessMm must be > 0, got ${edge.atThicknessMm}`);
	if (!(edge.edge10Nm > 0 && edge.edge50Nm > edge.edge10Nm)) {
		throw new RangeError(`edge50Nm (${edge.edge50Nm}) must exceed edge10Nm (${edge.edge10Nm}) > 0`);
	}
	const a50 = Math.log10(maxT / 0.5);
	const a10 = Math.log10(maxT / 0.1);
	return {
		absorbance50PerMm: a50 / edge.atThicknessMm,
		widthNmPerDecade: (edge.edge50Nm - edge.edge10Nm) / Math.log10(a10 / a50),
		maxT
	};
}

/**
 * Total transmittance (Fresnel included) of `thicknessMm` of an edge-model material on the uniform grid
 * fromNm + i·stepNm (Float64Array).
 */
export function edgeModelTransmissionOnGrid(edge: EdgeMaterial, thicknessMm: number, fromNm: number, stepNm: number, count: number): Float64Array {
	const { absorbance50PerMm, widthNmPerDecade, maxT } = edgeModelParameters(edge);
	const out = new Float64Array(count);
	const a = absorbance50PerMm * thicknessMm;
	for (let i = 0; i < count; i++) {
		const wl = fromNm + i * stepNm;
		out[i] = maxT * 10 ** (-a * 10 ** ((edge.edge50Nm - wl) / widthNmPerDecade));
	}
	return out;
}
