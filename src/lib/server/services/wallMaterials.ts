/**
 * A group's own wall material from a measured transmission spectrum in the library (their reactor tubing):
 * the curve T₀(λ) at the stated thickness d₀ becomes a `measured` wall model, scaled to other thicknesses by
 * T(d) = (1 − R)²·(T₀/(1 − R)²)^(d/d₀) (PRODUCT.md).
 */
import { z } from 'zod';
import { getWallMaterial, insertWallMaterial } from '$lib/server/db/wallMaterials';
import { bufferToFloat64 } from '$lib/server/db/spectraBlobs';
import { ApiError, zodToApiError } from '$lib/server/http';
import { requireGroupRole } from '$lib/server/policy';
import { visibleSpectrum } from './spectraAccess';
import { requireMemberSomewhere } from './groupChoice';

export const wallMaterialCreateSchema = z.object({
	name: z.string().trim().min(1, 'name is required').max(160),
	spectrumId: z.number({ error: 'spectrumId must be a spectrum id' }).int().positive(),
	thicknessMm: z.number({ error: 'thicknessMm must be a number of millimetres' }).positive('thicknessMm must be above 0 mm').max(100),
	refractiveIndex: z.number().min(1, 'refractiveIndex must be at least 1').max(4, 'refractiveIndex must be at most 4').optional(),
	notes: z.string().trim().max(2000).optional()
});

/** Creates the material in the spectrum's group (member+); 422 when the spectrum is not a transmission spectrum. */
export async function addWallMaterialFromSpectrum(locals: App.Locals, body: unknown) {
	await requireMemberSomewhere(locals);
	const parsed = wallMaterialCreateSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error);
	const input = parsed.data;
	let row;
	try {
		row = (await visibleSpectrum(locals, String(input.spectrumId))).row;
	} catch (e) {
		if (e instanceof ApiError && e.status === 404) throw new ApiError(422, 'unknown_spectrum', `spectrumId ${input.spectrumId} is not a spectrum you can see.`, { field: 'spectrumId' });
		throw e;
	}
	const groupId = Number(row.group_id);
	await requireGroupRole(locals, groupId, 'member');
	if (row.kind !== 'transmission') {
		throw new ApiError(422, 'not_transmission', `Spectrum ${input.spectrumId} is a ${row.kind} spectrum; a wall needs a transmission spectrum.`, { field: 'spectrumId' });
	}
	const x = bufferToFloat64(row.x_nm);
	const t = bufferToFloat64(row.y_normalised);
	const wavelengthNm: number[] = [];
	const transmittance: number[] = [];
	for (let i = 0; i < x.length; i++) {
		if (!Number.isFinite(x[i]) || !Number.isFinite(t[i])) continue;
		wavelengthNm.push(x[i]);
		transmittance.push(Math.min(1, Math.max(0, t[i])));
	}
	if (wavelengthNm.length < 5) throw new ApiError(422, 'too_few_points', 'The spectrum has fewer than 5 usable points.', { field: 'spectrumId' });
	const n = input.refractiveIndex ?? 1.5;
	const slug = `group-${groupId}-${input.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '')}-${Date.now().toString(36)}`;
	const id = await insertWallMaterial({
		slug: slug.slice(0, 80),
		name: input.name,
		model: { model: 'measured', wavelengthNm, transmittance, thicknessMm: input.thicknessMm, n },
		refractiveIndex: n,
		typicalThicknessMm: input.thicknessMm,
		source: `measured by the group: library spectrum #${row.id} “${row.name}” at ${input.thicknessMm} mm`,
		status: 'measured',
		notes: input.notes ?? (input.refractiveIndex ? null : 'n = 1.5 assumed for the Fresnel correction.'),
		groupId,
		spectrumId: row.id,
		createdBy: locals.user!.id
	});
	const m = (await getWallMaterial(id, [groupId]))!;
	return { id: m.id, name: m.name, source: m.source, status: m.status, thicknessMm: input.thicknessMm, refractiveIndex: n, groupId };
}
