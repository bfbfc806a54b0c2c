import { z } from 'zod';

/** POST /api/plans: a title and the Window finder inputs (the POST /api/window body); results are recomputed on the server. */
export const planCreateSchema = z.object({
	title: z.string().trim().min(1, 'title is required').max(200, 'title must be at most 200 characters'),
	inputs: z.record(z.string(), z.unknown()),
	query: z.string().max(4000).optional(),
	groupId: z.number().int().positive().optional()
});

/** PATCH /api/plans/:id (owner, while draft or returned). */
export const planPatchSchema = z.object({
	title: z.string().trim().min(1).max(200).optional(),
	inputs: z.record(z.string(), z.unknown()).optional(),
	version: z.number().int().positive('version is required').optional()
});

/** approve / return: a comment (required when returning). */
export const planReviewSchema = z.object({ comment: z.string().trim().max(4000).optional(), version: z.number().int().positive().optional() });
