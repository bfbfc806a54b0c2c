/**
 * Upload pipeline, persisting part: one transaction per file — duplicate check (409 naming the
 * existing spectrum), the original file stored once (`spectrum_files`), one `spectra` row per
 * prepared spectrum with its points, vector and name trigrams in bulk inserts (batched below
 * max_allowed_packet), its tags and a `create` revision. A failure rolls everything back. Storage
 * is bounded before anything is written: at most WINDOWSILL_MAX_SPECTRA_PER_FILE spectra per file
 * (default 500) and WINDOWSILL_MAX_WRITE_BYTES bytes per request (default 256 MiB).
 * Used by POST /api/spectra and by the demo seed alike.
 */
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { vectorToBuffer } from '../../spectra/grid';
import type { ParseIssue } from '../../spectra/types';
import { isValidCas, type UploadMetadata } from '../../schemas/spectra';
import { ApiError } from '../http';
import { findSpectraBySha, findSpectrumSummariesByIds, storeNewFileOneTrip, insertSpectra, insertSpectrumFile, multiRowIdsAreConsecutive, nextChangeSeq, oneTripBytes, type NewSpectrumRow, type SpectrumRow } from '../db/spectra';
import { float64ToBuffer, statementBudget } from '../db/spectraBlobs';
import { cleanTags, findTagIds, insertMissingTags } from '../db/tags';
import type { PreparedSpectrum } from './spectraPrepare';
import { assertFiniteSpectra } from './spectraFinite';
import { spectrumToApi } from './spectraView';
import { derivedColumns } from './spectraDerive';

export interface StoreInput {
	groupId: number;
	ownerId: string;
	bytes: Uint8Array;
	filename: string;
	meta: UploadMetadata;
	spectra: PreparedSpectrum[];
	warnings: ParseIssue[];
}

const DEFAULT_PART = { absorption: 'substrate', transmission: 'wall', emission: 'lamp', reflectance: 'photocatalyst' } as const;

/** The name of the i-th spectrum of a file: metadata.names[i], metadata.name, the block/column title, the file name. */
function nameFor(input: StoreInput, s: PreparedSpectrum, i: number): string {
	const given = input.meta.names?.[i]?.trim();
	if (given) return given;
	const many = input.spectra.length > 1;
	const base = input.meta.name?.trim() || (typeof s.raw.metadata.title === 'string' ? s.raw.metadata.title : '') || input.filename.replace(/\.[^.]+$/, '');
	return (many ? `${base} — ${s.raw.label}` : base).slice(0, 200);
}

/** Builds the row of one spectrum (metadata wins over the file). */
function rowFor(input: StoreInput, s: PreparedSpectrum, i: number, sha256: string, warnings: ParseIssue[]): NewSpectrumRow {
	const m = input.meta;
	const md = s.raw.metadata;
	const fileCas = typeof md.cas === 'string' && isValidCas(md.cas) ? md.cas : null;
	const str = (v: unknown) => (typeof v === 'string' && v.trim() ? v.trim() : null);
	return {
		group_id: input.groupId,
		owner_id: input.ownerId,
		name: nameFor(input, s, i),
		synonyms: JSON.stringify(m.synonyms ?? []),
		cas: m.cas ?? fileCas,
		part: m.part ?? DEFAULT_PART[s.norm.kind],
		kind: s.norm.kind,
		solvent: m.solvent ?? str(md.solvent),
		concentration_m: md.concentrationM ?? null,
		path_cm: md.pathCm ?? null,
		thickness_mm: m.thicknessMm ?? md.thicknessMm ?? null,
		temperature_c: m.temperatureC ?? md.temperatureC ?? null,
		instrument: (m.instrument ?? str(md.instrument) ?? str(md.origin))?.slice(0, 200) ?? null,
		notes: m.notes ?? null,
		visibility: m.visibility ?? 'group',
		x_original: float64ToBuffer(s.raw.x),
		y_original: float64ToBuffer(s.raw.y),
		x_unit_original: s.raw.xUnit,
		y_unit_original: s.raw.yUnit,
		x_nm: float64ToBuffer(s.norm.x),
		y_normalised: float64ToBuffer(s.norm.y),
		y_unit: s.norm.yUnit,
		point_count: s.norm.x.length,
		file_id: null,
		file_name: input.filename.slice(0, 255),
		file_sha256: sha256,
		block_index: s.blockIndex,
		block_label: s.raw.label.slice(0, 200),
		...(s.raw.timeS !== undefined ? { block_time_s: s.raw.timeS } : {}),
		search_vector: Buffer.from(vectorToBuffer(s.derived.searchVector)),
		lambda_max_nm: s.derived.lambdaMaxNm,
		value_at_max: s.derived.valueAtMax,
		edge_nm: s.derived.edgeNm,
		cutoff10_nm: s.derived.cutoff10Nm,
		cutoff50_nm: s.derived.cutoff50Nm,
		peaks: JSON.stringify(s.derived.peaks),
		...derivedColumns(s.derived),
		triplet_energy_kj_per_mol: m.tripletEnergyKjPerMol ?? null,
		excited_state_potentials: JSON.stringify(m.excitedStatePotentials ?? []),
		warnings: JSON.stringify(warnings.filter((w) => w.block === undefined || w.block === s.raw.index).map(({ code, message, line }) => ({ code, message, line })))
	};
}

/** The rows of every prepared spectrum of one upload (file_id still to be set). */
export function spectrumRowsFor(input: StoreInput, sha256: string): NewSpectrumRow[] {
	return input.spectra.map((s, i) => rowFor(input, s, i, sha256, input.warnings));
}

/** SHA-256 of the file bytes, hex. */
export const sha256Hex = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** Storage limits (environment, read per call so tests and operators can set them). */
export function storageLimits(env: Record<string, string | undefined> = process.env) {
	const num = (v: string | undefined, d: number) => (v && Number.isFinite(Number(v)) && Number(v) > 0 ? Number(v) : d);
	return { maxSpectraPerFile: num(env.WINDOWSILL_MAX_SPECTRA_PER_FILE, 500), maxWriteBytes: num(env.WINDOWSILL_MAX_WRITE_BYTES, 256 * 1024 * 1024) };
}

/** Bytes a store would write: the file once, then per spectrum its four Float64 series, the vector and the metadata. */
export function bytesToWrite(input: Pick<StoreInput, 'bytes' | 'spectra'>): number {
	let n = input.bytes.byteLength;
	for (const s of input.spectra) n += 8 * (2 * s.raw.x.length + 2 * s.norm.x.length) + 4 * s.derived.searchVector.length + 4096;
	return n;
}

/** Refuses, before any write, a file with too many spectra or one that would write too many bytes. */
export function checkStorageLimits(input: Pick<StoreInput, 'bytes' | 'spectra' | 'filename'>, limits = storageLimits()): void {
	if (input.spectra.length > limits.maxSpectraPerFile)
		throw new ApiError(422, 'too_many_spectra', `file: ${input.filename} holds ${input.spectra.length} spectra (blocks or columns); at most ${limits.maxSpectraPerFile} are stored per file — pick some with metadata "columns" or split the file`, { field: 'file', count: input.spectra.length, limit: limits.maxSpectraPerFile });
	const bytes = bytesToWrite(input);
	if (bytes > limits.maxWriteBytes)
		throw new ApiError(413, 'too_large', `file: storing ${input.filename} would write ${(bytes / 1048576).toFixed(1)} MiB; at most ${(limits.maxWriteBytes / 1048576).toFixed(0)} MiB are written per upload`, { field: 'file', bytes, limit: limits.maxWriteBytes });
}

type ShaRow = Awaited<ReturnType<typeof findSpectraBySha>>[number];

/** The 409 for an upload whose file (one of its blocks) this group already holds, or null. */
function duplicateOf(existing: ShaRow[], input: StoreInput): ApiError | null {
	const clash = existing.find((e) => input.spectra.some((s) => s.blockIndex === e.block_index));
	if (!clash) return null;
	if (clash.visibility === 'private' && clash.owner_id !== input.ownerId)
		// Someone else's private spectrum: never name it or give its id.
		return new ApiError(409, 'duplicate', `${input.filename} is already stored in this group by another member who has not shared it; ask your group lead to have it shared with you`, { field: 'file' });
	return new ApiError(409, 'duplicate', `${input.filename} is already in the Library as "${clash.name}" (spectrum ${clash.id}${clash.deleted_at ? ', deleted — restore it instead' : ''})`, { existingId: Number(clash.id), field: 'file' });
}

/** A MariaDB duplicate-key error (ER_DUP_ENTRY). */
const isDuplicateKey = (e: unknown) => (e as { errno?: number; code?: string })?.errno === 1062 || (e as { code?: string })?.code === 'ER_DUP_ENTRY';

/**
 * Stores every prepared spectrum of one file in one transaction.
 *
 * Usually in one round trip (db/spectra.ts storeNewFileOneTrip: one compound statement with its own
 * transaction and the read-back); a duplicate is then caught by the unique key on group + file hash
 * + block and named after the rollback. Files too big for one statement, and servers that do not hand out
 * consecutive ids, take the step-by-step path (`oneTrip: false` forces it, for tests).
 * @throws ApiError 409 when the group already holds this file (names the existing spectrum);
 *   422 too many spectra, 413 too many bytes (nothing written)
 */
export async function storeSpectra(conn: Knex, input: StoreInput, opts: { oneTrip?: boolean } = {}) {
	assertFiniteSpectra(input.spectra, input.filename);
	checkStorageLimits(input);
	const sha = sha256Hex(input.bytes);
	const tagNames = cleanTags(input.meta.tags ?? []);
	const rows = spectrumRowsFor(input, sha);
	const file = { groupId: input.groupId, sha256: sha, fileName: input.filename, bytes: input.bytes };
	const oneTrip = opts.oneTrip !== false && (await multiRowIdsAreConsecutive(conn)) && oneTripBytes(input.bytes, rows) <= (await statementBudget(conn));
	let stored: SpectrumRow[];
	try {
		stored = oneTrip
			? await storeNewFileOneTrip(conn, file, rows, { revisionUserId: input.ownerId, tagNames })
			: await conn.transaction(async (trx) => {
					// the change number first: every writer takes this one row lock first, so writers never deadlock
					const seq = await nextChangeSeq(trx);
					const dup = duplicateOf(await findSpectraBySha(trx, input.groupId, sha), input);
					if (dup) throw dup;
					await insertMissingTags(trx, tagNames);
					const tagIds = await findTagIds(trx, tagNames);
					const fileId = await insertSpectrumFile(trx, file);
					const out = await insertSpectra(trx, rows.map((r) => ({ ...r, file_id: fileId })), seq, { newFile: true });
					if (tagIds.length) await trx('spectrum_tags').insert(out.flatMap((id) => tagIds.map((tag_id) => ({ spectrum_id: id, tag_id }))));
					await trx('spectrum_revisions').insert(out.map((id) => ({ spectrum_id: id, version: 1, action: 'create', user_id: input.ownerId, changes: null })));
					return findSpectrumSummariesByIds(out, trx);
				});
	} catch (e) {
		if (!isDuplicateKey(e)) throw e;
		// rolled back; name what the group already holds (the unique key is group + hash + block)
		throw duplicateOf(await findSpectraBySha(conn, input.groupId, sha), input) ?? e;
	}
	return { items: stored.map((row) => spectrumToApi(row, tagNames)), warnings: input.warnings.map(({ code, message, line, block }) => ({ code, message, line, block })) };
}
