/**
 * Grid step for wavenumber data moved to nm. A constant Δν̃ maps to Δλ = λ²·Δν̃/1e7, finest at the
 * shortest wavelength; the step keeps that finest spacing (the file's resolution where it is best),
 * rounded down to 1, 2 or 5 × 10^k nm and coarsened so the grid has at most `maxPoints` points.
 */

/**
 * @param xNm - converted wavelengths (1e7/ν̃), ascending
 * @param maxPoints - upper bound on the grid length (default 20 000)
 */
export function wavenumberStepNm(xNm: Float64Array, maxPoints = 20000): number {
	let minGap = Infinity;
	for (let i = 1; i < xNm.length; i++) {
		const d = xNm[i] - xNm[i - 1];
		if (d > 0 && d < minGap) minGap = d;
	}
	const span = xNm[xNm.length - 1] - xNm[0];
	let step = Math.max(minGap, span / (maxPoints - 1));
	if (!Number.isFinite(step) || step <= 0) step = 1;
	const decade = 10 ** Math.floor(Math.log10(step));
	const m = step / decade;
	const nice = m >= 5 ? 5 : m >= 2 ? 2 : 1;
	let s = nice * decade;
	if (span / s > maxPoints - 1) s = (nice === 1 ? 2 : nice === 2 ? 5 : 10) * decade;
	return s;
}
