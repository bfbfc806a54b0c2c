/**
 * Photo-flow: residence time τ = V_R/F, photons per molecule, productivity and single-pass
 * conversion (PRODUCT.md; τ = V_reactor/flow is common practice, e.g. Cambié et al., Chem. Rev.
 * 116, 10276 (2016)). The irradiated reactor content is treated as the volume element: with light
 * spread evenly along the tube, a plug that spends τ in the reactor receives the same photons as a
 * batch of volume V_R irradiated for τ, so the batch kinetics of timeCourse.ts integrated over τ
 * give the single-pass conversion.
 */
import { conversionAfter, prepareKinetics, type KineticsInput } from './timeCourse';
import { trapezoidUniform } from './wavelengthGrid';

export interface FlowInput extends Omit<KineticsInput, 'volumeL' | 'amountMol'> {
	/** Irradiated reactor volume, mL. */
	reactorVolumeMl: number;
	/** Volumetric flow rate, mL min⁻¹. */
	flowRateMlPerMin: number;
}

export interface FlowResult {
	residenceTimeS: number;
	/** Photons entering the mixture per substrate molecule: q_in·τ/(c₀·V_R). */
	incidentPhotonsPerMolecule: number;
	/** Photons absorbed by the substrate per molecule at inlet composition: q_abs,S(0)·τ/(c₀·V_R). */
	absorbedPhotonsPerMolecule: number;
	/** Conversion reached in one pass, 0–1. */
	conversion: number;
	/** Product leaving the reactor, mol h⁻¹ = ν·c₀·F·X. */
	productivityMolPerH: number;
}

export interface FieldIssue {
	field: string;
	message: string;
}

export type FlowOutcome = { ok: true; value: FlowResult } | { ok: false; issues: FieldIssue[] };

/** Single-pass flow figures; invalid numbers come back as issues naming the field. */
export function computeFlow(input: FlowInput): FlowOutcome {
	const issues: FieldIssue[] = [];
	const positive = (field: keyof FlowInput, v: number) => {
		if (!(Number.isFinite(v) && v > 0)) issues.push({ field, message: `${field} must be a positive number (got ${v})` });
	};
	positive('reactorVolumeMl', input.reactorVolumeMl);
	positive('flowRateMlPerMin', input.flowRateMlPerMin);
	positive('substrateConcentrationM', input.substrateConcentrationM);
	positive('pathCm', input.pathCm);
	positive('quantumYield', input.quantumYield);
	if (issues.length) return { ok: false, issues };

	const volumeL = input.reactorVolumeMl / 1000;
	const flowLPerS = input.flowRateMlPerMin / 1000 / 60;
	const tau = volumeL / flowLPerS; // τ = V_R/F
	const kinetics = prepareKinetics({ ...input, volumeL });
	const n0 = kinetics.amountMol; // c₀·V_R, the substrate in the reactor at any moment
	const qIn = trapezoidUniform(input.photonFluxInMixturePerNm, input.stepNm);
	const conversion = conversionAfter(kinetics, tau);
	const nu = input.productPerSubstrate ?? 1;
	return {
		ok: true,
		value: {
			residenceTimeS: tau,
			incidentPhotonsPerMolecule: (qIn * tau) / n0,
			absorbedPhotonsPerMolecule: (kinetics.substrateAbsorbedFlux(0) * tau) / n0,
			conversion,
			productivityMolPerH: nu * input.substrateConcentrationM * flowLPerS * 3600 * conversion
		}
	};
}
