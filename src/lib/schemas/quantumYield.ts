import { z } from 'zod';

/** POST /api/quantum-yield body: an irradiation series, a lamp and the vessel (400 for shapes; physics checked in the core). */
const id = z.number({ error: 'must be an id (a positive integer)' }).int('must be an integer id').positive('must be a positive id');
const number = z.number({ error: 'must be a number' }).refine(Number.isFinite, 'must be a finite number');

export const quantumYieldRequestSchema = z.object({
	spectrumIds: z.array(id).max(500, 'at most 500 spectra'),
	timesS: z.array(number).max(500),
	lampId: id,
	reactant: z.object({ spectrumId: id }),
	product: z.object({ spectrumId: id }).optional(),
	reaction: z.object({ type: z.enum(['direct', 'reversible'], { error: 'reaction.type must be direct or reversible' }) }).optional(),
	volumeL: number,
	pathCm: number,
	wall: z.object({ materialId: id, thicknessMm: number }),
	fromNm: number.optional(),
	toNm: number.optional(),
	/** Relative standard uncertainty of the lamp's photon flux; default from its basis (calibrated 0.05, model 0.3). */
	calibrationRelativeUncertainty: number.optional(),
	/** Store the result on the reactant's spectrum (member+ of its group). */
	save: z.boolean().optional(),
	notes: z.string().max(2000).optional()
});
export type QuantumYieldRequest = z.infer<typeof quantumYieldRequestSchema>;
