import { z } from 'zod';

const id = z.number({ error: 'must be an id (a positive integer)' }).int('must be an integer id').positive('must be a positive id');
const number = z.number({ error: 'must be a number' }).refine(Number.isFinite, 'must be a finite number');
const version = z.number({ error: 'version is required (the version you loaded)' }).int('version must be an integer').positive('version must be positive');

/**
 * What was decided (API.md "Lead's audit"): the chosen lamp, wall and thickness, solvent, path, intended irradiation
 * time and safety measures; temperature and notes are optional extras for the report. Physically impossible numbers
 * are refused with 422 by the plan service (same split as POST /api/window).
 */
export const planDecisionSchema = z.object({
	lampId: id,
	wall: z.object({ materialId: id, thicknessMm: number }),
	solventId: id,
	/** Slab depth; null for round vessels (their geometry is in the inputs' `vessel`). */
	pathCm: number.nullable().optional(),
	irradiationTimeS: number.nullable().optional(),
	safetyMeasures: z.string().trim().max(4000, 'safetyMeasures must be at most 4000 characters').nullable().optional(),
	temperatureC: number.nullable().optional(),
	notes: z.string().trim().max(4000, 'notes must be at most 4000 characters').nullable().optional()
});
export type PlanDecisionInput = z.infer<typeof planDecisionSchema>;

/** On save every decision field may be left out: the plan takes wall, solvent and path from its inputs and the best-ranked lamp. */
export const planDecisionDraftSchema = planDecisionSchema.partial();

/** POST /api/plans: a title, the Window finder inputs (the POST /api/window body), an optional decision and idempotency key. */
export const planCreateSchema = z.object({
	title: z.string({ error: 'title is required' }).trim().min(1, 'title is required').max(200, 'title must be at most 200 characters'),
	inputs: z.record(z.string(), z.unknown(), { error: 'inputs must be the Window finder request (an object)' }),
	query: z.string().max(4000, 'query must be at most 4000 characters').optional(),
	groupId: id.optional(),
	decision: planDecisionDraftSchema.optional(),
	/** A UUID the save form generates once per form; a repeated key returns the plan saved the first time. */
	idempotencyKey: z.uuid({ error: 'idempotencyKey must be a UUID' }).optional()
});
export type PlanCreateInput = z.infer<typeof planCreateSchema>;

/** PATCH /api/plans/:id (the author, while draft or returned). */
export const planPatchSchema = z.object({
	title: z.string().trim().min(1, 'title must not be empty').max(200, 'title must be at most 200 characters').optional(),
	inputs: z.record(z.string(), z.unknown()).optional(),
	query: z.string().max(4000).optional(),
	decision: planDecisionDraftSchema.optional(),
	version
});

/** submit / approve / return: an optional comment (required when returning) and the version the reviewer saw. */
export const planReviewSchema = z.object({
	comment: z.string().trim().max(4000, 'comment must be at most 4000 characters').optional(),
	version: version.optional()
});

/** POST /api/plans/:id/comments */
export const planCommentSchema = z.object({
	body: z.string({ error: 'body is required' }).trim().min(1, 'body: write a comment').max(4000, 'body must be at most 4000 characters')
});

/** POST /api/plans/:id/recompute */
export const planRecomputeSchema = z
	.object({ save: z.boolean().optional(), version: version.optional() })
	.refine((b) => !b.save || b.version !== undefined, { message: 'version is required to save a recomputation', path: ['version'] });

/** GET /api/plans filters. */
export const planListQuerySchema = z.object({
	state: z.enum(['draft', 'submitted', 'approved', 'returned'], { error: 'state must be draft, submitted, approved or returned' }).optional(),
	lamp: z.coerce.number().int().positive('lamp must be a lamp id').optional(),
	substrate: z.coerce.number().int().positive('substrate must be a spectrum id').optional()
});
