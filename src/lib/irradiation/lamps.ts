/**
 * Lamp emission spectra on a uniform wavelength grid, area-normalised to the optical power, and their
 * photon flux q(λ) = P(λ)·λ/(h·c·N_A) (einstein s⁻¹ nm⁻¹; CODATA 2018 constants).
 * Models and their parameters: lampModels/types.ts. Invalid parameters throw a RangeError whose message
 * starts with the field name (`fwhmNm: must be …`); use validateLampModel for a result value instead.
 */
import { HCNA_J_NM_PER_MOL } from './constants';
import { blackbodyShape, measuredShape, phosphorShape, xenonShape } from './lampModels/broadband';
import { gridWavelengths, normaliseToPower, trapezoidArea } from './lampModels/grid';
import { ledShape } from './lampModels/led';
import { excimerShape, laserShape, lineSourcePeakNm, mercuryShape } from './lampModels/lineSources';
import { DEFAULT_LAMP_GRID, type LampModel, type LampSpectrum, type ShapeOnGrid, type SpectralGrid } from './lampModels/types';
import { gridIssues, lampModelIssues } from './lampModels/validate';

export * from './lampModels/types';
export { validateLampModel, lampModelIssues } from './lampModels/validate';
export { EXCIMER_EMITTERS, OZONE_FREE_ENVELOPE_CUTOFF_NM } from './lampModels/lineSources';
export { OHNO_FWHM_PER_DELTA, ohnoShape } from './lampModels/led';

function shapeOf(model: LampModel, grid: SpectralGrid): ShapeOnGrid {
	switch (model.type) {
		case 'led': return ledShape(model, grid);
		case 'mercury-low-pressure':
		case 'mercury-medium-pressure': return mercuryShape(model, grid);
		case 'excimer': return excimerShape(model, grid);
		case 'laser': return laserShape(model, grid);
		case 'blackbody': return blackbodyShape(model, grid);
		case 'xenon': return xenonShape(grid);
		case 'phosphor': return phosphorShape(model, grid);
		case 'measured': return measuredShape(model, grid);
	}
}

/**
 * Emission spectrum of `model` carrying `powerW` watts of optical power in all (on and off `grid`) on `grid`
 * (default 190–1100 nm, 0.5 nm): ∫P dλ on the grid = powerW·(1 − outsideGridFraction). Use CAUTION_GRID (from 150 nm)
 * for safety checks.
 * @throws RangeError "<field>: <message>" for invalid parameters, power or grid.
 */
export function lampSpectrum(model: LampModel, powerW: number, grid: SpectralGrid = DEFAULT_LAMP_GRID): LampSpectrum {
	const issues = [...lampModelIssues(model), ...gridIssues(grid)];
	if (!(powerW >= 0) || !Number.isFinite(powerW)) issues.push({ field: 'powerW', message: 'must be a finite number ≥ 0' });
	if (issues.length > 0) throw new RangeError(issues.map((i) => `${i.field}: ${i.message}`).join('; '));
	const { powerWPerNm, outsideGridFraction } = normaliseToPower(shapeOf(model, grid), grid, powerW);
	return { wavelengthNm: gridWavelengths(grid), powerWPerNm, outsideGridFraction };
}

/** Spectral photon flux q(λ) = P(λ)·λ/(h·c·N_A), einstein s⁻¹ nm⁻¹, on the spectrum's grid. */
export function photonFluxSpectrum(spectrum: Pick<LampSpectrum, 'wavelengthNm' | 'powerWPerNm'>): Float64Array {
	const { wavelengthNm, powerWPerNm } = spectrum;
	const out = new Float64Array(wavelengthNm.length);
	for (let i = 0; i < out.length; i++) out[i] = (powerWPerNm[i] * wavelengthNm[i]) / HCNA_J_NM_PER_MOL;
	return out;
}

/** Total photon flux (einstein s⁻¹): trapezoid of q(λ) over a uniform grid. */
export function totalPhotonFluxEinsteinPerS(spectrum: Pick<LampSpectrum, 'wavelengthNm' | 'powerWPerNm'>): number {
	const x = spectrum.wavelengthNm;
	if (x.length < 2) return 0;
	return trapezoidArea(photonFluxSpectrum(spectrum), x[1] - x[0]);
}

/**
 * The lamp's peak wavelength (nm): for line sources (mercury, excimer, laser) the strongest line at its own wavelength
 * (253.652 nm for low-pressure Hg, not the grid point); for a measured spectrum the maximum of its own points; else the
 * grid point of largest spectral power.
 */
export function lampPeakNm(model: LampModel, spectrum: Pick<LampSpectrum, 'wavelengthNm' | 'powerWPerNm'>): number {
	if (model.type === 'mercury-low-pressure' || model.type === 'mercury-medium-pressure' || model.type === 'excimer' || model.type === 'laser') return lineSourcePeakNm(model);
	if (model.type === 'measured') {
		let best = 0;
		for (let i = 1; i < model.power.length; i++) if (model.power[i] > model.power[best]) best = i;
		return model.wavelengthNm[best];
	}
	if (model.type === 'led') return model.peakNm;
	return peakWavelengthNm(spectrum);
}

/** Wavelength (nm) of the largest spectral power (grid point; first one on ties). */
export function peakWavelengthNm(spectrum: Pick<LampSpectrum, 'wavelengthNm' | 'powerWPerNm'>): number {
	const p = spectrum.powerWPerNm;
	let best = 0;
	for (let i = 1; i < p.length; i++) if (p[i] > p[best]) best = i;
	return spectrum.wavelengthNm[best];
}
