/**
 * ICNIRP 2004 actinic UV weighting S(λ) (ICNIRP, Health Phys. 87, 171–186 (2004), eqs 2a–2c), 210–400 nm:
 *   S = 0.959^(270 − λ)                          210 ≤ λ ≤ 270
 *   S = 1 − 0.36·((λ − 270)/20)^1.64              270 < λ ≤ 300
 *   S = 0.3·0.736^(λ − 300) + 10^(2 − 0.0163 λ)   300 < λ ≤ 400
 * Below 210 nm the guideline's tabulated values (180 nm 0.012, 190 0.019, 200 0.030, 205 0.051 — from memory)
 * are interpolated log-linearly up to the analytic value at 210 nm; S = 0 outside 180–400 nm.
 */

const TABLE_BELOW_210: readonly [number, number][] = [[180, 0.012], [190, 0.019], [200, 0.03], [205, 0.051], [210, 0.959 ** 60]];

/** Relative actinic effectiveness S(λ), 1 at 270 nm; wavelength in nm. */
export function icnirpActinicWeighting(wavelengthNm: number): number {
	const l = wavelengthNm;
	if (!(l >= 180) || l > 400) return 0;
	if (l < 210) {
		for (let i = 1; i < TABLE_BELOW_210.length; i++) {
			const [x1, y1] = TABLE_BELOW_210[i];
			if (l <= x1) {
				const [x0, y0] = TABLE_BELOW_210[i - 1];
				return Math.exp(Math.log(y0) + ((l - x0) / (x1 - x0)) * (Math.log(y1) - Math.log(y0)));
			}
		}
	}
	if (l <= 270) return 0.959 ** (270 - l);
	if (l <= 300) return 1 - 0.36 * ((l - 270) / 20) ** 1.64;
	return 0.3 * 0.736 ** (l - 300) + 10 ** (2 - 0.0163 * l);
}

/**
 * Effective actinic fraction of a spectrum between fromNm and toNm: ∫P·S dλ / ∫P dλ (whole spectrum in the
 * denominator), trapezoid on the spectrum's grid.
 */
export function actinicEffectiveFraction(
	wavelengthNm: ArrayLike<number>, powerWPerNm: ArrayLike<number>, fromNm = 180, toNm = 400
): number {
	let weighted = 0;
	let total = 0;
	for (let i = 1; i < wavelengthNm.length; i++) {
		const h = wavelengthNm[i] - wavelengthNm[i - 1];
		total += ((powerWPerNm[i] + powerWPerNm[i - 1]) / 2) * h;
		const a = wavelengthNm[i - 1];
		const b = wavelengthNm[i];
		if (b <= fromNm || a >= toNm) continue;
		const wa = a >= fromNm ? icnirpActinicWeighting(a) * powerWPerNm[i - 1] : 0;
		const wb = b <= toNm ? icnirpActinicWeighting(b) * powerWPerNm[i] : 0;
		weighted += ((wa + wb) / 2) * h;
	}
	return total > 0 ? weighted / total : 0;
}
