/**
 * The chemical actinometers the app knows: Φ(λ) tables with their sources, the read-out (complex, wavelength, ε) and,
 * where available, the actinometer's own ε(λ) for the fraction it absorbs. Between table entries values are
 * interpolated linearly (common practice).
 */

/** ε of [Fe(phen)₃]²⁺ at 510 nm, M⁻¹ cm⁻¹ (Hatchard & Parker 1956; IUPAC 2004; REFERENCE.md §5.1, from memory). */
export const FERROIN_EPSILON_510 = 1.11e4;
/** ε of the Fe(III)–thiocyanate complex at 450 nm, M⁻¹ cm⁻¹ (Wegner & Adamson 1966; REFERENCE.md §5.2, from memory). */
export const FE_THIOCYANATE_EPSILON_450 = 4.3e3;

export type Table = ReadonlyArray<readonly [number, number]>;

export interface ActinometerStrength {
	concentrationM: number;
	/** Concentrations this strength's Φ table may be used for, M. */
	acceptM: [number, number];
	quantumYield: Table;
	source: string;
	/** ε(λ) of the actinometer itself, M⁻¹ cm⁻¹ (0 above the last entry); absent: the user must measure A. */
	epsilon?: Table;
	epsilonSource?: string;
}

export interface Actinometer {
	id: string;
	name: string;
	/** Wavelength range the Φ tables cover, nm. */
	rangeNm: [number, number];
	readout: { species: string; wavelengthNm: number; epsilon: number; source: string };
	strengths: ActinometerStrength[];
	procedure: string;
	cautions: string;
}

const FERRIOXALATE_SOURCE_006 =
	'IUPAC 2004 technical report table after Hatchard & Parker, Proc. R. Soc. A 235, 518 (1956) (from memory, REFERENCE.md §5.1); 365/366 nm: Lee & Seliger, J. Chem. Phys. 40, 519 (1964), 1.26 ± 0.03 (verified)';
const FERRIOXALATE_SOURCE_015 =
	'IUPAC 2004 technical report table after Hatchard & Parker 1956 (from memory, REFERENCE.md §5.1); 365/366 nm: Lee & Seliger 1964, 1.20 ± 0.03 (verified)';
/**
 * Approximate decadic ε(λ) of tris(oxalato)ferrate(III) in 0.05 M H₂SO₄, M⁻¹ cm⁻¹ (from memory, read off the absorption
 * curve reproduced in handbooks after Hatchard & Parker 1956). Good to a factor of about 1.5: use it only where A ≫ 1
 * or as a first estimate, and give the measured absorbance where the solution does not absorb nearly everything.
 */
const FERRIOXALATE_EPSILON: Table = [
	[250, 5500], [300, 2800], [313, 2200], [334, 1500], [365, 240], [405, 90], [436, 30], [468, 8], [480, 5.5], [509, 2], [546, 0.5], [578, 0.15]
];
const FERRIOXALATE_EPSILON_SOURCE = 'approximate, from memory (handbook absorption curve after Hatchard & Parker 1956); measure A for a precise f';

export const ACTINOMETERS: readonly Actinometer[] = [
	{
		id: 'ferrioxalate',
		name: 'potassium ferrioxalate',
		rangeNm: [253.7, 578],
		readout: { species: '[Fe(phen)₃]²⁺ (1,10-phenanthroline complex of Fe²⁺)', wavelengthNm: 510, epsilon: FERROIN_EPSILON_510, source: 'Hatchard & Parker 1956; IUPAC 2004 (from memory, REFERENCE.md §5.1)' },
		strengths: [
			{
				concentrationM: 0.006,
				acceptM: [0.0054, 0.0066],
				// 297/302 nm entry placed at 299.5 nm; 365 and 366 nm: Lee & Seliger.
				quantumYield: [[253.7, 1.25], [299.5, 1.24], [313, 1.24], [334, 1.23], [365, 1.26], [366, 1.26], [405, 1.14], [436, 1.11]],
				source: FERRIOXALATE_SOURCE_006,
				epsilon: FERRIOXALATE_EPSILON,
				epsilonSource: FERRIOXALATE_EPSILON_SOURCE
			},
			{
				concentrationM: 0.15,
				acceptM: [0.135, 0.165],
				// 577/579 nm entry placed at 578 nm.
				quantumYield: [[365, 1.2], [366, 1.2], [436, 1.01], [468, 0.93], [480, 0.94], [509, 0.86], [546, 0.15], [578, 0.013]],
				source: FERRIOXALATE_SOURCE_015,
				epsilon: FERRIOXALATE_EPSILON,
				epsilonSource: FERRIOXALATE_EPSILON_SOURCE
			}
		],
		procedure: 'IUPAC 2004: irradiate V₁ of actinometer in the vessel; take V₂, add 1,10-phenanthroline and buffer, dilute to V₃; read ΔA at 510 nm against a dark sample. Work under red light; keep conversion below 10 %.',
		cautions: 'Oxalates are toxic; Fe(III) solutions in H₂SO₄ are corrosive. Prepare and handle in dim red light.'
	},
	{
		id: 'reinecke',
		name: "Reinecke's salt",
		rangeNm: [316, 600],
		readout: { species: 'Fe(III)–thiocyanate complex of the released NCS⁻', wavelengthNm: 450, epsilon: FE_THIOCYANATE_EPSILON_450, source: 'Wegner & Adamson, J. Am. Chem. Soc. 88, 394 (1966) (from memory, REFERENCE.md §5.2)' },
		strengths: [
			{
				concentrationM: 0.015,
				acceptM: [0.005, 0.05],
				// Φ(NCS⁻ release) ≈ 0.27–0.31 over 316–600 nm, ≈ 0.29–0.30 at 450–520 nm (REFERENCE.md §5.2, from memory).
				quantumYield: [[316, 0.27], [350, 0.29], [392, 0.29], [416, 0.3], [452, 0.3], [504, 0.29], [520, 0.29], [545, 0.29], [585, 0.27], [600, 0.27]],
				source: 'Wegner & Adamson, J. Am. Chem. Soc. 88, 394 (1966), as listed in the IUPAC 2004 report (from memory; REFERENCE.md §5.2 range 0.27–0.31)'
			}
		],
		procedure: 'Irradiate V₁ of the solution (pH 5.3–5.5); take V₂, add Fe(NO₃)₃ in HClO₄, dilute to V₃ and read ΔA at 450 nm against a dark control kept for the same time (thermal aquation). Measure the solution’s absorbance at the irradiation wavelength over the vessel path.',
		cautions: 'Releases thiocyanate; perchloric acid is a strong oxidiser. Keep solutions cold and dark until use.'
	}
];

export function actinometerById(id: string): Actinometer | undefined {
	return ACTINOMETERS.find((a) => a.id === id);
}

/** Linear interpolation in a table; outside it: the nearest end value ('clamp') or 0 above / first value below ('zero-above'). */
export function tableValue(t: Table, x: number, outside: 'clamp' | 'zero-above'): number {
	if (x <= t[0][0]) return t[0][1];
	if (x >= t[t.length - 1][0]) return outside === 'clamp' || x === t[t.length - 1][0] ? t[t.length - 1][1] : 0;
	for (let k = 1; k < t.length; k++) {
		const [x1, y1] = t[k];
		if (x <= x1) {
			const [x0, y0] = t[k - 1];
			return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
		}
	}
	return t[t.length - 1][1];
}

/** The strength whose Φ table applies at `concentrationM`, if any. */
export function strengthFor(act: Actinometer, concentrationM: number): ActinometerStrength | undefined {
	return act.strengths.find((s) => concentrationM >= s.acceptM[0] && concentrationM <= s.acceptM[1]);
}
