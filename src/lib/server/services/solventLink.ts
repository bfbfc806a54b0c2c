/**
 * Solvents linked to measured absorption spectra of the Library. A linked spectrum wins over the cut-off edge model in
 * the Window finder. Solvent rows are shared by every group, so only a public spectrum may be linked, and only by a
 * group lead or an admin.
 */
import { solventAbsorbanceOnGrid } from '$lib/irradiation/solvents';
import { resampleOnto, type WavelengthGrid } from '$lib/irradiation/wavelengthGrid';
import { getSolvent, setSolventSpectrum, type Solvent } from '$lib/server/db/solvents';
import { findSpectrumById, type SpectrumRow } from '$lib/server/db/spectra';
import { bufferToFloat64 } from '$lib/server/db/spectraBlobs';
import { ApiError, forbidden } from '$lib/server/http';
import { membershipsOf, requireUser } from '$lib/server/policy';
import { parseDerivedExtra } from './spectraDerive';

/** Absorbance per cm of a neat-solvent spectrum at its stored points: A/l for absorbance, ε·c for ε (c = neat molarity). */
function perCmFactor(row: SpectrumRow): number | null {
	if (row.y_unit === 'absorbance') return Number(row.path_cm) > 0 ? 1 / Number(row.path_cm) : null;
	if (row.y_unit === 'epsilon') return Number(row.concentration_m) > 0 ? Number(row.concentration_m) : null;
	return null;
}

/** Why a spectrum cannot serve as a solvent's measured curve, or null when it can. */
function unusableReason(row: SpectrumRow | undefined, spectrumId: number): string | null {
	if (!row || row.deleted_at || row.visibility !== 'public') return 'spectrumId: give a public spectrum of the Library.';
	if (row.kind !== 'absorption') return `spectrumId: spectrum ${spectrumId} is a ${row.kind} spectrum, not an absorption spectrum.`;
	if (perCmFactor(row) === null) return `spectrumId: spectrum ${spectrumId} has no path length (absorbance) or concentration (ε), so its absorbance per cm is unknown: add it to its metadata.`;
	return null;
}

/** Links (spectrumId) or unlinks (empty/null) a solvent's measured spectrum; 403 unless lead of a group or admin; 400 naming the field. */
export async function linkSolventSpectrum(locals: App.Locals, solventIdRaw: unknown, spectrumIdRaw: unknown): Promise<Solvent> {
	const user = requireUser(locals);
	if (user.siteRole !== 'admin' && !(await membershipsOf(user.id)).some((m) => m.role === 'lead')) throw forbidden('Only group leads and admins link solvent spectra.');
	const solventId = Number(solventIdRaw);
	const solvent = Number.isInteger(solventId) && solventId > 0 ? await getSolvent(solventId) : null;
	if (!solvent) throw new ApiError(400, 'invalid', 'solventId: no such solvent.', { field: 'solventId' });
	if (spectrumIdRaw === '' || spectrumIdRaw === null || spectrumIdRaw === undefined) {
		await setSolventSpectrum(solvent.id, null);
		return (await getSolvent(solvent.id))!;
	}
	const spectrumId = Number(spectrumIdRaw);
	if (!Number.isInteger(spectrumId) || spectrumId <= 0) throw new ApiError(400, 'invalid', 'spectrumId: a spectrum id (whole number) or empty to unlink.', { field: 'spectrumId' });
	const why = unusableReason(await findSpectrumById(spectrumId), spectrumId);
	if (why) throw new ApiError(400, 'invalid', why, { field: 'spectrumId' });
	await setSolventSpectrum(solvent.id, spectrumId);
	return (await getSolvent(solvent.id))!;
}

/** What the planner uses for a solvent, and what it says about it. */
export interface SolventCurve {
	absorbancePerCm: Float64Array;
	basis: 'measured' | 'edge model';
	spectrumId: number | null;
	spectrumName: string | null;
	/** One sentence for the page, e.g. "measured spectrum “Acetonitrile, neat (1 cm)” (#12), 1 cm path". */
	note: string;
}

/**
 * Solvent absorbance per cm on the grid: the linked measured spectrum when there is one (A/l of the measurement;
 * Beer–Lambert, so the mixture's path scales it), else the cut-off edge model A(1 cm) = 10^((λc − λ)/10 nm).
 * Where the measured curve says nothing — outside its range, or in a saturated or noise stretch near the cut-off —
 * the larger of the measured value and the edge model is used (a saturated reading is a lower bound).
 */
export async function solventCurveOnGrid(s: Solvent, grid: WavelengthGrid): Promise<SolventCurve> {
	const edge = solventAbsorbanceOnGrid(s.cutoffNm, grid.fromNm, grid.stepNm, grid.count, 1);
	const model: SolventCurve = { absorbancePerCm: edge, basis: 'edge model', spectrumId: null, spectrumName: null, note: `cut-off edge model (λc = ${s.cutoffNm} nm, ${s.status}) — a model, not a measurement` };
	if (!s.spectrumId) return model;
	const row = await findSpectrumById(s.spectrumId);
	if (!row || unusableReason(row, s.spectrumId)) return { ...model, note: `${model.note}; the linked spectrum #${s.spectrumId} is no longer usable` };
	const x = bufferToFloat64(row.x_nm);
	const y = bufferToFloat64(row.y_normalised);
	const k = perCmFactor(row)!;
	const measured = resampleOnto(x, y, grid, NaN);
	const excluded = parseDerivedExtra(row.derived_extra)?.excluded ?? [];
	const out = new Float64Array(grid.count);
	for (let i = 0; i < grid.count; i++) {
		const w = grid.fromNm + i * grid.stepNm;
		const a = measured[i] * k;
		const silent = !Number.isFinite(a) || excluded.some((e) => w >= e.fromNm && w <= e.toNm);
		out[i] = silent ? Math.max(Number.isFinite(a) ? a : 0, edge[i]) : Math.max(0, a);
	}
	const path = row.y_unit === 'absorbance' ? `, measured over ${Number(row.path_cm)} cm` : '';
	return { absorbancePerCm: out, basis: 'measured', spectrumId: Number(row.id), spectrumName: row.name, note: `measured spectrum “${row.name}” (#${row.id})${path}` };
}
