import { z } from 'zod';

/**
 * Lamp input shared by the /lamps form actions and /api/lamps (API.md). `model.type: 'spectrum'` points at a measured
 * emission spectrum in the library; the other types are emission models (src/lib/irradiation/lamps.ts).
 */
const positive = (what: string) => z.number({ error: `${what} must be a number` }).positive(`${what} must be above 0`);
const nm = (what: string) => positive(what).max(2000, `${what} must be at most 2000 nm`);

export const lampModelSchema = z.discriminatedUnion('type', [
	z.object({
		type: z.literal('led'),
		peakNm: nm('peakNm').min(200, 'peakNm must be at least 200 nm'),
		fwhmNm: positive('fwhmNm').max(200, 'fwhmNm must be at most 200 nm'),
		shape: z.enum(['gaussian', 'ohno']).optional(),
		skew: z.number().gt(-1).lt(1).optional()
	}),
	z.object({
		type: z.enum(['mercury-low-pressure', 'mercury-medium-pressure']),
		ozoneFree: z.boolean().optional(),
		lineWidthNm: positive('lineWidthNm').max(20).optional(),
		powerWithout185nm: z.boolean().optional()
	}),
	z.object({
		type: z.literal('excimer'),
		emitter: z.enum(['Xe2', 'KrCl', 'KrF', 'XeBr', 'XeCl', 'XeF']),
		fwhmNm: positive('fwhmNm').max(60).optional()
	}),
	z.object({ type: z.literal('laser'), lineNm: nm('lineNm').min(150), widthNm: positive('widthNm').max(10).optional() }),
	z.object({
		type: z.literal('blackbody'),
		temperatureK: positive('temperatureK').min(500, 'temperatureK must be at least 500 K').max(20000),
		fromNm: nm('fromNm').optional(),
		toNm: nm('toNm').optional()
	}),
	z.object({ type: z.literal('xenon') }),
	z.object({
		type: z.literal('phosphor'),
		peakNm: nm('peakNm').min(200),
		fwhmNm: positive('fwhmNm').max(200),
		mercuryLines: z.boolean().optional()
	}),
	z.object({ type: z.literal('spectrum'), spectrumId: z.number().int().positive(), floor: z.enum(['remove', 'keep']).optional() })
]);
export type LampModelInput = z.infer<typeof lampModelSchema>;

export const lampCreateSchema = z.object({
	name: z.string().trim().min(1, 'name is required').max(160),
	powerW: z.number({ error: 'powerW must be a number of watts' }).positive('powerW must be above 0 W').max(100000),
	model: lampModelSchema,
	couplingFactor: z.number().gt(0, 'couplingFactor must be above 0').max(1, 'couplingFactor is a fraction (at most 1)').optional(),
	distanceNote: z.string().trim().max(255).optional(),
	/** Where a person works, cm from the emitting surface: the cautions then give the irradiance there. */
	exposureDistanceCm: z.number({ error: 'exposureDistanceCm must be a number of centimetres' }).positive('exposureDistanceCm must be above 0 cm').max(10000, 'exposureDistanceCm is at most 10000 cm (100 m)').nullable().optional(),
	/** A radiometer reading at that distance over the lamp's whole optical band, W m⁻². */
	exposureIrradianceWPerM2: z.number({ error: 'exposureIrradianceWPerM2 must be a number of W m⁻²' }).positive('exposureIrradianceWPerM2 must be above 0 W m⁻²').max(1e6).nullable().optional(),
	notes: z.string().trim().max(4000).optional(),
	groupId: z.number().int().positive().optional()
});
export type LampCreateInput = z.infer<typeof lampCreateSchema>;

export const lampPatchSchema = lampCreateSchema.omit({ groupId: true }).partial().extend({ version: z.number().int().positive().optional() });
export type LampPatchInput = z.infer<typeof lampPatchSchema>;
