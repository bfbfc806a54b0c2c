/**
 * ∫ w(λ)·P(λ) dλ of a piecewise-linear emission spectrum between two wavelengths (exact for w = 1; for a weight, the
 * trapezoid of w·P at the interval's ends). Shared by the band shares and cautions (cautions.ts) and the exposure at a
 * distance (exposure.ts).
 */
export interface EmissionSpectrum { wavelengthNm: ArrayLike<number>; powerWPerNm: ArrayLike<number> }

export function integrateSpectrum(s: EmissionSpectrum, fromNm: number, toNm: number, weight?: (nm: number) => number): number {
	const x = s.wavelengthNm;
	const p = s.powerWPerNm;
	let sum = 0;
	for (let i = 1; i < x.length; i++) {
		const a = Math.max(x[i - 1], fromNm);
		const b = Math.min(x[i], toNm);
		if (b <= a) continue;
		const at = (l: number) => (p[i - 1] + ((p[i] - p[i - 1]) * (l - x[i - 1])) / (x[i] - x[i - 1])) * (weight ? weight(l) : 1);
		sum += 0.5 * (at(a) + at(b)) * (b - a);
	}
	return sum;
}
