/**
 * POST /api/spectra and the upload page: who may upload where, the metadata JSON, then
 * parse → validate → (preview | persist). A preview stores nothing.
 */
import { db } from '../db/index';
import { findGroupIds } from '../db/spectra';
import { ApiError, zodToApiError } from '../http';
import { defaultGroupFor, requireGroupRole, requireUser } from '../policy';
import { uploadMetadataSchema, type UploadMetadata } from '../../schemas/spectra';
import { inspectDelimited } from '../../spectra/parse/csvInspect';
import { decodeText } from '../../spectra/parse/index';
import { uploadLimitBytes, type PreparedSpectrum } from './spectraPrepare';
import { prepareSpectraInWorker } from '../parse/pool';
import { storeSpectra } from './spectraStore';

/** Reads the optional `metadata` form field (JSON). */
export function readUploadMetadata(text: unknown): UploadMetadata {
	if (text == null || text === '') return {};
	if (typeof text !== 'string') throw new ApiError(400, 'invalid', 'metadata must be a JSON text field', { field: 'metadata' });
	let raw: unknown;
	try {
		raw = JSON.parse(text);
	} catch {
		throw new ApiError(400, 'bad_json', 'metadata is not valid JSON', { field: 'metadata' });
	}
	const r = uploadMetadataSchema.safeParse(raw);
	if (!r.success) throw zodToApiError(r.error);
	return r.data;
}

/** The group the upload goes to; 403 for viewers, 404 for a group the caller is not in. */
async function targetGroup(locals: App.Locals, group: UploadMetadata['group']): Promise<number> {
	requireUser(locals);
	if (group === undefined) return (await defaultGroupFor(locals, 'member')).groupId;
	const [id] = await findGroupIds([String(group)]);
	if (!id) throw new ApiError(404, 'not_found', 'No such group.', { field: 'group' });
	await requireGroupRole(locals, id, 'member');
	return id;
}

/** Every n-th point so a preview plot stays small (≤ maxPoints). */
function thin(x: Float64Array, y: Float64Array, maxPoints = 400) {
	const step = Math.max(1, Math.ceil(x.length / maxPoints));
	const xs: number[] = [];
	const ys: number[] = [];
	for (let i = 0; i < x.length; i += step) {
		xs.push(x[i]);
		ys.push(y[i]);
	}
	return { x: xs, y: ys };
}

const previewOf = (s: PreparedSpectrum, i: number) => ({
	index: i,
	blockIndex: s.blockIndex,
	column: s.raw.column ?? null,
	label: s.raw.label,
	kind: s.norm.kind,
	xUnit: s.raw.xUnit,
	yUnit: s.raw.yUnit,
	normalisedYUnit: s.norm.yUnit,
	pointCount: s.norm.x.length,
	fromNm: s.norm.x[0],
	toNm: s.norm.x[s.norm.x.length - 1],
	lambdaMaxNm: s.derived.lambdaMaxNm,
	longestWavelengthBandNm: s.derived.longestBandNm ?? null,
	edgeNm: s.derived.edgeNm,
	cutoff50Nm: s.derived.cutoff50Nm,
	fileMetadata: s.raw.metadata,
	/** Time series (one spectrum per row): the time in seconds and the row's label as written. */
	timeS: s.raw.timeS ?? null,
	blockLabel: s.raw.blockLabel ?? null,
	...thin(s.norm.x, s.norm.y)
});

/**
 * Handles one uploaded file.
 * @param preview - true: parse and answer what would be stored, store nothing
 * @returns `{ items, warnings }` (saved) or `{ preview: [...], table, warnings }`
 */
export async function uploadSpectrumFile(locals: App.Locals, file: unknown, metadataText: unknown, preview = false) {
	const meta = readUploadMetadata(metadataText);
	const groupId = await targetGroup(locals, meta.group);
	if (!(file instanceof Blob) || typeof (file as File).name !== 'string') throw new ApiError(400, 'invalid', 'file: attach the spectrum file as multipart field "file"', { field: 'file' });
	const f = file as File;
	const bytes = new Uint8Array(await f.arrayBuffer());
	const filename = f.name || 'upload';
	if (bytes.byteLength > uploadLimitBytes()) throw new ApiError(413, 'too_large', `${filename}: ${(bytes.byteLength / 1048576).toFixed(1)} MB is above the ${uploadLimitBytes() / 1048576} MB limit for one file`, { field: 'file' });
	// the preview shows how a delimited table was read (layout, columns, units) — also when the file is refused, so the
	// user can say which quantity a column is and read it again
	const tableOf = () => {
		if (!preview) return null;
		const text = decodeText(bytes.subarray(0, 200_000));
		const t = text && !/^\s*##\s*(TITLE|JCAMP)/im.test(text.slice(0, 4096)) ? inspectDelimited(text, 6, { layout: meta.layout, filename }) : null;
		return t?.ok ? t.value : null;
	};
	let prepared: Awaited<ReturnType<typeof prepareSpectraInWorker>>;
	try {
		// Parsed in a separate parser process with a memory and time limit: no file can block or stop the server.
		prepared = await prepareSpectraInWorker(bytes, filename, meta);
	} catch (e) {
		if (preview && e instanceof ApiError && e.status !== 413) e.extra.table = tableOf();
		throw e;
	}
	const { spectra, warnings } = prepared;
	if (preview) return { filename, preview: spectra.map(previewOf), table: tableOf(), warnings: warnings.map(({ code, message, line, block }) => ({ code, message, line, block })) };
	try {
		return await storeSpectra(db(), { groupId, ownerId: locals.user!.id, bytes, filename, meta, spectra, warnings });
	} catch (e) {
		// Two uploads of the same file at once: the unique key answers for the loser.
		if ((e as { code?: string }).code === 'ER_DUP_ENTRY') throw new ApiError(409, 'duplicate', `${filename} is already in the Library of this group`, { field: 'file' });
		throw e;
	}
}
