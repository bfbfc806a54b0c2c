/**
 * Using a lamp calibration in the planner. A calibration (actinometry or a radiometer reading) measures Q_cal, the photon
 * flux entering the solution through the calibration vessel's wall W_cal. The lamp model gives only the spectral shape
 * q_m(λ) outside any wall. The planner's flux outside the wall is then k·q_m(λ) with
 *   k = Q_cal / ∫ q_m(λ)·T_cal(λ) dλ,
 * so that the same wall lets exactly Q_cal into the solution (the wall is applied once, by the planner), and another
 * wall W lets in Q_cal · ∫q_m·T_W dλ / ∫q_m·T_cal dλ — the ratio of the two walls' transmissions weighted by the lamp's
 * photon spectrum. Trapezoid rule on a uniform grid.
 */
import { HCNA_J_NM_PER_MOL } from './constants';

/** ∫ q(λ)·T(λ) dλ on a uniform grid (T omitted: 1). */
export function transmittedPhotonFlux(photonFluxPerNm: ArrayLike<number>, wallTransmission: ArrayLike<number> | undefined, stepNm: number): number {
	const n = photonFluxPerNm.length;
	let s = 0;
	for (let i = 0; i < n; i++) {
		const v = photonFluxPerNm[i] * (wallTransmission ? wallTransmission[i] : 1);
		s += i === 0 || i === n - 1 ? v / 2 : v;
	}
	return s * stepNm;
}

/** Photon-spectrum-weighted transmission ⟨T⟩ = ∫q·T dλ/∫q dλ (0 when the lamp emits nothing). */
export function weightedWallTransmission(photonFluxPerNm: ArrayLike<number>, wallTransmission: ArrayLike<number>, stepNm: number): number {
	const all = transmittedPhotonFlux(photonFluxPerNm, undefined, stepNm);
	return all > 0 ? transmittedPhotonFlux(photonFluxPerNm, wallTransmission, stepNm) / all : 0;
}

export interface CalibratedFlux {
	/** Photon flux per nm outside the wall that reproduces the calibration, einstein s⁻¹ nm⁻¹. */
	photonFluxPerNm: Float64Array;
	/** k of the module comment. */
	scale: number;
}

/**
 * The planner's lamp photon flux per nm (outside the wall) from a calibrated flux entering the solution through the
 * calibration wall. RangeError when the model sends nothing through that wall.
 */
export function calibratedPhotonFluxPerNm(
	modelPhotonFluxPerNm: ArrayLike<number>, calibrationWallTransmission: ArrayLike<number>, calibratedEinsteinPerS: number, stepNm: number
): CalibratedFlux {
	const through = transmittedPhotonFlux(modelPhotonFluxPerNm, calibrationWallTransmission, stepNm);
	if (!(through > 0)) throw new RangeError('calibration: the lamp model sends no photons through the calibration wall');
	const scale = calibratedEinsteinPerS / through;
	const out = new Float64Array(modelPhotonFluxPerNm.length);
	for (let i = 0; i < out.length; i++) out[i] = modelPhotonFluxPerNm[i] * scale;
	return { photonFluxPerNm: out, scale };
}

/** ∫q·T_B / ∫q·T_A: what changing wall A for wall B does to the photon flux entering the solution. */
export function wallRatio(photonFluxPerNm: ArrayLike<number>, wallA: ArrayLike<number>, wallB: ArrayLike<number>, stepNm: number): number {
	const a = transmittedPhotonFlux(photonFluxPerNm, wallA, stepNm);
	return a > 0 ? transmittedPhotonFlux(photonFluxPerNm, wallB, stepNm) / a : 0;
}

/**
 * Radiometer (thermopile or other spectrally flat power meter) reading P at the vessel position, in front of the wall:
 * photon flux entering the solution = P · ∫P_m(λ)·λ/(hcN_A)·T(λ) dλ / ∫P_m(λ) dλ, with P_m the lamp model's spectral
 * power on a uniform grid (CODATA 2018 constants; REFERENCE.md §4).
 */
export function radiometerPhotonFlux(opticalPowerW: number, wavelengthNm: ArrayLike<number>, modelPowerWPerNm: ArrayLike<number>, wallTransmission: ArrayLike<number>, stepNm: number): number {
	const n = wavelengthNm.length;
	let p = 0;
	let q = 0;
	for (let i = 0; i < n; i++) {
		const w = i === 0 || i === n - 1 ? 0.5 : 1;
		p += w * modelPowerWPerNm[i];
		q += (w * modelPowerWPerNm[i] * wavelengthNm[i] * wallTransmission[i]) / HCNA_J_NM_PER_MOL;
	}
	if (!(p > 0)) throw new RangeError('opticalPowerW: the lamp model emits no power to convert');
	return (opticalPowerW * q * stepNm) / (p * stepNm);
}
