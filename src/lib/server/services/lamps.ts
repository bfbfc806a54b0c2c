/**
 * Lamps: resolve the stored model (a measured spectrum id becomes its emission points), compute the emission on the
 * planner grid normalised to the optical power reaching the vessel (power × coupling factor), its photon flux
 * (CODATA 2018, REFERENCE.md §4), peak and the cautions for the bands it emits.
 */
import { cautionsForSpectrum, spectralBandShares } from '$lib/irradiation/cautions';
import {
	CAUTION_GRID,
	DEFAULT_LAMP_GRID,
	lampSpectrum,
	peakWavelengthNm,
	photonFluxSpectrum,
	totalPhotonFluxEinsteinPerS,
	type LampModel,
	type SpectralGrid
} from '$lib/irradiation/lamps';
import { findSpectrumById } from '$lib/server/db/spectra';
import { bufferToFloat64 } from '$lib/server/db/spectraBlobs';
import { ApiError } from '$lib/server/http';
import { canReadRow, membershipsOf } from '$lib/server/policy';
import type { LampModelInput } from '$lib/schemas/lamps';
import type { LampRow } from '$lib/server/db/lamps';

/** Turns an API lamp model into a physics model; a `spectrum` model loads a visible emission spectrum (422 otherwise). */
export async function resolveLampModel(model: LampModelInput, locals: App.Locals): Promise<LampModel> {
	if (model.type !== 'spectrum') return model as LampModel;
	const row = await findSpectrumById(model.spectrumId);
	const memberships = await membershipsOf(locals.user?.id);
	const visible =
		row && !row.deleted_at && canReadRow(locals.user, memberships, { ownerId: row.owner_id, groupId: Number(row.group_id), visibility: row.visibility });
	if (!row || !visible) throw new ApiError(422, 'unknown_spectrum', `model.spectrumId ${model.spectrumId} is not a spectrum you can see.`, { field: 'model.spectrumId' });
	if (row.kind !== 'emission') throw new ApiError(422, 'not_emission', `Spectrum ${model.spectrumId} is a ${row.kind} spectrum, not an emission spectrum.`, { field: 'model.spectrumId' });
	const x = bufferToFloat64(row.x_nm);
	const y = bufferToFloat64(row.y_normalised);
	// Measured emission: negative counts (baseline noise) carry no power.
	return { type: 'measured', wavelengthNm: Array.from(x), power: Array.from(y, (v) => Math.max(0, v)) };
}

/**
 * A warning when a measured emission spectrum sits on a flat floor (its lower quartile above 2 % of its peak):
 * typical of raw detector counts without dark subtraction. The floor is counted as light, so say so.
 */
export function emissionFloorWarning(model: LampModel): string | null {
	if (model.type !== 'measured' || model.power.length < 20) return null;
	const sorted = [...model.power].sort((a, b) => a - b);
	const max = sorted[sorted.length - 1];
	const floor = sorted[Math.floor(sorted.length / 4)];
	if (!(max > 0) || floor / max <= 0.02) return null;
	return `The measured emission sits on a flat floor of about ${Math.round((100 * floor) / max)} % of its peak across ${Math.round(model.wavelengthNm[0])}–${Math.round(model.wavelengthNm[model.wavelengthNm.length - 1])} nm (raw detector counts without dark subtraction?). The floor is counted as light; subtract the dark spectrum before uploading for a true photon flux.`;
}

/** Optical power reaching the vessel, W. */
export const vesselPowerW = (lamp: Pick<LampRow, 'powerW' | 'couplingFactor'>) => lamp.powerW * lamp.couplingFactor;

/** Emission, photon flux, peak, band shares and cautions of a lamp (model already resolved). */
export function describeLamp(model: LampModel, powerW: number, grid: SpectralGrid = DEFAULT_LAMP_GRID) {
	const spectrum = lampSpectrum(model, powerW, grid);
	const wide = lampSpectrum(model, powerW, CAUTION_GRID);
	return {
		spectrum,
		photonFluxPerNm: photonFluxSpectrum(spectrum),
		peakNm: peakWavelengthNm(spectrum),
		photonFluxEinsteinPerS: totalPhotonFluxEinsteinPerS(spectrum),
		bands: spectralBandShares(wide, 0.01),
		// the wide grid keeps VUV lines (185 nm Hg, 172 nm Xe₂*) that decide the ozone caution
		cautions: cautionsForSpectrum(wide, { lampType: model.type })
	};
}

/** A short human label of a model, e.g. "LED 450 nm, FWHM 20 nm". */
export function describeModel(model: LampModelInput): string {
	switch (model.type) {
		case 'led':
			return `LED ${model.peakNm} nm, FWHM ${model.fwhmNm} nm${model.shape === 'ohno' ? ' (Ohno shape)' : ''}`;
		case 'mercury-low-pressure':
			return `Low-pressure mercury${model.ozoneFree ? ', ozone-free envelope' : ''}`;
		case 'mercury-medium-pressure':
			return `Medium-pressure mercury${model.ozoneFree ? ', ozone-free envelope' : ''}`;
		case 'excimer':
			return `Excimer lamp (${model.emitter}*)`;
		case 'laser':
			return `Laser line ${model.lineNm} nm`;
		case 'blackbody':
			return `Blackbody ${model.temperatureK} K${model.fromNm || model.toNm ? ` (${model.fromNm ?? 190}–${model.toNm ?? 1100} nm)` : ''}`;
		case 'xenon':
			return 'Xenon-arc-like broadband (model)';
		case 'phosphor':
			return `Phosphor tube, peak ${model.peakNm} nm, FWHM ${model.fwhmNm} nm`;
		case 'spectrum':
			return `Measured emission spectrum #${model.spectrumId}`;
	}
}
