import { wallCutoffsNm, wallTransmissionOnGrid } from '$lib/irradiation/walls';
import type { WallMaterial } from '$lib/server/db/wallMaterials';
import { ApiError } from '$lib/server/http';

/** Grid of the transmission curves served to pages: 190–1100 nm, 1 nm. */
export const TRANSMISSION_GRID = { fromNm: 190, stepNm: 1, count: 911 } as const;

/** Parses `thicknessMm` from a query value: default = the material's typical thickness; 0 < d ≤ 100 mm. */
export function parseThicknessMm(raw: string | null, material: WallMaterial): number {
	if (raw === null || raw === '') return material.typicalThicknessMm ?? 2;
	const d = Number(raw.replace(',', '.'));
	if (!Number.isFinite(d)) throw new ApiError(400, 'invalid', 'thicknessMm must be a number of millimetres.', { field: 'thicknessMm' });
	if (d <= 0 || d > 100) throw new ApiError(422, 'out_of_range', 'thicknessMm must be above 0 and at most 100 mm.', { field: 'thicknessMm' });
	return d;
}

/** The wall's total transmittance (Fresnel included) on the 1 nm grid, its 10 % / 50 % cut-offs and, when null, why. */
export function wallTransmissionCurve(material: WallMaterial, thicknessMm: number) {
	const { fromNm, stepNm, count } = TRANSMISSION_GRID;
	const y = wallTransmissionOnGrid(material.model, thicknessMm, fromNm, stepNm, count);
	const x = Array.from({ length: count }, (_, i) => fromNm + i * stepNm);
	const c = wallCutoffsNm(material.model, thicknessMm);
	return {
		x,
		y: Array.from(y, (v) => Math.round(v * 1e6) / 1e6),
		cutoff10Nm: c.cutoff10Nm,
		cutoff50Nm: c.cutoff50Nm,
		// why a cut-off is null: "below the data range, T(300 nm) = 81 %" (the data limit is never reported as a cut-off)
		cutoff10Note: c.cutoff10Note ?? null,
		cutoff50Note: c.cutoff50Note ?? null,
		dataFromNm: Number.isFinite(c.dataFromNm) ? c.dataFromNm : null
	};
}
