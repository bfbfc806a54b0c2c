/**
 * PATCH / DELETE / restore of a spectrum: owner or lead (policy.ts), optimistic locking on
 * `version` (409 on a stale save), one transaction per change with a revision row. Changing the
 * concentration or path of an absorption spectrum re-normalises it from the original points.
 */
import { db } from '../db/index';
import { findSpectrumById, updateSpectrumIfVersion, type NewSpectrumRow, type SpectrumRow } from '../db/spectra';
import { bufferToFloat64, float64ToBuffer } from '../db/spectraBlobs';
import { insertRevision } from '../db/spectrumRevisions';
import { addSpectrumTags, cleanTags, clearSpectrumTags, findTagIds, insertMissingTags, tagsOfSpectra } from '../db/tags';
import { ApiError, zodToApiError } from '../http';
import { spectrumPatchSchema, type SpectrumPatch } from '../../schemas/spectra';
import { vectorToBuffer } from '../../spectra/grid';
import { normaliseSpectrum } from '../../spectra/normalise';
import type { RawSpectrum, XUnit, YUnit } from '../../spectra/types';
import { writableSpectrum } from './spectraAccess';
import { derivedColumns, deriveForLibrary } from './spectraDerive';
import { checkPhysicalMetadata, issuesToApiError } from './spectraPrepare';
import { spectrumToApi } from './spectraView';

const COLUMNS: Record<string, keyof NewSpectrumRow> = {
	name: 'name', synonyms: 'synonyms', cas: 'cas', part: 'part', solvent: 'solvent', concentrationM: 'concentration_m',
	pathCm: 'path_cm', thicknessMm: 'thickness_mm', temperatureC: 'temperature_c', instrument: 'instrument', notes: 'notes',
	visibility: 'visibility', tripletEnergyKjPerMol: 'triplet_energy_kj_per_mol', excitedStatePotentials: 'excited_state_potentials'
};
const JSON_FIELDS = new Set(['synonyms', 'excitedStatePotentials']);

const stale = (row: SpectrumRow) => new ApiError(409, 'version_conflict', `Someone saved this spectrum in the meantime (now version ${row.version}); reload and apply your change again.`, { field: 'version', currentVersion: row.version });

/** Points, unit and derived columns recomputed from the original points with a new c and l. */
function renormalised(row: SpectrumRow, c: number | null, l: number | null): Partial<NewSpectrumRow> {
	const raw: RawSpectrum = { label: row.block_label ?? row.name, index: row.block_index, x: bufferToFloat64(row.x_original), y: bufferToFloat64(row.y_original), xUnit: row.x_unit_original as XUnit, yUnit: row.y_unit_original as YUnit, kind: row.kind, metadata: {} };
	const n = normaliseSpectrum(raw, { concentrationM: c ?? undefined, pathCm: l ?? undefined });
	if (!n.ok) throw issuesToApiError(row.file_name, n.issues);
	const { derived } = deriveForLibrary(n.value, { concentrationM: c, pathCm: l });
	return {
		x_nm: float64ToBuffer(n.value.x), y_normalised: float64ToBuffer(n.value.y), y_unit: n.value.yUnit, point_count: n.value.x.length,
		search_vector: Buffer.from(vectorToBuffer(derived.searchVector)), lambda_max_nm: derived.lambdaMaxNm, value_at_max: derived.valueAtMax,
		edge_nm: derived.edgeNm, cutoff10_nm: derived.cutoff10Nm, cutoff50_nm: derived.cutoff50Nm, peaks: JSON.stringify(derived.peaks), ...derivedColumns(derived)
	};
}

/** Column patch and the human-readable change list of a PATCH body. */
function diff(row: SpectrumRow, p: SpectrumPatch, oldTags: string[]) {
	const patch: Record<string, unknown> = {};
	const changes: Record<string, { from: unknown; to: unknown }> = {};
	for (const [field, col] of Object.entries(COLUMNS)) {
		const v = (p as Record<string, unknown>)[field];
		if (v === undefined) continue;
		const stored = JSON_FIELDS.has(field) ? JSON.stringify(v) : v;
		const before = row[col as keyof SpectrumRow];
		if ((before ?? null) === (stored ?? null)) continue;
		patch[col] = stored;
		changes[field] = { from: JSON_FIELDS.has(field) && typeof before === 'string' ? JSON.parse(before) : (before ?? null), to: v };
	}
	const tags = p.tags ? cleanTags(p.tags) : undefined;
	if (tags && tags.join('|') !== oldTags.join('|')) changes.tags = { from: oldTags, to: tags };
	return { patch, changes, tags: changes.tags ? tags : undefined };
}

/** Applies a PATCH body. @throws 400 invalid, 403, 404, 409 stale version, 422 impossible values */
export async function patchSpectrum(locals: App.Locals, idParam: string, body: unknown) {
	const { caller, row } = await writableSpectrum(locals, idParam);
	const parsed = spectrumPatchSchema.safeParse(body);
	if (!parsed.success) throw zodToApiError(parsed.error);
	const p = parsed.data;
	checkPhysicalMetadata(p);
	if (p.version !== row.version) throw stale(row);
	const oldTags = (await tagsOfSpectra([row.id])).get(row.id) ?? [];
	const { patch, changes, tags } = diff(row, p, oldTags);
	if ((changes.concentrationM || changes.pathCm) && row.kind === 'absorption') {
		const c = p.concentrationM !== undefined ? p.concentrationM : row.concentration_m;
		const l = p.pathCm !== undefined ? p.pathCm : row.path_cm;
		Object.assign(patch, renormalised(row, c ?? null, l ?? null));
	}
	if (!Object.keys(changes).length) return spectrumToApi(row, oldTags, { canEdit: true });
	await db().transaction(async (trx) => {
		const n = await updateSpectrumIfVersion(trx, row.id, row.version, patch);
		if (n !== 1) throw stale((await findSpectrumById(row.id, trx)) ?? row);
		if (tags) {
			await clearSpectrumTags(trx, row.id);
			await insertMissingTags(trx, tags);
			await addSpectrumTags(trx, row.id, await findTagIds(trx, tags));
		}
		await insertRevision(trx, { spectrumId: row.id, version: row.version + 1, action: 'edit', userId: caller.user.id, changes });
	});
	const fresh = (await findSpectrumById(row.id))!;
	return spectrumToApi(fresh, tags ?? oldTags, { canEdit: true });
}

/** Soft delete (deleted = true) or restore (deleted = false). Idempotent. @throws 403, 404 */
export async function setSpectrumDeleted(locals: App.Locals, idParam: string, deleted: boolean) {
	const { caller, row } = await writableSpectrum(locals, idParam);
	if (!!row.deleted_at === deleted) return { id: row.id, deleted, version: row.version };
	await db().transaction(async (trx) => {
		const n = await updateSpectrumIfVersion(trx, row.id, row.version, { deleted_at: deleted ? new Date() : null });
		if (n !== 1) throw stale(row);
		await insertRevision(trx, { spectrumId: row.id, version: row.version + 1, action: deleted ? 'delete' : 'restore', userId: caller.user.id });
	});
	return { id: row.id, deleted, version: row.version + 1 };
}
