/**
 * Puts the Window finder's ingredients on the 0.5 nm computation grid (PRODUCT.md): species ε from library spectra,
 * solvent absorbance per cm (measured spectrum when linked, else the cut-off edge model), wall transmission at the
 * chosen thickness, lamp photon flux per nm (from the latest calibration when one exists: lampCalibrations.ts).
 */
import { COMPUTATION_GRID, resampleOnto } from '$lib/irradiation/wavelengthGrid';
import { wallTransmissionOnGrid } from '$lib/irradiation/walls';
import { getSolvent } from '$lib/server/db/solvents';
import { getWallMaterial } from '$lib/server/db/wallMaterials';
import { findLamp, listLamps } from '$lib/server/db/lamps';
import type { SpectrumRow } from '$lib/server/db/spectra';
import { bufferToFloat64 } from '$lib/server/db/spectraBlobs';
import { ApiError } from '$lib/server/http';
import { plannerPhotonFlux } from './lampCalibrations';
import { describeLamp, exposureOf, resolveLampModel, vesselPowerW } from './lamps';
import { solventCurveOnGrid } from './solventLink';
import { visibleSpectrum, type Caller } from './spectraAccess';

export const GRID = COMPUTATION_GRID;

const unprocessable = (field: string, message: string) => new ApiError(422, 'invalid', message, { field });

/**
 * Decadic molar absorptivity ε (M⁻¹ cm⁻¹) of an absorption spectrum on the grid. Stored ε is used as is; stored
 * absorbance becomes ε = A/(c·l) with the measured concentration and path (Beer–Lambert). Outside the measured range ε = 0.
 */
export function epsilonOnGrid(row: SpectrumRow, field: string): Float64Array {
	if (row.kind !== 'absorption') throw unprocessable(field, `Spectrum ${row.id} (“${row.name}”) is a ${row.kind} spectrum; an absorber needs an absorption spectrum.`);
	const x = bufferToFloat64(row.x_nm);
	const y = bufferToFloat64(row.y_normalised);
	let scale = 1;
	if (row.y_unit !== 'epsilon') {
		const c = Number(row.concentration_m);
		const l = Number(row.path_cm);
		if (!(c > 0 && l > 0)) {
			throw unprocessable(field, `Spectrum ${row.id} (“${row.name}”) is stored as absorbance without concentration and path, so ε is unknown: add them to its metadata.`);
		}
		scale = 1 / (c * l);
	}
	const eps = resampleOnto(x, y, GRID, 0);
	for (let i = 0; i < eps.length; i++) eps[i] = Math.max(0, eps[i] * scale);
	return eps;
}

/** Loads a spectrum the caller may see (404 otherwise, as API.md asks) and returns it with ε on the grid. */
export async function absorberOnGrid(locals: App.Locals, spectrumId: number, field: string) {
	const { row } = await visibleSpectrum(locals, String(spectrumId));
	if (row.deleted_at) throw new ApiError(404, 'not_found', 'No such spectrum.', { field });
	return { row, epsilon: epsilonOnGrid(row, field) };
}

/** Solvent absorbance per cm on the grid and how it was obtained. */
export async function solventOnGrid(solventId: number, field = 'solvent.id') {
	const s = await getSolvent(solventId);
	if (!s) throw unprocessable(field, `${field}: no solvent with id ${solventId}.`);
	// measured Library spectrum when the solvent is linked to one, else the cut-off edge model (services/solventLink.ts)
	const curve = await solventCurveOnGrid(s, GRID);
	return { solvent: s, absorbancePerCm: curve.absorbancePerCm, basis: curve.basis, spectrumId: curve.spectrumId, spectrumName: curve.spectrumName, basisNote: curve.note };
}

/** Wall transmission on the grid at `thicknessMm` (reference materials and the caller's groups' own). */
export async function wallOnGrid(materialId: number, thicknessMm: number, groupIds: number[], field = 'wall.materialId') {
	const m = await getWallMaterial(materialId, groupIds);
	if (!m) throw unprocessable(field, `${field}: no wall material with id ${materialId}.`);
	return { material: m, transmission: wallTransmissionOnGrid(m.model, thicknessMm, GRID.fromNm, GRID.stepNm, GRID.count) };
}

/** The requested lamps (default: all of the caller's groups' lamps) with photon flux per nm at the vessel. */
export async function lampsOnGrid(locals: App.Locals, caller: Caller, ids: number[] | undefined) {
	const groupIds = caller.memberships.map((m) => m.groupId);
	let lamps;
	if (ids && ids.length) {
		lamps = [];
		for (const [k, id] of ids.entries()) {
			const lamp = await findLamp(id);
			if (!lamp || (!caller.reader.isAdmin && !groupIds.includes(lamp.groupId))) throw unprocessable(`lamps[${k}]`, `lamps[${k}]: no lamp with id ${id} in your groups.`);
			lamps.push(lamp);
		}
	} else {
		lamps = await listLamps(groupIds);
	}
	if (!lamps.length) throw unprocessable('lamps', 'No lamps to compare: add a lamp to your group or pick some.');
	const out = [];
	for (const lamp of lamps) {
		const model = await resolveLampModel(lamp.model, locals);
		// cautions from what the lamp itself emits (lamp.powerW), not from the power coupled into the vessel
		const d = describeLamp(model, vesselPowerW(lamp), GRID, lamp.powerW, exposureOf(lamp));
		// calibration (lamps' own module): the flux entering through the calibration wall, the wall applied once
		const planned = await plannerPhotonFlux(lamp, d.photonFluxPerNm, groupIds);
		out.push({ lamp, model, photonFluxPerNm: planned.photonFluxPerNm, peakNm: d.peakNm, cautions: d.cautions, basis: planned.basis.photonFluxBasis, calibration: planned });
	}
	return out;
}
