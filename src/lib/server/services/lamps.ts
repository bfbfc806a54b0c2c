/**
 * Lamps: resolve the stored model (a measured spectrum id becomes its emission points), compute the emission on the
 * planner grid normalised to the optical power reaching the vessel (power × coupling factor), its photon flux
 * (CODATA 2018, REFERENCE.md §4), peak and the cautions for the bands it emits.
 */
import { cautionsForSpectrum, spectralBandShares } from '$lib/irradiation/cautions';
import { exposureAtDistance, type ExposureInput } from '$lib/irradiation/exposure';
import {
	CAUTION_GRID,
	DEFAULT_LAMP_GRID,
	lampPeakNm,
	lampSpectrum,
	photonFluxSpectrum,
	totalPhotonFluxEinsteinPerS,
	type LampModel,
	type SpectralGrid
} from '$lib/irradiation/lamps';
import { measuredEmissionShape, type FloorChoice, type FloorEstimate } from '$lib/irradiation/lampModels/measuredEmission';
import { findSpectrumById } from '$lib/server/db/spectra';
import { bufferToFloat64 } from '$lib/server/db/spectraBlobs';
import { ApiError } from '$lib/server/http';
import { canReadRow, membershipsOf } from '$lib/server/policy';
import type { LampModelInput } from '$lib/schemas/lamps';
import type { LampRow } from '$lib/server/db/lamps';

/** A resolved lamp model; for a measured spectrum also how its units and floor were handled. */
export interface ResolvedLamp {
	model: LampModel;
	emission?: { spectrumId: number; spectrumName: string; yUnit: string; xUnit: string; quantity: 'power' | 'photon'; floor: FloorEstimate; floorChoice: FloorChoice; warnings: string[] };
}

/**
 * Turns an API lamp model into a physics model; a `spectrum` model loads a visible emission spectrum (422 otherwise) from
 * its original points and units: photon units and counts stay photon spectra, the axis Jacobian is applied for cm⁻¹/eV,
 * a raw-count dark floor is removed unless `floor: 'keep'` (lampModels/measuredEmission.ts).
 */
export async function resolveLamp(model: LampModelInput, locals: App.Locals): Promise<ResolvedLamp> {
	if (model.type !== 'spectrum') return { model: model as LampModel };
	const row = await findSpectrumById(model.spectrumId);
	const memberships = await membershipsOf(locals.user?.id);
	const visible =
		row && !row.deleted_at && canReadRow(locals.user, memberships, { ownerId: row.owner_id, groupId: Number(row.group_id), visibility: row.visibility });
	if (!row || !visible) throw new ApiError(422, 'unknown_spectrum', `model.spectrumId ${model.spectrumId} is not a spectrum you can see.`, { field: 'model.spectrumId' });
	if (row.kind !== 'emission') throw new ApiError(422, 'not_emission', `Spectrum ${model.spectrumId} is a ${row.kind} spectrum, not an emission spectrum.`, { field: 'model.spectrumId' });
	// The importers may store photon units under y_unit or only under y_unit_original: either names the quantity.
	const yUnit = [row.y_unit_original, row.y_unit].find((u) => u && u !== 'relative') ?? 'relative';
	const shape = measuredEmissionShape({ x: bufferToFloat64(row.x_original), y: bufferToFloat64(row.y_original), xUnit: row.x_unit_original, yUnit, floor: model.floor });
	if (shape.wavelengthNm.length < 2 || !shape.power.some((v) => v > 0)) {
		throw new ApiError(422, 'empty_emission', `Spectrum ${model.spectrumId} has no emission left above its floor.`, { field: 'model.spectrumId' });
	}
	return {
		model: { type: 'measured', wavelengthNm: shape.wavelengthNm, power: shape.power },
		emission: { spectrumId: Number(row.id), spectrumName: row.name, yUnit, xUnit: row.x_unit_original, quantity: shape.quantity, floor: shape.floor, floorChoice: model.floor ?? (yUnit === 'counts' ? 'remove' : 'keep'), warnings: shape.warnings }
	};
}

/** The physics model alone (see resolveLamp). */
export async function resolveLampModel(model: LampModelInput, locals: App.Locals): Promise<LampModel> {
	return (await resolveLamp(model, locals)).model;
}

/** Optical power reaching the vessel, W (nameplate power × coupling factor; the model basis without a calibration). */
export const vesselPowerW = (lamp: Pick<LampRow, 'powerW' | 'couplingFactor'>) => lamp.powerW * lamp.couplingFactor;

/**
 * Emission, photon flux, peak, band shares and cautions of a lamp (model already resolved). The spectrum and photon flux
 * are at `powerW` (the power reaching the vessel); bands and cautions come from what the lamp itself emits,
 * `emittedPowerW` (default powerW) — a coupling factor never removes a caution.
 */
export function describeLamp(model: LampModel, powerW: number, grid: SpectralGrid = DEFAULT_LAMP_GRID, emittedPowerW = powerW, exposure: ExposureInput | null = null) {
	const spectrum = lampSpectrum(model, powerW, grid);
	const wide = lampSpectrum(model, emittedPowerW, CAUTION_GRID);
	return {
		spectrum,
		photonFluxPerNm: photonFluxSpectrum(spectrum),
		peakNm: lampPeakNm(model, spectrum),
		photonFluxEinsteinPerS: totalPhotonFluxEinsteinPerS(spectrum),
		bands: spectralBandShares(wide, 0.01),
		// the wide grid keeps VUV lines (185 nm Hg, 172 nm Xe₂*) that decide the ozone caution
		cautions: cautionsForSpectrum(wide, { lampType: model.type, exposure }),
		exposure: exposure ? exposureAtDistance(wide, exposure, model.type) : null
	};
}

/** The lamp's stated exposure distance and radiometer reading there, when a distance is stated. */
export const exposureOf = (lamp: Pick<LampRow, 'exposureDistanceCm' | 'exposureIrradianceWPerM2'>): ExposureInput | null =>
	lamp.exposureDistanceCm ? { distanceCm: lamp.exposureDistanceCm, measuredIrradianceWPerM2: lamp.exposureIrradianceWPerM2 } : null;

/** A short human label of a model, e.g. "LED 450 nm, FWHM 20 nm". */
export function describeModel(model: LampModelInput): string {
	switch (model.type) {
		case 'led':
			return `LED ${model.peakNm} nm, FWHM ${model.fwhmNm} nm${model.shape === 'ohno' ? ' (Ohno shape)' : ''}`;
		case 'mercury-low-pressure':
			return `Low-pressure mercury${model.ozoneFree ? ', ozone-free envelope' : model.powerWithout185nm ? ', power given without the 185 nm line' : ', power including the 185 nm line'}`;
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
			return `Measured emission spectrum #${model.spectrumId}${model.floor === 'keep' ? ', floor kept' : ''}`;
	}
}

/**
 * Preview of a lamp before it is saved: its spectrum on a 1 nm plot grid, photon flux, peak, bands and cautions; for a
 * measured spectrum also the curve with its floor kept, so that the user sees what the floor removal does.
 */
export async function previewLamp(model: LampModelInput, powerW: number, couplingFactor: number, locals: App.Locals, exposure: ExposureInput | null = null) {
	const resolved = await resolveLamp(model, locals);
	const d = describeLamp(resolved.model, powerW * couplingFactor, DEFAULT_LAMP_GRID, powerW, exposure);
	const pick = (a: ArrayLike<number>) => Array.from({ length: Math.ceil(a.length / 2) }, (_, k) => a[2 * k]);
	const x = pick(d.spectrum.wavelengthNm);
	const norm = (a: number[]) => {
		const m = Math.max(...a);
		return a.map((v) => (m > 0 ? Math.round((v / m) * 1e5) / 1e5 : 0));
	};
	let kept: number[] | null = null;
	if (model.type === 'spectrum' && resolved.emission?.floor.removed) {
		const raw = await resolveLamp({ ...model, floor: 'keep' }, locals);
		kept = norm(pick(lampSpectrum(raw.model, 1, DEFAULT_LAMP_GRID).powerWPerNm));
	}
	return {
		x,
		power: norm(pick(d.spectrum.powerWPerNm)),
		kept,
		peakNm: d.peakNm,
		photonFluxEinsteinPerS: d.photonFluxEinsteinPerS,
		bands: d.bands.map((b) => ({ band: b.band, fromNm: b.fromNm, toNm: b.toNm, fraction: b.fraction })),
		cautions: d.cautions,
		exposure: d.exposure,
		emission: resolved.emission ?? null
	};
}
