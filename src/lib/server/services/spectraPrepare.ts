/**
 * Upload pipeline, pure part: parse → normalise → derive, with the core's issues mapped to the API
 * error envelope (415 unsupported file, 422 physically impossible data, 400 other bad input; `line`
 * and `block` passed through). Nothing here touches the database.
 */
import { parseSpectrumFile } from '../../spectra/parse/index';
import { normaliseSpectrum } from '../../spectra/normalise';
import type { NormalisedSpectrum, ParseIssue, RawSpectrum, SpectrumDerived } from '../../spectra/types';
import type { UploadMetadata } from '../../schemas/spectra';
import { ApiError } from '../http';
import { statusForIssues } from '../../spectra/parse/issueStatus';
import { parseLimitsFromEnv } from '../../spectra/parse/parseLimits';
import { deriveForLibrary } from './spectraDerive';

/** One spectrum ready to store. */
export interface PreparedSpectrum {
	raw: RawSpectrum;
	norm: NormalisedSpectrum;
	derived: SpectrumDerived;
	/** Block (JCAMP) or file column (CSV) this spectrum came from: part of the duplicate key. */
	blockIndex: number;
}

/** Codes of data that parse but cannot be physical (HTTP 422). */
const PHYSICAL = new Set(['negative_transmittance', 'x_not_positive', 'duplicate_x_conflict', 'duplicate_x', 'invalid_concentration', 'invalid_path', 'transmittance_above_one', 'negative_k',
	// delimited text (csvPhysical.ts): values that cannot be what the file or the caller says they are
	'x_out_of_range', 'not_finite_after_conversion', 'implausible_absorbance', 'implausible_transmittance', 'implausible_reflectance', 'implausible_epsilon']);
/** Files that parse as tables but are not spectra (HTTP 415 with the reason). */
const NOT_A_SPECTRUM = new Set(['unsupported_format', 'not_optical_table', 'optical_constants_table']);
/** Codes that name a metadata field rather than a line. */
const FIELD_OF: Record<string, string> = { invalid_concentration: 'concentrationM', invalid_path: 'pathCm', unit_kind_mismatch: 'yUnit', column_out_of_range: 'columns' };

/** Upload limit in bytes: env UPLOAD_LIMIT_MB (default 20 MB per file). */
export function uploadLimitBytes(env: Record<string, string | undefined> = process.env): number {
	const mb = Number(env.UPLOAD_LIMIT_MB ?? 20);
	return (Number.isFinite(mb) && mb > 0 ? mb : 20) * 1024 * 1024;
}

/** Turns refusing issues into one ApiError; the first error names the line, all are listed. */
export function issuesToApiError(filename: string, issues: ParseIssue[]): ApiError {
	const errors = issues.filter((i) => i.severity === 'error');
	const first = errors[0] ?? issues[0];
	const core = statusForIssues(errors);
	const status = core === 400 && NOT_A_SPECTRUM.has(first?.code ?? '') ? 415 : core === 400 && errors.some((i) => PHYSICAL.has(i.code)) ? 422 : core;
	const code = status === 413 ? 'too_large' : status === 415 ? 'unsupported_file' : status === 422 ? 'physically_invalid' : 'bad_file';
	const where = first?.line && !/line \d/.test(first.message) ? ` (line ${first.line})` : '';
	const message = `${filename}: ${first?.message ?? 'the file could not be read'}${where}`;
	return new ApiError(status, code, message, {
		line: first?.line,
		field: first ? FIELD_OF[first.code] : undefined,
		block: first?.block,
		issues: errors.slice(0, 20)
	});
}

/** Physical checks of the numbers a user typed (API.md: negative concentration → 422). */
export function checkPhysicalMetadata(m: Partial<UploadMetadata>): void {
	const positive: [keyof UploadMetadata, string][] = [['concentrationM', 'concentration'], ['pathCm', 'path length'], ['thicknessMm', 'thickness']];
	for (const [k, what] of positive) {
		const v = m[k] as number | null | undefined;
		if (v != null && !(v > 0)) throw new ApiError(422, 'physically_invalid', `${k}: the ${what} must be greater than zero (got ${v})`, { field: k });
	}
	const e = m.tripletEnergyKjPerMol;
	if (e != null && !(e > 0 && e < 1000)) throw new ApiError(422, 'physically_invalid', `tripletEnergyKjPerMol: expected 0–1000 kJ mol⁻¹ (got ${e})`, { field: 'tripletEnergyKjPerMol' });
}

/**
 * Parses, normalises and derives every spectrum of a file.
 * @throws ApiError 413 / 415 / 400 / 422 — never writes anything
 */
export function prepareSpectra(bytes: Uint8Array, filename: string, meta: UploadMetadata): { spectra: PreparedSpectrum[]; warnings: ParseIssue[] } {
	if (bytes.byteLength > uploadLimitBytes()) throw new ApiError(413, 'too_large', `${filename}: ${(bytes.byteLength / 1048576).toFixed(1)} MB is above the ${uploadLimitBytes() / 1048576} MB limit for one file`, { field: 'file' });
	checkPhysicalMetadata(meta);
	const parsed = parseSpectrumFile(bytes, filename, {
		kind: meta.kind,
		xUnit: meta.xUnit,
		yUnit: meta.yUnit,
		columns: meta.columns,
		layout: meta.layout,
		concentrationM: meta.concentrationM ?? undefined,
		pathCm: meta.pathCm ?? undefined,
		limits: parseLimitsFromEnv(process.env)
	});
	if (!parsed.ok) throw issuesToApiError(filename, parsed.issues);
	const warnings: ParseIssue[] = [...parsed.warnings];
	const spectra: PreparedSpectrum[] = [];
	for (const raw of parsed.value) {
		const norm = normaliseSpectrum(raw);
		if (!norm.ok) throw issuesToApiError(filename, norm.issues.map((i) => ({ ...i, block: i.block ?? raw.index })));
		const d = deriveForLibrary(norm.value, { concentrationM: meta.concentrationM ?? raw.metadata.concentrationM, pathCm: meta.pathCm ?? raw.metadata.pathCm });
		const label = parsed.value.length > 1 ? `${raw.label}: ` : '';
		warnings.push(...norm.warnings.map((w) => ({ ...w, message: label + w.message })), ...d.warnings.map((w) => ({ ...w, message: label + w.message, block: raw.index })));
		spectra.push({ raw, norm: norm.value, derived: d.derived, blockIndex: raw.column ?? raw.index });
	}
	return { spectra, warnings };
}
