import { z } from 'zod';

/**
 * POST /api/actinometry and POST /api/lamps/:id/calibrations (API.md "Actinometry"). Types only here (400 when a field is
 * missing or not a number); impossible values (≤ 0, aliquot above volumes, ΔA beyond the linear range) are 422s from
 * src/lib/irradiation/actinometry.ts, each naming its field.
 */
// zodToApiError prefixes each message with the field's path.
const num = (_field: string) => z.number({ error: 'must be a number' }).refine(Number.isFinite, 'must be a finite number');
const physical = (field: string) => num(field).refine((v) => v > 0, 'must be above zero');

const vessel = z.object(
	{
		materialId: z.number({ error: 'must be a wall material id' }).int().positive(),
		thicknessMm: physical('vessel.thicknessMm').refine((v) => v <= 50, 'must be at most 50 mm'),
		pathCm: physical('vessel.pathCm').refine((v) => v <= 100, 'must be at most 100 cm')
	},
	{ error: 'vessel: give { materialId, thicknessMm, pathCm } of the irradiation vessel' }
);

const common = {
	measuredAt: z.string().trim().max(40).optional(),
	notes: z.string().trim().max(4000).optional(),
	operator: z.string().trim().max(160).optional()
};

export const actinometryRequestSchema = z.object({
	lampId: z.number({ error: 'must be a lamp id' }).int().positive(),
	actinometer: z.string({ error: 'must be a name from GET /api/actinometers' }).trim().min(1).max(40),
	concentrationM: num('concentrationM'),
	irradiatedVolumeMl: num('irradiatedVolumeMl'),
	aliquotVolumeMl: num('aliquotVolumeMl'),
	finalVolumeMl: num('finalVolumeMl'),
	deltaAbsorbance: num('deltaAbsorbance'),
	readoutPathCm: num('readoutPathCm').optional(),
	irradiationTimeS: num('irradiationTimeS'),
	absorbanceAtIrradiation: num('absorbanceAtIrradiation').optional(),
	quantumYield: num('quantumYield').optional(),
	vessel,
	...common
});
export type ActinometryRequest = z.infer<typeof actinometryRequestSchema>;

export const radiometerRequestSchema = z.object({
	kind: z.literal('radiometer', { error: "kind must be 'radiometer' (actinometry runs go to POST /api/actinometry)" }),
	opticalPowerW: physical('opticalPowerW').refine((v) => v <= 1e5, 'must be at most 100 kW'),
	vessel: z.object({
		materialId: z.number({ error: 'must be a wall material id' }).int().positive(),
		thicknessMm: physical('vessel.thicknessMm').refine((v) => v <= 50, 'must be at most 50 mm'),
		pathCm: physical('vessel.pathCm').optional()
	}),
	...common
});
export type RadiometerRequest = z.infer<typeof radiometerRequestSchema>;
