/**
 * POST /api/window: validate → load the ingredients onto the grid → computeWindow (+ ranking, flow, sensitised route,
 * cautions) → the JSON answer of API.md. Pure physics lives in src/lib/irradiation/; this file only orchestrates.
 */
import { computeWindow, computeWindowRanking, opticsOf, type OtherSpecies, type ReactionSpec } from '$lib/irradiation/computeWindow';
import { innerFaceCorrection, wallTransmissionIntoLiquid, type VesselOptics } from '$lib/irradiation/vessels';
import { computeFlow } from '$lib/irradiation/flow';
import { cautionsPerLamp } from '$lib/irradiation/cautions';
import { calibrationNote } from './lampCalibrations';
import { speciesAbsorbance } from '$lib/irradiation/innerFilter';
import { suggestPhotocatalysts, type CatalystCandidate } from '$lib/irradiation/sensitised';
import { windowPhysicsIssues, windowRequestSchema, windowShapeIssues, type WindowRequest } from '$lib/schemas/window';
import { findSpectrumById, listSpectrumSummaries } from '$lib/server/db/spectra';
import { getWallMaterial } from '$lib/server/db/wallMaterials';
import { ApiError, zodToApiError } from '$lib/server/http';
import { callerOf } from './spectraAccess';
import { absorberOnGrid, epsilonOnGrid, GRID, lampsOnGrid, solventOnGrid, wallOnGrid } from './windowInputs';

const lower = (s: string) => s.charAt(0).toLowerCase() + s.slice(1);

/** Validates a request body: 400 for shapes and types, 422 for physically impossible values (field named). */
export function parseWindowRequest(body: unknown): WindowRequest {
	const parsed = windowRequestSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error, 400);
	const shape = windowShapeIssues(parsed.data);
	if (shape.length) throw new ApiError(400, 'invalid', shape[0].message, { field: shape[0].field, issues: shape });
	const physics = windowPhysicsIssues(parsed.data);
	if (physics.length) throw new ApiError(422, 'physically_invalid', physics[0].message, { field: physics[0].field, issues: physics });
	return parsed.data;
}

/** Computes the Window finder answer for the caller. */
export async function computeWindowFor(locals: App.Locals, body: unknown) {
	const req = parseWindowRequest(body);
	const caller = await callerOf(locals);
	const groupIds = caller.memberships.map((m) => m.groupId);

	const substrate = await absorberOnGrid(locals, req.substrate.spectrumId, 'substrate.spectrumId');
	const { reaction, reactionAnswer, skipOthers } = await reactionOnGrid(locals, req);
	const others: (OtherSpecies & { spectrumId: number })[] = [];
	const notes: string[] = [];
	for (const [k, o] of (req.others ?? []).entries()) {
		if (skipOthers.has(o.spectrumId)) {
			notes.push(`others[${k}] is the photocatalyst itself; it is counted once, as the intended absorber.`);
			continue;
		}
		const got = await absorberOnGrid(locals, o.spectrumId, `others[${k}].spectrumId`);
		others.push({ id: String(o.spectrumId), spectrumId: o.spectrumId, name: got.row.name, epsilon: got.epsilon, concentrationM: o.concentrationM });
	}
	// The product that builds up: named explicitly (direct and photocatalytic modes; reversible mode has its own).
	let product: { name: string; epsilon: Float64Array; productPerSubstrate?: number } | undefined;
	if (req.product && reaction?.type !== 'reversible') {
		const got = await absorberOnGrid(locals, req.product.spectrumId, 'product.spectrumId');
		product = { name: got.row.name, epsilon: got.epsilon, productPerSubstrate: req.product.productPerSubstrate };
	}
	const solvent = await solventOnGrid(req.solvent.id);
	const wall = await wallOnGrid(req.wall.materialId, req.wall.thicknessMm, groupIds);
	const lamps = await lampsOnGrid(locals, caller, req.lamps);
	const wallName = `${req.wall.thicknessMm} mm ${lower(wall.material.name)}`;
	// the inner face of the wall meets the liquid, not air (vessels.ts)
	const nWall = wall.material.refractiveIndex, nLiquid = solvent.solvent.refractiveIndex;
	const wallT = wallTransmissionIntoLiquid(wall.transmission, nWall, nLiquid);
	await keepCalibrationWallOnce(lamps, groupIds, nLiquid);
	const optics = opticsOf({ vessel: req.vessel, pathCm: req.pathCm ?? 0 });

	const common = {
		grid: GRID,
		substrate: { name: substrate.row.name, epsilon: substrate.epsilon, concentrationM: req.substrate.concentrationM },
		others,
		product,
		pathCm: req.pathCm ?? optics.referencePathCm,
		vessel: req.vessel,
		reaction,
		lamps: lamps.map((l) => ({ id: String(l.lamp.id), name: l.lamp.name, photonFluxPerNm: l.photonFluxPerNm })),
		quantumYield: req.quantumYield,
		amountMol: req.amountMol,
		volumeL: req.volumeL,
		thresholds: req.thresholds
	};
	const outcome = computeWindow({ ...common, solventAbsorbancePerCm: solvent.absorbancePerCm, wallTransmission: wallT, names: { wall: wallName, solvent: lower(solvent.solvent.name) } });
	if (!outcome.ok) {
		const first = outcome.issues[0];
		throw new ApiError(first.code === 'invalid' ? 400 : 422, 'invalid', first.message, { field: first.field, issues: outcome.issues });
	}
	const answer = outcome.value;
	const lampById = new Map(lamps.map((l) => [String(l.lamp.id), l]));
	const direct = !reaction || reaction.type === 'direct';
	if (req.flow && !direct) notes.push('Flow figures are computed for direct photolysis only; for this mode use the batch times with the reactor volume (a plug that spends τ in the light is a batch irradiated for τ).');
	if (product === undefined && req.product && reaction?.type === 'reversible') notes.push('product is ignored in reversible mode: reaction.product is the product.');
	if (nLiquid == null) notes.push(`The solvent has no refractive index stored, so the inner wall face is taken as glass/air (slightly pessimistic).`);

	return {
		wallTransmissionAtBandMaximum: answer.wallTransmissionAtBandMaximum,
		penetrationDepth90AtBandMaximumCm: answer.penetrationDepth90AtBandMaximumCm,
		reaction: { ...reactionAnswer, intendedAbsorber: answer.reaction.intendedAbsorber, notes: [...answer.reaction.notes, ...notes] },
		vessel: { ...(req.vessel ?? { shape: 'slab' }), ...answer.vessel, pathCm: optics.shape === 'slab' ? optics.referencePathCm : null },
		photostationaryCurve: answer.photostationaryCurve,
		bestPhotostationaryWavelength: answer.bestPhotostationaryWavelength,
		windows: answer.windows,
		thresholds: answer.thresholds,
		lamps: answer.lamps.map((r) => ({
			...r,
			id: Number(r.id),
			peakNm: lampById.get(r.id)?.peakNm ?? null,
			photonFluxBasis: lampById.get(r.id)?.basis ?? null,
			photonFluxCalibration: lampById.has(r.id) ? calibrationNote(lampById.get(r.id)!.calibration, wall.transmission) : null
		})),
		explanation: [...answer.explanation, ...notes],
		cautions: cautionsPerLamp(lamps.map((l) => ({ lampId: l.lamp.id, lampName: l.lamp.name, cautions: l.cautions }))),
		substrate: { id: substrate.row.id, name: substrate.row.name, concentrationM: req.substrate.concentrationM },
		solvent: { id: solvent.solvent.id, name: solvent.solvent.name, cutoffNm: solvent.solvent.cutoffNm, basis: solvent.basis, spectrumId: solvent.spectrumId, spectrumName: solvent.spectrumName, note: solvent.basisNote, source: solvent.solvent.source, refractiveIndex: nLiquid },
		wall: {
			materialId: wall.material.id, name: wall.material.name, thicknessMm: req.wall.thicknessMm, source: wall.material.source,
			innerFace: { wallRefractiveIndex: nWall, liquidRefractiveIndex: nLiquid, factor: innerFaceCorrection(nWall, nLiquid) }
		},
		ranking: await rankingFor(req, common, solvent, wall, groupIds, wallName, wallT, nLiquid),
		flow: direct ? flowFor(req, optics, substrate.epsilon, others, product, solvent.absorbancePerCm, wallT, answer.lamps[0]?.id, lamps) : null,
		sensitised: answer.windows.length || !direct ? null : await sensitisedFor(locals, caller, req, optics, substrate, others, solvent.absorbancePerCm, wallT),
		curves: req.includeCurves ? curvesFor(substrate.epsilon, req, optics, reaction, others, solvent.absorbancePerCm, wallT, lamps) : undefined
	};
}

/**
 * A calibration is the flux that entered the actinometer solution through its wall, inner face included; the lamps
 * module backs that wall out with two air faces (walls.ts). The planner's walls have a glass/liquid inner face, so the
 * calibrated lamps' flux is divided by the calibration wall's inner-face factor: with the calibration wall itself the
 * liquid then receives exactly the calibrated flux (the wall applied once).
 */
async function keepCalibrationWallOnce(lamps: Awaited<ReturnType<typeof lampsOnGrid>>, groupIds: number[], nLiquid: number | null) {
	for (const l of lamps) {
		const latest = l.calibration?.calibrationWall ? l.calibration.basis.latest : null;
		if (!latest?.wallMaterialId) continue;
		const m = await getWallMaterial(latest.wallMaterialId, [l.lamp.groupId, ...groupIds]);
		const f = innerFaceCorrection(m?.refractiveIndex, nLiquid);
		if (f !== 1) l.photonFluxPerNm = l.photonFluxPerNm.map((v) => v / f);
	}
}

/**
 * The reaction mode's spectra on the grid (photocatalyst or photoreverting product), the answer's `reaction` block
 * and the spectrum ids that must not be counted twice among `others`.
 */
export async function reactionOnGrid(locals: App.Locals, req: WindowRequest) {
	const rx = req.reaction;
	const skipOthers = new Set<number>();
	if (rx?.type === 'photocatalytic') {
		const got = await absorberOnGrid(locals, rx.photocatalyst.spectrumId, 'reaction.photocatalyst.spectrumId');
		skipOthers.add(rx.photocatalyst.spectrumId);
		const reaction: ReactionSpec = { type: 'photocatalytic', photocatalyst: { name: got.row.name, epsilon: got.epsilon, concentrationM: rx.photocatalyst.concentrationM }, bleachingQuantumYield: rx.photocatalyst.bleachingQuantumYield };
		return { reaction, skipOthers, reactionAnswer: { type: rx.type, photocatalyst: { spectrumId: got.row.id, name: got.row.name, concentrationM: rx.photocatalyst.concentrationM, bleachingQuantumYield: rx.photocatalyst.bleachingQuantumYield ?? 0 } } };
	}
	if (rx?.type === 'reversible') {
		if (rx.product.spectrumId === req.substrate.spectrumId) throw new ApiError(422, 'invalid', 'reaction.product.spectrumId: the product spectrum is the substrate’s own; give the product’s spectrum.', { field: 'reaction.product.spectrumId' });
		const got = await absorberOnGrid(locals, rx.product.spectrumId, 'reaction.product.spectrumId');
		const reaction: ReactionSpec = { type: 'reversible', product: { name: got.row.name, epsilon: got.epsilon }, quantumYieldBack: rx.quantumYieldBack, thermalBackRateConstantPerS: rx.thermalBackRateConstantPerS };
		return { reaction, skipOthers, reactionAnswer: { type: rx.type, product: { spectrumId: got.row.id, name: got.row.name }, quantumYieldBack: rx.quantumYieldBack, thermalBackRateConstantPerS: rx.thermalBackRateConstantPerS ?? 0 } };
	}
	return { reaction: rx ? ({ type: 'direct' } as ReactionSpec) : undefined, skipOthers, reactionAnswer: { type: 'direct' as const } };
}

type Common = Parameters<typeof computeWindowRanking>[0] extends infer T ? Omit<T & object, 'walls' | 'solvents' | 'limit'> : never;

async function rankingFor(req: WindowRequest, common: Common, solvent: Awaited<ReturnType<typeof solventOnGrid>>, wall: Awaited<ReturnType<typeof wallOnGrid>>, groupIds: number[], wallName: string, wallT: Float64Array, nLiquid: number | null) {
	// every wall's inner face meets the chosen solvent (its index is used for the other solvents too: < 0.5 % effect)
	const walls = [{ id: `${wall.material.id}@${req.wall.thicknessMm}`, name: wallName, transmission: wallT }];
	for (const [k, w] of (req.rank?.walls ?? []).entries()) {
		const got = await wallOnGrid(w.materialId, w.thicknessMm, groupIds, `rank.walls[${k}].materialId`);
		const key = `${got.material.id}@${w.thicknessMm}`;
		if (!walls.some((x) => x.id === key)) walls.push({ id: key, name: `${w.thicknessMm} mm ${lower(got.material.name)}`, transmission: wallTransmissionIntoLiquid(got.transmission, got.material.refractiveIndex, nLiquid) });
	}
	const solvents = [{ id: String(solvent.solvent.id), name: lower(solvent.solvent.name), absorbancePerCm: solvent.absorbancePerCm }];
	for (const [k, sid] of (req.rank?.solvents ?? []).entries()) {
		if (solvents.some((s) => s.id === String(sid))) continue;
		const got = await solventOnGrid(sid, `rank.solvents[${k}]`);
		solvents.push({ id: String(sid), name: lower(got.solvent.name), absorbancePerCm: got.absorbancePerCm });
	}
	const out = computeWindowRanking({ ...common, walls, solvents, limit: 30 });
	if (!out.ok) return null;
	return out.value;
}

function flowFor(
	req: WindowRequest,
	optics: VesselOptics,
	epsS: Float64Array,
	others: OtherSpecies[],
	product: { epsilon: Float64Array; productPerSubstrate?: number } | undefined,
	solvPerCm: Float64Array,
	wallT: Float64Array,
	bestId: string | undefined,
	lamps: { lamp: { id: number; name: string }; photonFluxPerNm: Float64Array }[]
) {
	if (!req.flow || !bestId) return null;
	const best = lamps.find((l) => String(l.lamp.id) === bestId);
	if (!best) return null;
	const n = GRID.count;
	const qIn = new Float64Array(n);
	const fixed = new Float64Array(n);
	for (let i = 0; i < n; i++) {
		qIn[i] = best.photonFluxPerNm[i] * wallT[i];
		fixed[i] = solvPerCm[i] * optics.referencePathCm;
	}
	for (const o of others) {
		const a = speciesAbsorbance(o.epsilon!, o.concentrationM ?? 0, optics.referencePathCm);
		for (let i = 0; i < n; i++) fixed[i] += a[i];
	}
	const out = computeFlow({
		stepNm: GRID.stepNm,
		photonFluxInMixturePerNm: qIn,
		pathCm: optics.referencePathCm,
		fractionPerAbsorbance: optics.fractionPerAbsorbance,
		substrateEpsilon: epsS,
		substrateConcentrationM: req.substrate.concentrationM,
		productEpsilon: product?.epsilon,
		productPerSubstrate: product?.productPerSubstrate,
		fixedAbsorbance: fixed,
		quantumYield: req.quantumYield ?? 1,
		reactorVolumeMl: req.flow.reactorVolumeMl,
		flowRateMlPerMin: req.flow.flowRateMlPerMin
	});
	if (!out.ok) throw new ApiError(422, 'invalid', out.issues[0].message, { field: `flow.${out.issues[0].field}` });
	return { lampId: best.lamp.id, lampName: best.lamp.name, ...out.value };
}

async function sensitisedFor(
	locals: App.Locals,
	caller: Awaited<ReturnType<typeof callerOf>>,
	req: WindowRequest,
	optics: VesselOptics,
	substrate: Awaited<ReturnType<typeof absorberOnGrid>>,
	others: OtherSpecies[],
	solvPerCm: Float64Array,
	wallT: Float64Array
) {
	const summaries = await listSpectrumSummaries(caller.reader, { part: 'photocatalyst', kind: 'absorption' });
	const candidates: CatalystCandidate[] = [];
	for (const s of summaries.slice(0, 60)) {
		const row = await findSpectrumById(s.id);
		if (!row) continue;
		try {
			const potentials = row.excited_state_potentials ? JSON.parse(row.excited_state_potentials) : undefined;
			candidates.push({
				id: String(row.id),
				name: row.name,
				epsilon: epsilonOnGrid(row, 'candidate'),
				tripletEnergyKJPerMol: row.triplet_energy_kj_per_mol ?? undefined,
				excitedStatePotentials: potentials ?? undefined
			});
		} catch {
			// spectra without usable ε cannot be judged; they are simply not candidates
		}
	}
	const n = GRID.count;
	const solv = new Float64Array(n);
	const pathCm = optics.meanPathCm;
	const competing = speciesAbsorbance(substrate.epsilon, req.substrate.concentrationM, pathCm);
	for (let i = 0; i < n; i++) solv[i] = solvPerCm[i] * pathCm;
	for (const o of others) {
		const a = speciesAbsorbance(o.epsilon!, o.concentrationM ?? 0, pathCm);
		for (let i = 0; i < n; i++) competing[i] += a[i];
	}
	const result = suggestPhotocatalysts({
		grid: GRID,
		pathCm,
		wallTransmission: wallT,
		solventAbsorbance: solv,
		competingAbsorbance: competing,
		substrateTripletEnergyKJPerMol: req.substrate.tripletEnergyKJPerMol ?? substrate.row.triplet_energy_kj_per_mol ?? undefined,
		candidates,
		marginKJPerMol: req.sensitiserMarginKJPerMol,
		thresholds: req.thresholds
	});
	return { marginKJPerMol: req.sensitiserMarginKJPerMol ?? 10, ...result };
}

/**
 * Curves for the overlay plot on a 1 nm grid: absorbances over the mean optical path, wall T (into the liquid),
 * lamps' emission normalised to 1; the photocatalyst's absorbance, or the product's at full conversion (reversible).
 */
function curvesFor(
	epsS: Float64Array,
	req: WindowRequest,
	optics: VesselOptics,
	reaction: ReactionSpec | undefined,
	others: (OtherSpecies & { spectrumId: number })[],
	solvPerCm: Float64Array,
	wallT: Float64Array,
	lamps: { lamp: { id: number; name: string }; photonFluxPerNm: Float64Array }[]
) {
	const every = Math.round(1 / GRID.stepNm);
	const pick = (a: ArrayLike<number>, scale = 1) => {
		const out: number[] = [];
		for (let i = 0; i < GRID.count; i += every) out.push(Math.round(a[i] * scale * 1e5) / 1e5);
		return out;
	};
	const x = pick(Array.from({ length: GRID.count }, (_, i) => GRID.fromNm + i * GRID.stepNm));
	const l = optics.meanPathCm;
	return {
		x,
		pathCm: l,
		substrateAbsorbance: pick(epsS, req.substrate.concentrationM * l),
		photocatalystAbsorbance: reaction?.type === 'photocatalytic' ? pick(reaction.photocatalyst.epsilon, reaction.photocatalyst.concentrationM * l) : undefined,
		productAbsorbanceAtFullConversion: reaction?.type === 'reversible' ? pick(reaction.product.epsilon, req.substrate.concentrationM * l) : undefined,
		others: others.map((o) => ({ id: o.spectrumId, name: o.name, absorbance: pick(o.epsilon!, (o.concentrationM ?? 0) * l) })),
		solventAbsorbance: pick(solvPerCm, l),
		wallTransmission: pick(wallT),
		lamps: lamps.map((l) => {
			let max = 0;
			for (const v of l.photonFluxPerNm) if (v > max) max = v;
			// photonFluxPerNm: einstein s⁻¹ nm⁻¹ reaching the vessel, before the wall (for the page's CSV), 6 significant figures
			const flux: number[] = [];
			for (let i = 0; i < GRID.count; i += every) flux.push(Number(l.photonFluxPerNm[i].toPrecision(6)));
			return { id: l.lamp.id, name: l.lamp.name, emission: pick(l.photonFluxPerNm, max > 0 ? 1 / max : 0), photonFluxPerNm: flux };
		})
	};
}
