/**
 * Chemical actinometry: the photon flux entering an actinometer solution from the amount of photoproduct it formed.
 *
 * General form (IUPAC Technical Report "Chemical Actinometry", Kuhn, Braslavsky & Schmidt, Pure Appl. Chem. 76, 2105
 * (2004)), for a read-out by absorbance of a coloured complex of the photoproduct:
 *   n = V₁·V₃·ΔA/(10³·V₂·l·ε_read)             [mol; V₁ irradiated, V₂ aliquot, V₃ after complexation (mL); l cm]
 *   q = n/(Φ·t·f),  f = 1 − 10^(−A)            [einstein s⁻¹]
 * For a polychromatic lamp with normalised photon spectrum s(λ) entering the solution (∫s dλ = 1) the product formed is
 * n = q·t·∫s(λ)·f(λ)·Φ(λ) dλ, so q = n/(t·∫s·f·Φ dλ); we report Φ_used = ∫s·f·Φ/∫s·f and f_used = ∫s·f, which keeps
 * q = n/(Φ_used·t·f_used).
 * The actinometers and their tables are in actinometers.ts.
 */
import { ACTINOMETERS, actinometerById, strengthFor, tableValue, type Actinometer } from './actinometers';

export { ACTINOMETERS, actinometerById, FERROIN_EPSILON_510, type Actinometer } from './actinometers';

/** Largest ΔA of the read-out treated as linear (common practice for spectrophotometers). */
export const MAX_READOUT_DELTA_A = 2;

export interface ActinometryRun {
	actinometer: string;
	concentrationM: number;
	irradiatedVolumeMl: number;
	aliquotVolumeMl: number;
	finalVolumeMl: number;
	/** ΔA of the read-out (irradiated − dark) at the read-out wavelength. */
	deltaAbsorbance: number;
	/** Cell path of the read-out, cm (default 1). */
	readoutPathCm?: number;
	irradiationTimeS: number;
	/** Measured absorbance of the actinometer over the vessel path at the irradiation wavelength (else from its ε). */
	absorbanceAtIrradiation?: number;
	/** Inner path of the irradiation vessel, cm (for f from ε·c·l). */
	vesselPathCm: number;
	/** Overrides the tabulated Φ (a value the group has adopted). */
	quantumYield?: number;
}

/**
 * Photon spectrum entering the solution (any scale): einstein s⁻¹ nm⁻¹ on ascending wavelengths, discrete lines
 * (einstein s⁻¹ each), or one line.
 */
export type IncidentSpectrum =
	| { wavelengthNm: ArrayLike<number>; photonFluxPerNm: ArrayLike<number> }
	| { lines: readonly { wavelengthNm: number; photonFlux: number }[] }
	| { lineNm: number };

export interface ActinometryIssue { field: string; code: 'invalid' | 'physically-invalid'; message: string }

export interface ActinometryResult {
	actinometer: string;
	/** Moles of photoproduct (Fe²⁺ for ferrioxalate, NCS⁻ for Reinecke's salt). */
	molesProduct: number;
	quantumYieldUsed: number;
	fractionAbsorbed: number;
	photonFluxEinsteinPerS: number;
	/** Photon-weighted mean wavelength of the absorbed light, nm. */
	effectiveWavelengthNm: number;
	/** Share of the absorbed photons at wavelengths outside the Φ table (Φ held at the nearest tabulated value there). */
	outsideTableShare: number;
	/** Which Φ table and f were used, in words. */
	basis: string;
	warnings: string[];
}

export type ActinometryOutcome = { ok: true; value: ActinometryResult } | { ok: false; issues: ActinometryIssue[] };

const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/** Checks a run's numbers; each issue names its field (400 for non-numbers, 422 for impossible values). */
export function actinometryRunIssues(run: ActinometryRun): ActinometryIssue[] {
	const out: ActinometryIssue[] = [];
	const act = actinometerById(run.actinometer);
	if (!act) out.push({ field: 'actinometer', code: 'invalid', message: `actinometer: unknown actinometer “${run.actinometer}”; choose one of ${ACTINOMETERS.map((a) => a.id).join(', ')}` });
	const positive: [keyof ActinometryRun, string][] = [
		['concentrationM', 'concentration'], ['irradiatedVolumeMl', 'irradiated volume'], ['aliquotVolumeMl', 'aliquot volume'],
		['finalVolumeMl', 'final volume'], ['deltaAbsorbance', 'absorbance change'], ['irradiationTimeS', 'irradiation time'], ['vesselPathCm', 'vessel path']
	];
	for (const [f, what] of positive) {
		const v = run[f];
		if (!isNum(v)) out.push({ field: f, code: 'invalid', message: `${f}: the ${what} must be a number` });
		else if (v <= 0) out.push({ field: f, code: 'physically-invalid', message: `${f}: the ${what} must be above zero (got ${v})` });
	}
	for (const f of ['readoutPathCm', 'absorbanceAtIrradiation', 'quantumYield'] as const) {
		const v = run[f];
		if (v === undefined) continue;
		if (!isNum(v)) out.push({ field: f, code: 'invalid', message: `${f}: must be a number` });
		else if (v <= 0) out.push({ field: f, code: 'physically-invalid', message: `${f}: must be above zero (got ${v})` });
	}
	if (out.length) return out;
	if (run.aliquotVolumeMl > run.irradiatedVolumeMl) out.push({ field: 'aliquotVolumeMl', code: 'physically-invalid', message: `aliquotVolumeMl: the aliquot (${run.aliquotVolumeMl} mL) cannot exceed the irradiated volume (${run.irradiatedVolumeMl} mL)` });
	if (run.finalVolumeMl < run.aliquotVolumeMl) out.push({ field: 'finalVolumeMl', code: 'physically-invalid', message: `finalVolumeMl: the volume after complexation (${run.finalVolumeMl} mL) cannot be below the aliquot it contains (${run.aliquotVolumeMl} mL)` });
	if (run.deltaAbsorbance > MAX_READOUT_DELTA_A) out.push({ field: 'deltaAbsorbance', code: 'physically-invalid', message: `deltaAbsorbance: ΔA = ${run.deltaAbsorbance} is beyond the linear range of the read-out (≤ ${MAX_READOUT_DELTA_A}); dilute the aliquot further` });
	if (run.quantumYield !== undefined && run.quantumYield > 2) out.push({ field: 'quantumYield', code: 'physically-invalid', message: `quantumYield: Φ = ${run.quantumYield} is not plausible for ${act?.name ?? 'this actinometer'} (at most 2)` });
	if (act) {
		const strength = strengthFor(act, run.concentrationM);
		if (!strength) out.push({ field: 'concentrationM', code: 'physically-invalid', message: `concentrationM: Φ of ${act.name} is tabulated for ${act.strengths.map((s) => `${s.acceptM[0]}–${s.acceptM[1]} M`).join(' and ')}, not ${run.concentrationM} M` });
		else if (run.absorbanceAtIrradiation === undefined && !strength.epsilon) out.push({ field: 'absorbanceAtIrradiation', code: 'invalid', message: `absorbanceAtIrradiation: ${act.name} has no built-in ε table; measure its absorbance over the vessel path at the irradiation wavelength` });
	}
	return out;
}

/** Photon flux entering the solution from one actinometry run; bad input comes back as issues naming the field. */
export function computeActinometry(run: ActinometryRun, incident: IncidentSpectrum): ActinometryOutcome {
	const issues = actinometryRunIssues(run);
	if (issues.length) return { ok: false, issues };
	const act = actinometerById(run.actinometer) as Actinometer;
	const strength = strengthFor(act, run.concentrationM)!;
	const l = run.readoutPathCm ?? 1;
	const molesProduct = (run.irradiatedVolumeMl * run.finalVolumeMl * run.deltaAbsorbance) / (1e3 * run.aliquotVolumeMl * l * act.readout.epsilon);
	const fAt = (nm: number) => {
		const a = run.absorbanceAtIrradiation ?? tableValue(strength.epsilon!, nm, 'zero-above') * run.concentrationM * run.vesselPathCm;
		return -Math.expm1(-Math.LN10 * a); // 1 − 10^(−A)
	};
	const table = strength.quantumYield;
	const lo = table[0][0];
	const hi = table[table.length - 1][0];
	const phiAt = (nm: number) => run.quantumYield ?? tableValue(table, nm, 'clamp');
	// ∫s dλ, ∫s·f dλ, ∫s·f·Φ dλ, ∫s·f·λ dλ and ∫s·f outside the table, by the trapezoid rule on the spectrum's own points.
	let sum = 0, sf = 0, sfPhi = 0, sfL = 0, sfOut = 0;
	const add = (nm: number, s: number, w: number) => {
		const f = fAt(nm);
		sum += s * w;
		sf += s * f * w;
		sfPhi += s * f * phiAt(nm) * w;
		sfL += s * f * nm * w;
		if (nm < lo - 0.5 || nm > hi + 0.5) sfOut += s * f * w;
	};
	if ('lineNm' in incident) add(incident.lineNm, 1, 1);
	else if ('lines' in incident) for (const l of incident.lines) add(l.wavelengthNm, Math.max(0, l.photonFlux), 1);
	else {
		const x = incident.wavelengthNm;
		const q = incident.photonFluxPerNm;
		for (let i = 0; i < x.length; i++) {
			const w = ((i > 0 ? x[i] - x[i - 1] : 0) + (i < x.length - 1 ? x[i + 1] - x[i] : 0)) / 2;
			if (q[i] > 0 && w > 0) add(x[i], q[i], w);
		}
	}
	if (!(sum > 0)) return { ok: false, issues: [{ field: 'lampId', code: 'physically-invalid', message: 'lampId: the lamp sends no photons into the solution through this vessel wall' }] };
	if (!(sf / sum > 1e-4)) return { ok: false, issues: [{ field: 'actinometer', code: 'physically-invalid', message: `actinometer: ${act.name} (${strength.concentrationM} M) absorbs almost none of this lamp's light through this vessel; choose another actinometer or strength` }] };
	const outsideTableShare = sfOut / sf;
	if (run.quantumYield === undefined && outsideTableShare > 0.25) {
		return { ok: false, issues: [{ field: 'actinometer', code: 'physically-invalid', message: `actinometer: ${Math.round(outsideTableShare * 100)} % of the photons ${act.name} (${strength.concentrationM} M) absorbs from this lamp lie outside its Φ table (${lo}–${hi} nm); choose another strength or actinometer, or give quantumYield` }] };
	}
	const fractionAbsorbed = sf / sum;
	const quantumYieldUsed = sfPhi / sf;
	const warnings: string[] = [];
	if (outsideTableShare > 0.02 && run.quantumYield === undefined) warnings.push(`${Math.round(outsideTableShare * 100)} % of the absorbed photons lie outside the Φ table (${lo}–${hi} nm); Φ was held at the nearest tabulated value there.`);
	const conversion = molesProduct / ((run.concentrationM * run.irradiatedVolumeMl) / 1e3) // one product per actinometer molecule;
	if (conversion > 0.1) warnings.push(`About ${Math.round(conversion * 100)} % of the actinometer was converted; keep conversion below 10 % (shorter irradiation) so that its absorbance stays constant.`);
	if (run.absorbanceAtIrradiation !== undefined && !('lineNm' in incident) && !('lines' in incident && incident.lines.length === 1)) warnings.push('One measured absorbance was applied at every wavelength of the lamp; for a broad lamp the built-in ε table gives a wavelength-resolved fraction absorbed.');
	const fSource = run.absorbanceAtIrradiation !== undefined ? `measured A = ${run.absorbanceAtIrradiation}` : `ε table of ${strength.concentrationM} M ${act.name} over ${run.vesselPathCm} cm`;
	const phiSource = run.quantumYield !== undefined ? `Φ = ${run.quantumYield} given by the user` : `Φ(λ) ${strength.concentrationM} M: ${strength.source}`;
	return {
		ok: true,
		value: {
			actinometer: act.id,
			molesProduct,
			quantumYieldUsed,
			fractionAbsorbed,
			photonFluxEinsteinPerS: molesProduct / (quantumYieldUsed * run.irradiationTimeS * fractionAbsorbed),
			effectiveWavelengthNm: sfL / sf,
			outsideTableShare,
			basis: `${phiSource}; f from ${fSource}`,
			warnings
		}
	};
}
