/**
 * POST /api/window: validate → load the ingredients onto the grid → computeWindow (+ ranking, flow, sensitised route,
 * cautions) → the JSON answer of API.md. Pure physics lives in src/lib/irradiation/; this file only orchestrates.
 */
import { computeWindow, computeWindowRanking, type OtherSpecies } from '$lib/irradiation/computeWindow';
import { computeFlow } from '$lib/irradiation/flow';
import { mergeCautions } from '$lib/irradiation/cautions';
import { speciesAbsorbance } from '$lib/irradiation/innerFilter';
import { suggestPhotocatalysts, type CatalystCandidate } from '$lib/irradiation/sensitised';
import { windowPhysicsIssues, windowRequestSchema, type WindowRequest } from '$lib/schemas/window';
import { findSpectrumById, listSpectrumSummaries } from '$lib/server/db/spectra';
import { ApiError, zodToApiError } from '$lib/server/http';
import { callerOf } from './spectraAccess';
import { absorberOnGrid, epsilonOnGrid, GRID, lampsOnGrid, solventOnGrid, wallOnGrid } from './windowInputs';

const lower = (s: string) => s.charAt(0).toLowerCase() + s.slice(1);

/** Validates a request body: 400 for shapes and types, 422 for physically impossible values (field named). */
export function parseWindowRequest(body: unknown): WindowRequest {
	const parsed = windowRequestSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error, 400);
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
	const others: (OtherSpecies & { spectrumId: number })[] = [];
	for (const [k, o] of (req.others ?? []).entries()) {
		const got = await absorberOnGrid(locals, o.spectrumId, `others[${k}].spectrumId`);
		others.push({ id: String(o.spectrumId), spectrumId: o.spectrumId, name: got.row.name, epsilon: got.epsilon, concentrationM: o.concentrationM });
	}
	// The product that builds up: named explicitly, else an "other" whose part is product.
	let product: { name: string; epsilon: Float64Array; productPerSubstrate?: number } | undefined;
	if (req.product) {
		const got = await absorberOnGrid(locals, req.product.spectrumId, 'product.spectrumId');
		product = { name: got.row.name, epsilon: got.epsilon, productPerSubstrate: req.product.productPerSubstrate };
	}
	const solvent = await solventOnGrid(req.solvent.id);
	const wall = await wallOnGrid(req.wall.materialId, req.wall.thicknessMm, groupIds);
	const lamps = await lampsOnGrid(locals, caller, req.lamps);
	const wallName = `${req.wall.thicknessMm} mm ${lower(wall.material.name)}`;

	const common = {
		grid: GRID,
		substrate: { name: substrate.row.name, epsilon: substrate.epsilon, concentrationM: req.substrate.concentrationM },
		others,
		product,
		pathCm: req.pathCm,
		lamps: lamps.map((l) => ({ id: String(l.lamp.id), name: l.lamp.name, photonFluxPerNm: l.photonFluxPerNm })),
		quantumYield: req.quantumYield,
		amountMol: req.amountMol,
		volumeL: req.volumeL,
		thresholds: req.thresholds
	};
	const outcome = computeWindow({ ...common, solventAbsorbancePerCm: solvent.absorbancePerCm, wallTransmission: wall.transmission, names: { wall: wallName, solvent: lower(solvent.solvent.name) } });
	if (!outcome.ok) {
		const first = outcome.issues[0];
		throw new ApiError(first.code === 'invalid' ? 400 : 422, 'invalid', first.message, { field: first.field, issues: outcome.issues });
	}
	const answer = outcome.value;
	const lampById = new Map(lamps.map((l) => [String(l.lamp.id), l]));

	return {
		windows: answer.windows,
		thresholds: answer.thresholds,
		lamps: answer.lamps.map((r) => ({
			...r,
			id: Number(r.id),
			peakNm: lampById.get(r.id)?.peakNm ?? null,
			photonFluxBasis: lampById.get(r.id)?.basis ?? null
		})),
		explanation: answer.explanation,
		cautions: mergeCautions(...lamps.map((l) => l.cautions)),
		substrate: { id: substrate.row.id, name: substrate.row.name, concentrationM: req.substrate.concentrationM },
		solvent: { id: solvent.solvent.id, name: solvent.solvent.name, cutoffNm: solvent.solvent.cutoffNm, basis: solvent.basis, source: solvent.solvent.source },
		wall: { materialId: wall.material.id, name: wall.material.name, thicknessMm: req.wall.thicknessMm, source: wall.material.source },
		ranking: await rankingFor(req, common, solvent, wall, groupIds, wallName),
		flow: flowFor(req, substrate.epsilon, others, product, solvent.absorbancePerCm, wall.transmission, answer.lamps[0]?.id, lamps),
		sensitised: answer.windows.length ? null : await sensitisedFor(locals, caller, req, substrate, others, solvent.absorbancePerCm, wall.transmission),
		curves: req.includeCurves ? curvesFor(substrate.epsilon, req, others, solvent.absorbancePerCm, wall.transmission, lamps) : undefined
	};
}

type Common = Parameters<typeof computeWindowRanking>[0] extends infer T ? Omit<T & object, 'walls' | 'solvents' | 'limit'> : never;

async function rankingFor(req: WindowRequest, common: Common, solvent: Awaited<ReturnType<typeof solventOnGrid>>, wall: Awaited<ReturnType<typeof wallOnGrid>>, groupIds: number[], wallName: string) {
	const walls = [{ id: `${wall.material.id}@${req.wall.thicknessMm}`, name: wallName, transmission: wall.transmission }];
	for (const [k, w] of (req.rank?.walls ?? []).entries()) {
		const got = await wallOnGrid(w.materialId, w.thicknessMm, groupIds, `rank.walls[${k}].materialId`);
		const key = `${got.material.id}@${w.thicknessMm}`;
		if (!walls.some((x) => x.id === key)) walls.push({ id: key, name: `${w.thicknessMm} mm ${lower(got.material.name)}`, transmission: got.transmission });
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
		fixed[i] = solvPerCm[i] * req.pathCm;
	}
	for (const o of others) {
		const a = speciesAbsorbance(o.epsilon!, o.concentrationM ?? 0, req.pathCm);
		for (let i = 0; i < n; i++) fixed[i] += a[i];
	}
	const out = computeFlow({
		stepNm: GRID.stepNm,
		photonFluxInMixturePerNm: qIn,
		pathCm: req.pathCm,
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
	const competing = speciesAbsorbance(substrate.epsilon, req.substrate.concentrationM, req.pathCm);
	for (let i = 0; i < n; i++) solv[i] = solvPerCm[i] * req.pathCm;
	for (const o of others) {
		const a = speciesAbsorbance(o.epsilon!, o.concentrationM ?? 0, req.pathCm);
		for (let i = 0; i < n; i++) competing[i] += a[i];
	}
	const result = suggestPhotocatalysts({
		grid: GRID,
		pathCm: req.pathCm,
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

/** Curves for the overlay plot on a 1 nm grid: absorbances over the path, wall T, lamps' emission normalised to 1. */
function curvesFor(
	epsS: Float64Array,
	req: WindowRequest,
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
	return {
		x,
		substrateAbsorbance: pick(epsS, req.substrate.concentrationM * req.pathCm),
		others: others.map((o) => ({ id: o.spectrumId, name: o.name, absorbance: pick(o.epsilon!, (o.concentrationM ?? 0) * req.pathCm) })),
		solventAbsorbance: pick(solvPerCm, req.pathCm),
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
