/**
 * What a person at a stated distance from a lamp receives: the lamp's spectral irradiance there and the times in which
 * the ICNIRP 2004 ultraviolet exposure limits are reached.
 *
 * Irradiance at distance d:
 * - measured: a radiometer reading E (W m⁻², the lamp's whole optical band) at d spreads over the lamp's own spectral
 *   shape: E(λ) = E · P(λ)/∫P dλ;
 * - otherwise a model from the emitted optical power P: a Lambertian emitter on its axis (LED chips and arrays, flat
 *   panels) gives E = P/(π d²); an isotropic point source (tubes, arcs, bulbs) gives E = P/(4π d²). Both hold in the
 *   far field (d several times the source size); reflectors, lenses and the near field give more — a model, said so.
 * Limits (ICNIRP, Health Phys. 87, 171–186 (2004); REFERENCE.md §7, values from memory there):
 * - actinic UV 180–400 nm: H_eff = ∫E(λ)S(λ)dλ · t ≤ 30 J m⁻² per 8 h day → t_max = 30 / E_eff;
 * - UV-A to the eye 315–400 nm, unweighted: ≤ 10 kJ m⁻² for t ≤ 1000 s, ≤ 10 W m⁻² for longer.
 * IEC 62471:2006 risk groups for the actinic UV (Exempt < 0.001, RG1 < 0.003, RG2 < 0.03 W m⁻² effective) and the UV-A
 * eye limit (Exempt < 10, RG1 < 33, RG2 < 100 W m⁻²) are quoted for orientation only: the standard assesses at its own
 * distances, not at the one stated here (REFERENCE.md §7, from memory).
 */
import { icnirpActinicWeighting } from './icnirp';
import { integrateSpectrum as integral, type EmissionSpectrum } from './spectrumIntegral';

export type IrradianceBasis = 'measured' | 'lambertian-model' | 'point-source-model';

export interface ExposureInput {
	/** Distance from the lamp's emitting surface to the person (eyes, hands), cm. */
	distanceCm: number;
	/** Radiometer reading at that distance over the lamp's whole optical band, W m⁻² (optional). */
	measuredIrradianceWPerM2?: number | null;
}

export interface ExposureAtDistance {
	distanceCm: number;
	basis: IrradianceBasis;
	/** How the irradiance was obtained, for the page. */
	basisLabel: string;
	/** Total irradiance at the distance, W m⁻². */
	irradianceWPerM2: number;
	/** ICNIRP actinic-weighted UV irradiance (180–400 nm), W m⁻² effective. */
	actinicEffectiveWPerM2: number;
	/** Time to reach 30 J m⁻² effective, s (null when no actinic UV). */
	actinicLimitS: number | null;
	/** Unweighted UV-A (315–400 nm) irradiance, W m⁻². */
	uvaWPerM2: number;
	/** Time to reach the UV-A eye limit, s (null when none: below 10 W m⁻², the long-exposure limit holds all day). */
	uvaLimitS: number | null;
	/** Unweighted 400–500 nm irradiance, W m⁻² (blue-light hazard needs the source's radiance: not assessed here). */
	blueWPerM2: number;
	/** IEC 62471 group the actinic UV and the UV-A eye values would fall in at this distance (orientation only). */
	actinicGroup: RiskGroup;
	uvaGroup: RiskGroup;
}

export type RiskGroup = 'exempt' | 'RG1' | 'RG2' | 'RG3';

/** 30 J m⁻² effective per 8 h day (ICNIRP 2004). */
export const ACTINIC_DAILY_LIMIT_J_M2 = 30;
/** UV-A to the eye: 10 kJ m⁻² up to 1000 s, then 10 W m⁻² (ICNIRP 2004). */
export const UVA_DOSE_LIMIT_J_M2 = 1e4;
export const UVA_LONG_LIMIT_W_M2 = 10;

const group = (v: number, limits: [number, number, number]): RiskGroup => (v < limits[0] ? 'exempt' : v < limits[1] ? 'RG1' : v < limits[2] ? 'RG2' : 'RG3');

/** Short form of each basis, for the number on a page. */
export const EXPOSURE_BASIS_SHORT: Record<IrradianceBasis, string> = {
	measured: 'measured (radiometer)',
	'lambertian-model': 'model: Lambertian emitter, E = P/(π d²)',
	'point-source-model': 'model: point source, E = P/(4π d²)'
};

/**
 * Geometry model for a lamp type when no measured irradiance is given: LEDs and lamps known only by a measured
 * spectrum (which may be an LED) get the Lambertian model, the more cautious of the two (4× the point source).
 */
export function irradianceModelFor(lampType: string | undefined): 'lambertian-model' | 'point-source-model' {
	return lampType === 'led' || lampType === 'spectrum' ? 'lambertian-model' : 'point-source-model';
}

/**
 * Exposure at `input.distanceCm` from a lamp whose emitted spectrum is `s` (W nm⁻¹, what the lamp itself emits).
 * Returns null for lasers (a beam: its class decides) and for a non-positive distance or a spectrum without power.
 */
export function exposureAtDistance(s: EmissionSpectrum, input: ExposureInput, lampType?: string): ExposureAtDistance | null {
	if (lampType === 'laser') return null;
	const d = input.distanceCm / 100;
	if (!(d > 0)) return null;
	const total = integral(s, 0, Infinity);
	if (!(total > 0)) return null;
	const measured = input.measuredIrradianceWPerM2;
	const basis: IrradianceBasis = measured != null && measured > 0 ? 'measured' : irradianceModelFor(lampType);
	const irradiance = basis === 'measured' ? measured! : basis === 'lambertian-model' ? total / (Math.PI * d * d) : total / (4 * Math.PI * d * d);
	const perW = irradiance / total; // W m⁻² at the distance per W emitted
	const actinic = integral(s, 180, 400, icnirpActinicWeighting) * perW;
	const uva = integral(s, 315, 400) * perW;
	const blue = integral(s, 400, 500) * perW;
	// above 10 W m⁻² the 10 kJ m⁻² dose is reached within 1000 s; at or below it the long-exposure limit holds all day
	const uvaLimitS = uva > UVA_LONG_LIMIT_W_M2 ? UVA_DOSE_LIMIT_J_M2 / uva : null;
	const where = `${input.distanceCm} cm`;
	return {
		distanceCm: input.distanceCm,
		basis,
		basisLabel:
			basis === 'measured'
				? `radiometer reading at ${where}, spread over the lamp's spectrum`
				: basis === 'lambertian-model'
					? `model: Lambertian emitter on its axis, E = P/(π d²) at ${where} from the emitted optical power; lenses, reflectors and the near field give more`
					: `model: isotropic point source, E = P/(4π d²) at ${where} from the emitted optical power; reflectors and the near field give more`,
		irradianceWPerM2: irradiance,
		actinicEffectiveWPerM2: actinic,
		actinicLimitS: actinic > 0 ? ACTINIC_DAILY_LIMIT_J_M2 / actinic : null,
		uvaWPerM2: uva,
		uvaLimitS,
		blueWPerM2: blue,
		actinicGroup: group(actinic, [0.001, 0.003, 0.03]),
		uvaGroup: group(uva, [10, 33, 100])
	};
}
