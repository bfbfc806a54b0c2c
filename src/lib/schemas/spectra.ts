/**
 * zod schemas of the Library, shared by the form actions, the upload page and /api/spectra.
 * Units live in the field names (API.md): concentrationM (mol L⁻¹), pathCm, thicknessMm,
 * temperatureC, tripletEnergyKjPerMol (kJ mol⁻¹), excited-state potentials in V.
 */
import { z } from 'zod';

export const PARTS = ['substrate', 'photocatalyst', 'product', 'additive', 'solvent', 'wall', 'filter', 'lamp'] as const;
export const KINDS = ['absorption', 'transmission', 'emission', 'reflectance'] as const;
export const VISIBILITIES = ['private', 'group', 'public'] as const;
export const X_UNITS = ['nm', 'cm-1', 'um'] as const;
export const Y_UNITS = ['absorbance', 'epsilon', 'log-epsilon', 'transmittance', 'transmittance-percent', 'reflectance', 'reflectance-percent', 'relative', 'W/nm', 'W/m2/nm', 'umol/s/nm', 'umol/m2/s/nm', 'counts'] as const;
export const SORTS = ['name', 'part', 'lambdaMaxNm', 'createdAt', 'updatedAt', 'solvent', 'owner'] as const;

export type Part = (typeof PARTS)[number];
export type Visibility = (typeof VISIBILITIES)[number];

/**
 * CAS Registry Number check digit: the last digit equals the sum of the other digits, each times
 * its position counted from the right (1, 2, 3 …), modulo 10 (CAS, "Check Digit Verification of CAS Registry Numbers").
 */
export function isValidCas(cas: string): boolean {
	const m = /^(\d{2,7})-(\d{2})-(\d)$/.exec(cas.trim());
	if (!m) return false;
	const digits = (m[1] + m[2]).split('').reverse();
	const sum = digits.reduce((s, d, i) => s + Number(d) * (i + 1), 0);
	return sum % 10 === Number(m[3]);
}

const text = (max: number) => z.string().trim().max(max);
const optionalText = (max: number) => z.preprocess((v) => (v === '' ? null : v), text(max).nullable().optional());
const optionalNumber = z.preprocess((v) => (v === '' ? null : v), z.coerce.number().refine(Number.isFinite, 'must be a number').nullable().optional());

export const casSchema = z.preprocess(
	(v) => (v === '' ? null : v),
	z.string().trim().refine(isValidCas, 'not a valid CAS number (format 1234-56-7 with a correct check digit)').nullable().optional()
);

export const potentialSchema = z.object({
	label: text(60).min(1, 'name the couple, e.g. E(PC*/PC−)'),
	volts: z.number().refine(Number.isFinite, 'must be a number').refine((v) => Math.abs(v) <= 10, 'outside ±10 V'),
	reference: text(40).default('SCE')
});

/** The descriptive fields a user may set at upload and edit later. */
export const spectrumFieldsSchema = z.object({
	name: text(200).min(1, 'give the spectrum a name').optional(),
	synonyms: z.array(text(200).min(1)).max(30).optional(),
	cas: casSchema,
	part: z.enum(PARTS).optional(),
	solvent: optionalText(120),
	concentrationM: optionalNumber,
	pathCm: optionalNumber,
	thicknessMm: optionalNumber,
	temperatureC: optionalNumber.refine((v) => v == null || v >= -273.15, 'below absolute zero'),
	instrument: optionalText(200),
	notes: optionalText(5000),
	tags: z.array(text(60).min(1)).max(30).optional(),
	visibility: z.enum(VISIBILITIES).optional(),
	tripletEnergyKjPerMol: optionalNumber,
	excitedStatePotentials: z.array(potentialSchema).max(10).optional()
});
export type SpectrumFields = z.infer<typeof spectrumFieldsSchema>;

/** POST /api/spectra `metadata` (API.md) plus the descriptive fields. What it says wins over the file. */
export const uploadMetadataSchema = spectrumFieldsSchema.extend({
	kind: z.enum(KINDS).optional(),
	columns: z.array(z.number().int().min(0)).min(1).optional(),
	xUnit: z.enum(X_UNITS).optional(),
	yUnit: z.enum(Y_UNITS).optional(),
	/** Delimited text: one spectrum per column or per row (default: detected from the table). */
	layout: z.enum(['columns', 'rows']).optional(),
	/** Group to store in (id or slug); default: the caller's first group where they are member+. */
	group: z.union([z.number().int().positive(), z.string().min(1)]).optional(),
	/** Per-spectrum names for multi-spectrum files, by position in the parsed result. */
	names: z.array(text(200)).optional()
});
export type UploadMetadata = z.infer<typeof uploadMetadataSchema>;

/** PATCH /api/spectra/:id: any descriptive field plus the version the client last saw. */
export const spectrumPatchSchema = spectrumFieldsSchema.extend({
	version: z.coerce.number().int().positive('send the version you last read')
});
export type SpectrumPatch = z.infer<typeof spectrumPatchSchema>;

const qNum = z.preprocess((v) => (v === '' || v == null ? undefined : v), z.coerce.number().refine(Number.isFinite, 'must be a number').optional());
const qStr = z.preprocess((v) => (v === '' || v == null ? undefined : v), z.string().trim().max(200).optional());

/** GET /api/spectra query (API.md) plus sort, dir, owner, visibility, transparentAbove. */
export const spectrumListQuerySchema = z.object({
	q: qStr,
	part: z.preprocess((v) => (v === '' || v == null ? undefined : v), z.enum(PARTS).optional()),
	kind: z.preprocess((v) => (v === '' || v == null ? undefined : v), z.enum(KINDS).optional()),
	absorbsAt: qNum.refine((v) => v === undefined || (v >= 190 && v <= 1100), 'between 190 and 1100 nm'),
	minAbsorbance: qNum,
	minEpsilon: qNum,
	transparentAbove: qNum.refine((v) => v === undefined || (v >= 190 && v <= 1100), 'between 190 and 1100 nm'),
	solvent: qStr,
	group: qStr,
	owner: qStr,
	visibility: z.preprocess((v) => (v === '' || v == null ? undefined : v), z.enum(VISIBILITIES).optional()),
	deleted: z.preprocess((v) => (v === '' || v == null ? undefined : v), z.enum(['only', 'include']).optional()),
	sort: z.preprocess((v) => (v === '' || v == null ? undefined : v), z.enum(SORTS).optional()),
	dir: z.preprocess((v) => (v === '' || v == null ? undefined : v), z.enum(['asc', 'desc']).default('asc')),
	limit: z.preprocess((v) => (v === '' || v == null ? undefined : v), z.coerce.number().int().min(1).max(500).default(50)),
	offset: z.preprocess((v) => (v === '' || v == null ? undefined : v), z.coerce.number().int().min(0).max(1_000_000).default(0))
});
export type SpectrumListQuery = z.infer<typeof spectrumListQuerySchema>;
