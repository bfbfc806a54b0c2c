/**
 * Potassium ferrioxalate actinometry (Hatchard & Parker, Proc. R. Soc. A 235, 518 (1956); IUPAC
 * Technical Report "Chemical Actinometry", Kuhn, Braslavsky & Schmidt, Pure Appl. Chem. 76, 2105
 * (2004)):
 *   n(Fe²⁺) = V₁·V₃·ΔA(510)/(10³·V₂·l·ε₅₁₀)   [mol; V in mL, l in cm, ε₅₁₀ = 1.11 × 10⁴ M⁻¹ cm⁻¹]
 *   q_p = n(Fe²⁺)/(Φ_λ·t·(1 − 10^(−A_λ)))   [einstein s⁻¹]
 * V₁ irradiated volume, V₂ aliquot taken, V₃ volume after complexation with 1,10-phenanthroline.
 */

/** ε of [Fe(phen)₃]²⁺ at 510 nm, M⁻¹ cm⁻¹ (Hatchard & Parker 1956; IUPAC 2004). */
export const FERROIN_EPSILON_510 = 1.11e4;

export type FerrioxalateStrength = '0.006M' | '0.15M';

/**
 * Φ(Fe²⁺) tables as tabulated in the IUPAC 2004 report after Hatchard & Parker 1956 (from memory,
 * see REFERENCE.md §5.1), with the 365/366 nm values replaced by Lee & Seliger, J. Chem. Phys. 40,
 * 519 (1964): 1.26 (0.006 M) and 1.20 (0.15 M). 297/302 nm and 577/579 nm entries are placed at
 * their mean wavelength. Between entries Φ is interpolated linearly (common practice).
 */
export const FERRIOXALATE_QUANTUM_YIELD: Readonly<Record<FerrioxalateStrength, ReadonlyArray<readonly [number, number]>>> = {
	'0.006M': [[253.7, 1.25], [299.5, 1.24], [313, 1.24], [334, 1.23], [365, 1.26], [366, 1.26], [405, 1.14], [436, 1.11]],
	'0.15M': [[365, 1.2], [366, 1.2], [436, 1.01], [468, 0.93], [480, 0.94], [509, 0.86], [546, 0.15], [578, 0.013]]
};

/** Φ at `wavelengthNm` from the table, or undefined outside its range. */
export function ferrioxalateQuantumYield(wavelengthNm: number, strength: FerrioxalateStrength): number | undefined {
	const t = FERRIOXALATE_QUANTUM_YIELD[strength];
	if (!(wavelengthNm >= t[0][0] && wavelengthNm <= t[t.length - 1][0])) return undefined;
	for (let k = 1; k < t.length; k++) {
		const [x0, y0] = t[k - 1];
		const [x1, y1] = t[k];
		if (wavelengthNm <= x1) return y0 + ((y1 - y0) * (wavelengthNm - x0)) / (x1 - x0);
	}
	return t[t.length - 1][1];
}

export interface FerrioxalateInput {
	irradiatedVolumeMl: number; // V₁
	aliquotVolumeMl: number; // V₂
	finalVolumeMl: number; // V₃
	/** ΔA at 510 nm (irradiated − dark). */
	deltaAbsorbance510: number;
	/** Cell path for the 510 nm read-out, cm. */
	readoutPathCm: number;
	irradiationTimeS: number;
	/** Actinometer absorbance at the irradiation wavelength over the irradiation path. */
	absorbanceAtIrradiation: number;
	wavelengthNm: number;
	strength: FerrioxalateStrength;
	/** Overrides the table (e.g. a newer Φ the group has adopted). */
	quantumYield?: number;
}

export interface FerrioxalateResult {
	molesFe2: number;
	quantumYield: number;
	fractionAbsorbed: number;
	photonFluxEinsteinPerS: number;
}

export type ActinometryOutcome = { ok: true; value: FerrioxalateResult } | { ok: false; issues: { field: string; message: string }[] };

/** Photon flux from one ferrioxalate run; bad inputs come back as issues naming the field. */
export function ferrioxalatePhotonFlux(input: FerrioxalateInput): ActinometryOutcome {
	const issues: { field: string; message: string }[] = [];
	const positive: (keyof FerrioxalateInput)[] = ['irradiatedVolumeMl', 'aliquotVolumeMl', 'finalVolumeMl', 'deltaAbsorbance510', 'readoutPathCm', 'irradiationTimeS', 'absorbanceAtIrradiation', 'wavelengthNm'];
	for (const f of positive) {
		const v = input[f];
		if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) issues.push({ field: f, message: `${f} must be a positive number` });
	}
	if (input.strength !== '0.006M' && input.strength !== '0.15M') issues.push({ field: 'strength', message: "strength must be '0.006M' or '0.15M'" });
	if (input.quantumYield !== undefined && !(Number.isFinite(input.quantumYield) && input.quantumYield > 0)) {
		issues.push({ field: 'quantumYield', message: 'quantumYield must be a positive number' });
	}
	if (issues.length) return { ok: false, issues };
	if (input.aliquotVolumeMl > input.irradiatedVolumeMl) issues.push({ field: 'aliquotVolumeMl', message: 'the aliquot cannot exceed the irradiated volume' });
	const phi = input.quantumYield ?? ferrioxalateQuantumYield(input.wavelengthNm, input.strength);
	if (phi === undefined) {
		const t = FERRIOXALATE_QUANTUM_YIELD[input.strength];
		issues.push({ field: 'wavelengthNm', message: `no tabulated quantum yield for ${input.strength} ferrioxalate at ${input.wavelengthNm} nm (table covers ${t[0][0]}–${t[t.length - 1][0]} nm); give quantumYield` });
	}
	if (issues.length || phi === undefined) return { ok: false, issues };
	const molesFe2 = (input.irradiatedVolumeMl * input.finalVolumeMl * input.deltaAbsorbance510) / (1e3 * input.aliquotVolumeMl * input.readoutPathCm * FERROIN_EPSILON_510);
	const fractionAbsorbed = -Math.expm1(-Math.LN10 * input.absorbanceAtIrradiation); // 1 − 10^(−A)
	return { ok: true, value: { molesFe2, quantumYield: phi, fractionAbsorbed, photonFluxEinsteinPerS: molesFe2 / (phi * input.irradiationTimeS * fractionAbsorbed) } };
}
