/** Shapes `spectra` rows for the API and the pages (camelCase, units in names, JSON columns parsed). */
import type { SpectrumRow } from '../db/spectra';
import { derivedForApi } from './spectraDerivedView';

const parseJson = <T>(s: string | null | undefined, fallback: T): T => {
	if (!s) return fallback;
	try {
		return JSON.parse(s) as T;
	} catch {
		return fallback;
	}
};

/** A peak as API.md names it: ε for molar spectra, absorbance when known, the raw value always. */
export interface ApiPeak {
	wavelengthNm: number;
	value: number;
	epsilon?: number;
	absorbance?: number;
}

/** Peaks with ε and/or absorbance filled in from the stored unit, concentration and path (Beer–Lambert A = ε·c·l). */
export function peaksForApi(row: Pick<SpectrumRow, 'peaks' | 'y_unit' | 'concentration_m' | 'path_cm'>): ApiPeak[] {
	const peaks = parseJson<{ wavelengthNm: number; value: number }[]>(row.peaks, []);
	const cl = row.concentration_m && row.path_cm ? row.concentration_m * row.path_cm : null;
	return peaks.map((p) => {
		if (row.y_unit === 'epsilon') return { ...p, epsilon: p.value, ...(cl ? { absorbance: p.value * cl } : {}) };
		if (row.y_unit === 'absorbance') return { ...p, absorbance: p.value };
		return p;
	});
}

/** The API/page view of a spectrum (no points, no file bytes). */
export function spectrumToApi(row: SpectrumRow, tags: string[] = [], extra: { canEdit?: boolean } = {}) {
	return {
		id: Number(row.id),
		name: row.name,
		synonyms: parseJson<string[]>(row.synonyms, []),
		cas: row.cas,
		part: row.part,
		kind: row.kind,
		solvent: row.solvent,
		concentrationM: row.concentration_m,
		pathCm: row.path_cm,
		thicknessMm: row.thickness_mm,
		temperatureC: row.temperature_c,
		instrument: row.instrument,
		notes: row.notes,
		tags,
		visibility: row.visibility,
		groupId: Number(row.group_id),
		groupName: row.group_name ?? null,
		groupSlug: row.group_slug ?? null,
		ownerId: row.owner_id,
		ownerName: row.owner_name ?? null,
		yUnit: row.y_unit,
		xUnitOriginal: row.x_unit_original,
		yUnitOriginal: row.y_unit_original,
		pointCount: row.point_count,
		lambdaMaxNm: row.lambda_max_nm,
		valueAtMax: row.value_at_max,
		...derivedForApi(row),
		epsilonAtMax: row.y_unit === 'epsilon' ? row.value_at_max : null,
		edgeNm: row.edge_nm,
		cutoff10Nm: row.cutoff10_nm,
		cutoff50Nm: row.cutoff50_nm,
		peaks: peaksForApi(row),
		tripletEnergyKjPerMol: row.triplet_energy_kj_per_mol,
		excitedStatePotentials: parseJson<{ label: string; volts: number; reference: string }[]>(row.excited_state_potentials, []),
		warnings: parseJson<{ code: string; message: string; line?: number }[]>(row.warnings, []),
		fileName: row.file_name,
		fileSha256: row.file_sha256,
		blockIndex: row.block_index,
		blockLabel: row.block_label,
		/** Time series: the spectrum's time in seconds (rows-as-spectra tables), else null. */
		blockTimeS: row.block_time_s ?? null,
		version: row.version,
		deletedAt: row.deleted_at ? new Date(row.deleted_at).toISOString() : null,
		createdAt: new Date(row.created_at).toISOString(),
		updatedAt: new Date(row.updated_at).toISOString(),
		...(extra.canEdit !== undefined ? { canEdit: extra.canEdit } : {})
	};
}

export type ApiSpectrum = ReturnType<typeof spectrumToApi>;
