import { z } from 'zod';

/**
 * POST /api/window body (API.md). Types and shapes are checked here (400); physically impossible numbers — negative
 * concentrations, a path ≤ 0 — are checked by `windowPhysicsIssues` (422), so the two statuses stay distinct.
 */
const id = z.number({ error: 'must be an id (a positive integer)' }).int('must be an integer id').positive('must be a positive id');
const number = z.number({ error: 'must be a number' }).refine(Number.isFinite, 'must be a finite number');

export const windowRequestSchema = z.object({
	substrate: z.object({ spectrumId: id, concentrationM: number, tripletEnergyKJPerMol: number.optional() }),
	others: z.array(z.object({ spectrumId: id, concentrationM: number })).max(12, 'at most 12 other absorbers').optional(),
	product: z.object({ spectrumId: id, productPerSubstrate: number.optional() }).optional(),
	solvent: z.object({ id }),
	wall: z.object({ materialId: id, thicknessMm: number }),
	pathCm: number,
	lamps: z.array(id).max(60, 'at most 60 lamps').optional(),
	quantumYield: number.optional(),
	amountMol: number.optional(),
	volumeL: number.optional(),
	thresholds: z
		.object({
			minWallTransmission: number.optional(),
			maxSolventAbsorbance: number.optional(),
			minSubstrateAbsorbance: number.optional(),
			minSelectivity: number.optional()
		})
		.optional(),
	/** Extra combinations to rank against the chosen wall and solvent. */
	rank: z
		.object({
			walls: z.array(z.object({ materialId: id, thicknessMm: number })).max(12).optional(),
			solvents: z.array(id).max(40).optional()
		})
		.optional(),
	flow: z.object({ reactorVolumeMl: number, flowRateMlPerMin: number }).optional(),
	sensitiserMarginKJPerMol: number.optional(),
	includeCurves: z.boolean().optional()
});
export type WindowRequest = z.infer<typeof windowRequestSchema>;

/** Physically impossible inputs (→ 422 with the field). */
export function windowPhysicsIssues(r: WindowRequest): { field: string; message: string }[] {
	const out: { field: string; message: string }[] = [];
	const nonNeg = (field: string, v: number | undefined) => v !== undefined && v < 0 && out.push({ field, message: `${field} must not be negative` });
	const pos = (field: string, v: number | undefined) => v !== undefined && v <= 0 && out.push({ field, message: `${field} must be above 0` });
	nonNeg('substrate.concentrationM', r.substrate.concentrationM);
	r.others?.forEach((o, i) => nonNeg(`others[${i}].concentrationM`, o.concentrationM));
	pos('pathCm', r.pathCm);
	pos('wall.thicknessMm', r.wall.thicknessMm);
	if (r.wall.thicknessMm > 100) out.push({ field: 'wall.thicknessMm', message: 'wall.thicknessMm must be at most 100 mm' });
	pos('quantumYield', r.quantumYield);
	if (r.quantumYield !== undefined && r.quantumYield > 2) out.push({ field: 'quantumYield', message: 'quantumYield above 2 is not a single-photon process; use the chain-free Φ' });
	pos('amountMol', r.amountMol);
	pos('volumeL', r.volumeL);
	r.rank?.walls?.forEach((w, i) => pos(`rank.walls[${i}].thicknessMm`, w.thicknessMm));
	if (r.flow) {
		pos('flow.reactorVolumeMl', r.flow.reactorVolumeMl);
		pos('flow.flowRateMlPerMin', r.flow.flowRateMlPerMin);
	}
	const t = r.thresholds ?? {};
	for (const [k, v] of Object.entries(t)) nonNeg(`thresholds.${k}`, v);
	if (t.minWallTransmission !== undefined && t.minWallTransmission > 1) out.push({ field: 'thresholds.minWallTransmission', message: 'a transmission threshold is a fraction ≤ 1' });
	if (t.minSelectivity !== undefined && t.minSelectivity > 1) out.push({ field: 'thresholds.minSelectivity', message: 'a selectivity threshold is a fraction ≤ 1' });
	return out;
}
