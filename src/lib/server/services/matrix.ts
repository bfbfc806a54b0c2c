/**
 * GET /api/groups/:id/matrix (API.md "Lead's audit"): every lamp of the group against every substrate and
 * photocatalyst in its Library under one set of conditions, each cell the absorbed photon flux (the ranking core,
 * via src/lib/irradiation/absorberMatrix.ts) with the group's plans for that pair.
 * Defaults: the solvent and wall the group's plans use most, else the solvent its spectra name most and
 * borosilicate 3.3 glass tubing; 1 cm; 0.01 M (API.md).
 */
import { z } from 'zod';
import { computeAbsorberMatrix } from '$lib/irradiation/absorberMatrix';
import { findGroupById } from '$lib/server/db/groups';
import { listLamps } from '$lib/server/db/lamps';
import { groupSpectrumSolvents, listGroupAbsorberCurves } from '$lib/server/db/matrixAbsorbers';
import { listPlanInputs, listPlanPairs, type PlanState } from '$lib/server/db/plans';
import type { SpectrumRow } from '$lib/server/db/spectra';
import { listSolvents } from '$lib/server/db/solvents';
import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { ApiError, zodToApiError } from '$lib/server/http';
import { requireGroupRole } from '$lib/server/policy';
import { photonFluxBasisOf } from './planDecision';
import { callerOf } from './spectraAccess';
import { epsilonOnGrid, GRID, lampsOnGrid, solventOnGrid, wallOnGrid } from './windowInputs';

const positive = (name: string) => z.coerce.number({ error: `${name} must be a number` }).refine(Number.isFinite, `${name} must be a finite number`);
export const matrixQuerySchema = z.object({
	solvent: z.coerce.number({ error: 'solvent must be a solvent id' }).int('solvent must be a solvent id').positive('solvent must be a solvent id').optional(),
	wall: z.coerce.number({ error: 'wall must be a wall material id' }).int('wall must be a wall material id').positive('wall must be a wall material id').optional(),
	thicknessMm: positive('thicknessMm').optional(),
	pathCm: positive('pathCm').optional(),
	concentrationM: positive('concentrationM').optional()
});

const most = <T>(xs: T[]): T | undefined => {
	const n = new Map<T, number>();
	for (const x of xs) n.set(x, (n.get(x) ?? 0) + 1);
	return [...n.entries()].sort((a, b) => b[1] - a[1])[0]?.[0];
};
const o = (v: unknown): Record<string, unknown> => (v && typeof v === 'object' ? (v as Record<string, unknown>) : {});

/** The conditions: query values, else the group's habits, else the API.md defaults. */
async function conditionsFor(groupId: number, raw: Record<string, string>) {
	const parsed = matrixQuerySchema.safeParse(Object.fromEntries(Object.entries(raw).filter(([, v]) => v !== '')));
	if (!parsed.success) throw zodToApiError(parsed.error);
	const q = parsed.data;
	for (const k of ['thicknessMm', 'pathCm', 'concentrationM'] as const) {
		const v = q[k];
		if (v !== undefined && !(v > 0)) throw new ApiError(422, 'physically_invalid', `${k} must be above 0`, { field: k });
	}
	if (q.thicknessMm !== undefined && q.thicknessMm > 100) throw new ApiError(422, 'physically_invalid', 'thicknessMm must be at most 100 mm', { field: 'thicknessMm' });
	const inputs = await listPlanInputs(groupId);
	const source: Record<string, string> = {};
	let solventId = q.solvent;
	if (solventId) source.solvent = 'query';
	else {
		solventId = most(inputs.map((i) => Number(o(i.solvent).id)).filter((n) => n > 0));
		if (solventId) source.solvent = "the group's plans";
	}
	if (!solventId) {
		const solvents = await listSolvents();
		const names = await groupSpectrumSolvents(groupId);
		const match = names.map((n) => solvents.find((s) => s.name.toLowerCase() === n.solvent.toLowerCase() || s.slug === n.solvent.toLowerCase() || s.synonyms.some((y) => y.toLowerCase() === n.solvent.toLowerCase()))).find(Boolean);
		solventId = (match ?? solvents.find((s) => s.slug === 'acetonitrile') ?? solvents[0])?.id;
		source.solvent = match ? "the group's spectra" : 'default';
	}
	let materialId = q.wall;
	let thicknessMm = q.thicknessMm;
	if (materialId) source.wall = 'query';
	else {
		const walls = inputs.map((i) => o(i.wall)).filter((w) => Number(w.materialId) > 0);
		const key = most(walls.map((w) => `${w.materialId}@${w.thicknessMm}`));
		if (key) {
			const [m, d] = key.split('@').map(Number);
			materialId = m;
			thicknessMm ??= d > 0 ? d : undefined;
			source.wall = "the group's plans";
		}
	}
	const materials = await listWallMaterials([groupId]);
	if (!materialId) {
		materialId = (materials.find((m) => m.slug === 'borosilicate-3.3-tubing') ?? materials[0])?.id;
		source.wall = 'default';
	}
	const material = materials.find((m) => m.id === materialId);
	if (!material) throw new ApiError(422, 'invalid', `wall: no wall material with id ${materialId}.`, { field: 'wall' });
	if (!solventId) throw new ApiError(422, 'invalid', 'solvent: no solvents in the reference data.', { field: 'solvent' });
	return { solventId, materialId, thicknessMm: thicknessMm ?? material.typicalThicknessMm ?? 2, pathCm: q.pathCm ?? 1, concentrationM: q.concentrationM ?? 0.01, source };
}

/** The matrix for a group the caller belongs to (viewer+; 404 for outsiders; admins see every group). */
export async function groupMatrix(locals: App.Locals, groupIdParam: string | undefined, raw: Record<string, string>) {
	const groupId = /^\d{1,10}$/.test(groupIdParam ?? '') ? Number(groupIdParam) : 0;
	if (!groupId) throw new ApiError(404, 'not_found', 'No such group.');
	await requireGroupRole(locals, groupId, 'viewer');
	if (!(await findGroupById(groupId))) throw new ApiError(404, 'not_found', 'No such group.');
	const started = performance.now();
	const c = await conditionsFor(groupId, raw);
	const caller = await callerOf(locals);
	const solvent = await solventOnGrid(c.solventId, 'solvent');
	const wall = await wallOnGrid(c.materialId, c.thicknessMm, [groupId], 'wall');

	const lampRows = await listLamps([groupId]);
	const lamps: { id: number; name: string; photonFluxPerNm: Float64Array; peakNm: number | null; basis: Awaited<ReturnType<typeof photonFluxBasisOf>> }[] = [];
	const skipped: { kind: 'lamp' | 'spectrum'; id: number; name: string; reason: string }[] = [];
	for (const l of lampRows) {
		try {
			const [g] = await lampsOnGrid(locals, caller, [l.id]);
			lamps.push({ id: l.id, name: l.name, photonFluxPerNm: g.photonFluxPerNm, peakNm: g.peakNm, basis: await photonFluxBasisOf(l.id) });
		} catch (e) {
			skipped.push({ kind: 'lamp', id: l.id, name: l.name, reason: (e as Error).message });
		}
	}
	const absorbers: { spectrumId: number; name: string; part: string; lambdaMaxNm: number | null; longestWavelengthBandNm: number | null; epsilon: Float64Array }[] = [];
	for (const r of await listGroupAbsorberCurves(groupId, caller.reader)) {
		try {
			absorbers.push({ spectrumId: r.id, name: r.name, part: r.part, lambdaMaxNm: r.lambda_max_nm, longestWavelengthBandNm: r.longest_band_nm ?? null, epsilon: epsilonOnGrid(r as SpectrumRow, 'spectrum') });
		} catch (e) {
			skipped.push({ kind: 'spectrum', id: r.id, name: r.name, reason: (e as Error).message });
		}
	}
	const m = computeAbsorberMatrix({
		stepNm: GRID.stepNm,
		pathCm: c.pathCm,
		concentrationM: c.concentrationM,
		solventAbsorbancePerCm: solvent.absorbancePerCm,
		wallTransmission: wall.transmission,
		lamps: lamps.map((l) => ({ id: String(l.id), name: l.name, photonFluxPerNm: l.photonFluxPerNm })),
		absorbers: absorbers.map((a) => ({ id: String(a.spectrumId), epsilon: a.epsilon }))
	});
	const plans = new Map<string, { id: number; state: PlanState; title: string }[]>();
	for (const p of await listPlanPairs(groupId)) {
		const key = `${p.lampId}:${p.absorberSpectrumId}`;
		plans.set(key, [...(plans.get(key) ?? []), { id: p.id, state: p.state, title: p.title }]);
	}
	const cells = [];
	for (let a = 0; a < absorbers.length; a++) {
		for (let l = 0; l < lamps.length; l++) {
			const i = a * lamps.length + l;
			cells.push({
				lampId: lamps[l].id,
				spectrumId: absorbers[a].spectrumId,
				absorbedPhotonFluxEinsteinPerS: m.absorbedPhotonFluxEinsteinPerS[i],
				selectivity: m.selectivity[i],
				fractionOfLampPhotons: m.lampFluxEinsteinPerS[l] > 0 ? m.absorbedPhotonFluxEinsteinPerS[i] / m.lampFluxEinsteinPerS[l] : 0,
				plans: plans.get(`${lamps[l].id}:${absorbers[a].spectrumId}`) ?? []
			});
		}
	}
	return {
		groupId,
		conditions: {
			solvent: { id: solvent.solvent.id, name: solvent.solvent.name, basis: solvent.basis },
			wall: { materialId: wall.material.id, name: wall.material.name, thicknessMm: c.thicknessMm },
			pathCm: c.pathCm,
			concentrationM: c.concentrationM,
			defaultsFrom: c.source,
			model: 'slab vessel lit face-on; each absorber alone at this concentration in the solvent; lamp photon flux at the vessel from its model or latest calibration'
		},
		lamps: lamps.map((l) => ({ id: l.id, name: l.name, peakNm: l.peakNm, photonFluxBasis: l.basis.basis, photonFluxBasisLabel: l.basis.label, photonFluxEinsteinPerS: m.lampFluxEinsteinPerS[lamps.indexOf(l)] })),
		absorbers: absorbers.map((a) => ({ spectrumId: a.spectrumId, name: a.name, part: a.part, lambdaMaxNm: a.lambdaMaxNm, longestWavelengthBandNm: a.longestWavelengthBandNm })),
		cells,
		skipped,
		computeMs: Math.round(performance.now() - started)
	};
}
