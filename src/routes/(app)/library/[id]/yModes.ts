/**
 * Display quantities for the detail plot, from the stored unit: ε, log ε, absorbance, %T.
 * Beer–Lambert A = ε·c·l; %T = 100·10^(−A); A = −log10 T (IUPAC Gold Book, "absorbance").
 */
export type YMode = 'epsilon' | 'logEpsilon' | 'absorbance' | 'percentT' | 'raw';

export const Y_LABELS: Record<YMode, string> = {
	epsilon: 'ε (M⁻¹ cm⁻¹)',
	logEpsilon: 'log₁₀(ε / M⁻¹ cm⁻¹)',
	absorbance: 'absorbance A',
	percentT: 'transmittance (%)',
	raw: 'relative emission'
};

/** The modes a stored spectrum can be shown in. `cl` = concentration × path (M cm) when known. */
export function modesFor(yUnit: string, cl: number | null): YMode[] {
	if (yUnit === 'epsilon') return cl ? ['epsilon', 'logEpsilon', 'absorbance', 'percentT'] : ['epsilon', 'logEpsilon'];
	if (yUnit === 'absorbance') return cl ? ['absorbance', 'percentT', 'epsilon', 'logEpsilon'] : ['absorbance', 'percentT'];
	if (yUnit === 'transmittance') return ['percentT', 'absorbance'];
	return ['raw'];
}

/** Converts stored values to a display mode (null where undefined, e.g. log of ε ≤ 0). */
export function convertY(y: number[], yUnit: string, mode: YMode, cl: number | null): (number | null)[] {
	const toA = (v: number) => (yUnit === 'epsilon' ? v * (cl ?? NaN) : yUnit === 'transmittance' ? (v > 0 ? -Math.log10(v) : NaN) : v);
	const toEps = (v: number) => (yUnit === 'epsilon' ? v : v / (cl ?? NaN));
	const f = (v: number): number => {
		switch (mode) {
			case 'epsilon':
				return toEps(v);
			case 'logEpsilon':
				return toEps(v) > 0 ? Math.log10(toEps(v)) : NaN;
			case 'absorbance':
				return toA(v);
			case 'percentT':
				return yUnit === 'transmittance' ? 100 * v : 100 * 10 ** -toA(v);
			default:
				return v;
		}
	};
	return y.map((v) => {
		const r = f(v);
		return Number.isFinite(r) ? r : null;
	});
}
