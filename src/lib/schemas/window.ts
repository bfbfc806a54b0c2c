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
	/** Depth of the flat layer (slab vessel, the default); not used for round vessels. */
	pathCm: number.optional(),
	/** Reaction mode (API.md "Reaction modes, vessels and photostationary states"); default direct. */
	reaction: z
		.discriminatedUnion('type', [
			z.object({ type: z.literal('direct') }),
			z.object({
				type: z.literal('photocatalytic'),
				photocatalyst: z.object({ spectrumId: id, concentrationM: number, bleachingQuantumYield: number.optional() })
			}),
			z.object({
				type: z.literal('reversible'),
				product: z.object({ spectrumId: id }, { error: 'a reversible reaction needs the product spectrum: { spectrumId }' }),
				quantumYieldBack: number,
				thermalBackRateConstantPerS: number.optional()
			})
		], { error: 'reaction.type must be direct, photocatalytic or reversible' })
		.optional(),
	vessel: z
		.discriminatedUnion('shape', [
			z.object({ shape: z.literal('slab') }),
			z.object({ shape: z.literal('cylinder'), innerDiameterCm: number }),
			z.object({ shape: z.literal('annulus'), innerDiameterCm: number, outerDiameterCm: number })
		], { error: 'vessel.shape must be slab, cylinder or annulus' })
		.optional(),
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

/** Missing fields that depend on another field (→ 400): a flat vessel needs pathCm. */
export function windowShapeIssues(r: WindowRequest): { field: string; message: string }[] {
	if ((!r.vessel || r.vessel.shape === 'slab') && r.pathCm === undefined) return [{ field: 'pathCm', message: 'pathCm: a flat vessel (the default) needs its depth pathCm in cm; for a round vessel give vessel: { shape: "cylinder", innerDiameterCm }' }];
	return [];
}

/** Physically impossible inputs (→ 422 with the field). */
export function windowPhysicsIssues(r: WindowRequest): { field: string; message: string }[] {
	const out: { field: string; message: string }[] = [];
	const nonNeg = (field: string, v: number | undefined) => v !== undefined && v < 0 && out.push({ field, message: `${field} must not be negative` });
	const pos = (field: string, v: number | undefined) => v !== undefined && v <= 0 && out.push({ field, message: `${field} must be above 0` });
	// Φ > 1 is a chain (photochlorination, radical polymerisation); the longest chains reach ~10⁴ (API.md)
	const maxPhi = (field: string, v: number | undefined) => v !== undefined && v > 1e4 && out.push({ field, message: `${field} must be at most 10⁴ (the longest radical chains); got ${v}` });
	nonNeg('substrate.concentrationM', r.substrate.concentrationM);
	r.others?.forEach((o, i) => nonNeg(`others[${i}].concentrationM`, o.concentrationM));
	pos('pathCm', r.pathCm);
	const v = r.vessel;
	if (v && v.shape !== 'slab') {
		for (const [k, d] of Object.entries(v)) if (k !== 'shape') {
			pos(`vessel.${k}`, d as number);
			if ((d as number) > 1000) out.push({ field: `vessel.${k}`, message: `vessel.${k} must be at most 1000 cm` });
		}
		if (v.shape === 'annulus' && v.innerDiameterCm > 0 && !(v.outerDiameterCm > v.innerDiameterCm)) {
			out.push({ field: 'vessel.outerDiameterCm', message: `vessel.outerDiameterCm (${v.outerDiameterCm} cm) must be larger than vessel.innerDiameterCm (${v.innerDiameterCm} cm): the liquid fills the gap between them` });
		}
	}
	if (r.pathCm !== undefined && r.pathCm > 1000) out.push({ field: 'pathCm', message: 'pathCm must be at most 1000 cm' });
	const rx = r.reaction;
	if (rx?.type === 'photocatalytic') {
		pos('reaction.photocatalyst.concentrationM', rx.photocatalyst.concentrationM);
		nonNeg('reaction.photocatalyst.bleachingQuantumYield', rx.photocatalyst.bleachingQuantumYield);
		maxPhi('reaction.photocatalyst.bleachingQuantumYield', rx.photocatalyst.bleachingQuantumYield);
	} else if (rx?.type === 'reversible') {
		nonNeg('reaction.quantumYieldBack', rx.quantumYieldBack);
		maxPhi('reaction.quantumYieldBack', rx.quantumYieldBack);
		nonNeg('reaction.thermalBackRateConstantPerS', rx.thermalBackRateConstantPerS);
	}
	pos('wall.thicknessMm', r.wall.thicknessMm);
	if (r.wall.thicknessMm > 100) out.push({ field: 'wall.thicknessMm', message: 'wall.thicknessMm must be at most 100 mm' });
	pos('quantumYield', r.quantumYield);
	maxPhi('quantumYield', r.quantumYield);
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
