/**
 * POST /api/quantum-yield: an irradiation series of library spectra + a lamp (calibrated flux) + the vessel → Φ with its
 * standard error (src/lib/irradiation/quantumYield/seriesFit.ts), optionally stored on the reactant's spectrum.
 */
import { fitQuantumYieldSeries } from '$lib/irradiation/quantumYield/seriesFit';
import { resampleOnto } from '$lib/irradiation/wavelengthGrid';
import { quantumYieldRequestSchema, type QuantumYieldRequest } from '$lib/schemas/quantumYield';
import { bufferToFloat64 } from '$lib/server/db/spectraBlobs';
import { insertMeasuredQuantumYield, listMeasuredQuantumYields, measuredQuantumYieldToApi } from '$lib/server/db/measuredQuantumYields';
import { ApiError, zodToApiError } from '$lib/server/http';
import { requireGroupRole, requireUser } from '$lib/server/policy';
import { callerOf, visibleSpectrum } from './spectraAccess';
import { absorberOnGrid, GRID, lampsOnGrid, wallOnGrid } from './windowInputs';

/** Default relative uncertainty of the photon flux by its basis (common practice: actinometry ±5 %; a lamp model ±30 %). */
const DEFAULT_FLUX_UNCERTAINTY: Record<string, number> = { actinometry: 0.05, radiometer: 0.05, model: 0.3 };

export function parseQuantumYieldRequest(body: unknown): QuantumYieldRequest {
	const parsed = quantumYieldRequestSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error, 400);
	const r = parsed.data;
	if (r.spectrumIds.length < 3) throw new ApiError(400, 'invalid', `spectrumIds: a series needs at least 3 spectra; got ${r.spectrumIds.length}`, { field: 'spectrumIds' });
	if (r.timesS.length !== r.spectrumIds.length) throw new ApiError(400, 'invalid', `timesS: ${r.timesS.length} times for ${r.spectrumIds.length} spectra`, { field: 'timesS' });
	for (let k = 1; k < r.timesS.length; k++) if (!(r.timesS[k] > r.timesS[k - 1])) throw new ApiError(400, 'invalid', `timesS must increase: timesS[${k}] = ${r.timesS[k]} s follows ${r.timesS[k - 1]} s`, { field: `timesS[${k}]` });
	if (r.timesS[0] < 0) throw new ApiError(400, 'invalid', 'timesS[0] must be ≥ 0 s', { field: 'timesS[0]' });
	const pos = (field: string, v: number | undefined) => {
		if (v !== undefined && !(v > 0)) throw new ApiError(422, 'physically_invalid', `${field} must be above 0`, { field });
	};
	pos('volumeL', r.volumeL);
	pos('pathCm', r.pathCm);
	pos('wall.thicknessMm', r.wall.thicknessMm);
	if (r.fromNm !== undefined && r.toNm !== undefined && !(r.toNm > r.fromNm)) throw new ApiError(400, 'invalid', 'toNm must be above fromNm', { field: 'toNm' });
	const u = r.calibrationRelativeUncertainty;
	if (u !== undefined && !(u >= 0 && u < 1)) throw new ApiError(422, 'physically_invalid', 'calibrationRelativeUncertainty is a fraction between 0 and 1', { field: 'calibrationRelativeUncertainty' });
	return r;
}

/** A measured absorbance spectrum on the grid (NaN outside its range), scaled to the irradiated cell's path. */
async function seriesSpectrum(locals: App.Locals, id: number, field: string, pathCm: number, warnings: string[]) {
	const { row } = await visibleSpectrum(locals, String(id));
	if (row.deleted_at) throw new ApiError(404, 'not_found', 'No such spectrum.', { field });
	if (row.kind !== 'absorption') throw new ApiError(422, 'invalid', `${field}: spectrum ${id} (“${row.name}”) is a ${row.kind} spectrum; a series needs absorbance spectra.`, { field });
	if (row.y_unit !== 'absorbance') throw new ApiError(422, 'invalid', `${field}: spectrum ${id} (“${row.name}”) is stored as ${row.y_unit}, not as measured absorbance.`, { field });
	const a = resampleOnto(bufferToFloat64(row.x_nm), bufferToFloat64(row.y_normalised), GRID, NaN);
	const l = Number(row.path_cm);
	if (l > 0 && Math.abs(l - pathCm) > 1e-9) {
		for (let i = 0; i < a.length; i++) a[i] *= pathCm / l;
		if (!warnings.some((w) => w.startsWith('Spectra read'))) warnings.push(`Spectra read over ${l} cm were scaled to the ${pathCm} cm irradiated path (Beer–Lambert).`);
	}
	return { row, absorbance: a };
}

export async function computeQuantumYieldFor(locals: App.Locals, body: unknown) {
	requireUser(locals);
	const req = parseQuantumYieldRequest(body);
	const caller = await callerOf(locals);
	const groupIds = caller.memberships.map((m) => m.groupId);
	const warnings: string[] = [];
	const series = [];
	for (const [k, id] of req.spectrumIds.entries()) series.push(await seriesSpectrum(locals, id, `spectrumIds[${k}]`, req.pathCm, warnings));
	const reactant = await absorberOnGrid(locals, req.reactant.spectrumId, 'reactant.spectrumId');
	const product = req.product ? await absorberOnGrid(locals, req.product.spectrumId, 'product.spectrumId') : undefined;
	const [lamp] = await lampsOnGrid(locals, caller, [req.lampId]).catch((e) => {
		if (e instanceof ApiError && e.extra.field === 'lamps[0]') throw new ApiError(422, 'invalid', `lampId: no lamp with id ${req.lampId} in your groups.`, { field: 'lampId' });
		throw e;
	});
	const wall = await wallOnGrid(req.wall.materialId, req.wall.thicknessMm, groupIds);
	// photon flux entering the solution: outside-wall flux × the wall (a calibration through this wall is met exactly)
	const qIn = new Float64Array(GRID.count);
	let qInTotal = 0;
	for (let i = 0; i < GRID.count; i++) {
		qIn[i] = lamp.photonFluxPerNm[i] * wall.transmission[i];
		qInTotal += qIn[i] * GRID.stepNm;
	}
	const basis = String(lamp.basis ?? 'model');
	const calibrated = basis === 'actinometry' || basis === 'radiometer';
	if (!calibrated) warnings.push('The lamp has no calibration: Φ rests on the lamp model (power × coupling factor) and is uncertain by tens of per cent. Calibrate the lamp (actinometry) for a real value.');
	const u = req.calibrationRelativeUncertainty ?? DEFAULT_FLUX_UNCERTAINTY[calibrated ? basis : 'model'];
	const reaction = req.reaction?.type ?? 'direct';
	if (reaction === 'reversible' && !product) throw new ApiError(400, 'invalid', 'product: a reversible fit needs the product spectrum { spectrumId }.', { field: 'product' });
	const out = fitQuantumYieldSeries({
		grid: GRID,
		spectra: series.map((s) => s.absorbance),
		timesS: req.timesS,
		reactantEpsilon: reactant.epsilon,
		productEpsilon: product?.epsilon,
		pathCm: req.pathCm,
		volumeL: req.volumeL,
		photonFluxInSolutionPerNm: qIn,
		fromNm: req.fromNm,
		toNm: req.toNm,
		reaction,
		calibrationRelativeUncertainty: u
	});
	if (!out.ok) {
		const first = out.issues[0];
		throw new ApiError(first.code === 'invalid' ? 400 : 422, 'invalid', first.message, { field: first.field, issues: out.issues });
	}
	const v = out.value;
	const fmt = (x: number, d = 3) => x.toPrecision(d);
	const wallName = `${req.wall.thicknessMm} mm ${wall.material.name.charAt(0).toLowerCase()}${wall.material.name.slice(1)}`;
	const phiText = reaction === 'reversible'
		? `Φ(forward) = ${fmt(v.quantumYield)} ± ${fmt(v.standardError, 2)} and Φ(back) = ${fmt(v.quantumYieldBack!)} ± ${fmt(v.standardErrorBack!, 2)}`
		: `Φ = ${fmt(v.quantumYield)} ± ${fmt(v.standardError, 2)}`;
	const methodsSentence =
		`The quantum yield of ${reactant.row.name} was determined from ${req.spectrumIds.length} UV–vis absorption spectra recorded during irradiation (${req.timesS[0]}–${req.timesS[req.timesS.length - 1]} s) ` +
		`with the ${lamp.lamp.name} through ${wallName} into a ${req.pathCm} cm cell holding ${fmt(req.volumeL * 1000)} mL (photon flux entering the solution ${qInTotal.toExponential(3)} einstein s⁻¹, ${calibrated ? `calibrated by ${basis}` : 'from the lamp model, not calibrated'}). ` +
		`Concentrations were obtained by linear least squares over ${v.range.fromNm}–${v.range.toNm} nm and the photons absorbed by the reactant at each time from the measured spectra (inner filter included); ` +
		`fitting the ${reaction === 'reversible' ? 'reversible photoreaction' : 'direct photoreaction'} model to the whole series gave ${phiText} (standard error including a ${fmt(u * 100, 2)} % photon-flux uncertainty); the initial-rate estimate is ${v.initialRateQuantumYield !== null ? fmt(v.initialRateQuantumYield) : 'not available'}.`;
	let saved: ReturnType<typeof measuredQuantumYieldToApi> | null = null;
	if (req.save) {
		await requireGroupRole(locals, Number(reactant.row.group_id), 'member');
		const id = await insertMeasuredQuantumYield({
			spectrumId: Number(reactant.row.id), groupId: Number(reactant.row.group_id), lampId: lamp.lamp.id, lampName: lamp.lamp.name,
			method: 'irradiation series (whole-course fit)', reactionType: reaction, quantumYield: v.quantumYield, standardError: v.standardError,
			quantumYieldBack: v.quantumYieldBack ?? null, standardErrorBack: v.standardErrorBack ?? null, initialRateQuantumYield: v.initialRateQuantumYield,
			fromNm: v.range.fromNm, toNm: v.range.toNm, photonFluxBasis: basis, createdBy: locals.user!.id,
			inputs: { ...req, save: undefined, methodsSentence }
		});
		saved = (await listMeasuredQuantumYields(Number(reactant.row.id))).map(measuredQuantumYieldToApi).find((r) => r.id === id) ?? null;
	}
	return {
		...v,
		warnings: [...warnings, ...v.warnings],
		reaction: { type: reaction },
		reactant: { spectrumId: Number(reactant.row.id), name: reactant.row.name },
		product: product ? { spectrumId: Number(product.row.id), name: product.row.name } : null,
		lamp: { id: lamp.lamp.id, name: lamp.lamp.name, photonFluxBasis: basis, photonFluxInSolutionEinsteinPerS: qInTotal },
		wall: { materialId: wall.material.id, name: wall.material.name, thicknessMm: req.wall.thicknessMm },
		calibrationRelativeUncertainty: u,
		methodsSentence,
		saved
	};
}

/** Measured Φ of a spectrum (for GET /api/spectra/:id and the Window finder). */
export async function measuredQuantumYieldsOf(spectrumId: number) {
	return (await listMeasuredQuantumYields(spectrumId)).map(measuredQuantumYieldToApi);
}
