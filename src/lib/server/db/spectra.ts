/**
 * Repository of the `spectra` table (one query per function). BLOB columns are only selected by the
 * functions that need them; the list and search read the light `SUMMARY_COLUMNS`.
 */
import type { Knex } from 'knex';
import { db } from './index';

/** A `spectra` row as stored (snake_case; JSON columns as text; BLOBs as Buffers). */
export interface SpectrumRow {
	id: number;
	group_id: number;
	owner_id: string | null;
	name: string;
	synonyms: string | null;
	cas: string | null;
	part: string;
	kind: 'absorption' | 'transmission' | 'emission' | 'reflectance';
	solvent: string | null;
	concentration_m: number | null;
	path_cm: number | null;
	thickness_mm: number | null;
	temperature_c: number | null;
	instrument: string | null;
	notes: string | null;
	visibility: 'private' | 'group' | 'public';
	x_original: Buffer;
	y_original: Buffer;
	x_unit_original: string;
	y_unit_original: string;
	x_nm: Buffer;
	y_normalised: Buffer;
	y_unit: string;
	point_count: number;
	file_bytes: Buffer;
	file_name: string;
	file_sha256: string;
	block_index: number;
	block_label: string | null;
	/** Time in a time series, s (rows-as-spectra tables); null otherwise. */
	block_time_s?: number | null;
	search_vector: Buffer;
	lambda_max_nm: number | null;
	value_at_max: number | null;
	edge_nm: number | null;
	cutoff10_nm: number | null;
	cutoff50_nm: number | null;
	peaks: string | null;
	triplet_energy_kj_per_mol: number | null;
	excited_state_potentials: string | null;
	warnings: string | null;
	/** longest-wavelength band maximum above noise, nm (absorption) */
	longest_band_nm: number | null;
	/** JSON DerivedExtra (services/spectraDerive.ts): stretches left out, noise σ, cut-off notes, similarity stretch */
	derived_extra: string | null;
	version: number;
	deleted_at: Date | null;
	created_at: Date;
	updated_at: Date;
	/** joined */
	owner_name?: string | null;
	group_name?: string | null;
	group_slug?: string | null;
}

export type NewSpectrumRow = Omit<SpectrumRow, 'id' | 'version' | 'deleted_at' | 'created_at' | 'updated_at' | 'owner_name' | 'group_name' | 'group_slug'>;

/** Columns of a summary (no point or file BLOBs). */
export const SUMMARY_COLUMNS = [
	's.id', 's.group_id', 's.owner_id', 's.name', 's.synonyms', 's.cas', 's.part', 's.kind', 's.solvent', 's.concentration_m',
	's.path_cm', 's.thickness_mm', 's.temperature_c', 's.instrument', 's.notes', 's.visibility', 's.x_unit_original',
	's.y_unit_original', 's.y_unit', 's.point_count', 's.file_name', 's.file_sha256', 's.block_index', 's.block_label', 's.block_time_s',
	's.lambda_max_nm', 's.value_at_max', 's.edge_nm', 's.cutoff10_nm', 's.cutoff50_nm', 's.peaks', 's.triplet_energy_kj_per_mol',
	's.excited_state_potentials', 's.warnings', 's.longest_band_nm', 's.derived_extra', 's.version', 's.deleted_at', 's.created_at', 's.updated_at',
	'u.name as owner_name', 'g.name as group_name', 'g.slug as group_slug'
];

/** Who is asking: used to restrict rows in SQL to what `canReadRow` would allow. */
export interface Reader {
	userId: string;
	isAdmin: boolean;
	groupIds: number[];
}

/** Filters the repository applies in SQL (the rest happens in the search service). */
export interface SpectrumSqlFilter {
	part?: string;
	kind?: string;
	solvent?: string;
	groupIds?: number[];
	ownerIds?: string[];
	visibility?: string;
	deleted?: 'only' | 'include';
	ids?: number[];
	/** Also select the search vector BLOB. */
	withVector?: boolean;
}

/** Rows visible to `reader`: own rows, public rows, group rows of the reader's groups (admins: all). */
function visibleTo(q: Knex.QueryBuilder, reader: Reader): Knex.QueryBuilder {
	if (reader.isAdmin) return q;
	return q.where((w) => {
		w.where('s.owner_id', reader.userId).orWhere('s.visibility', 'public');
		if (reader.groupIds.length) w.orWhere((g) => g.where('s.visibility', 'group').whereIn('s.group_id', reader.groupIds));
	});
}

/** Inserts a spectrum; returns its id. */
export async function insertSpectrum(trx: Knex | Knex.Transaction, row: NewSpectrumRow): Promise<number> {
	const [id] = await trx('spectra').insert(row);
	return Number(id);
}

/** The rows of `groupId` that already hold this file (any block), deleted ones included. */
export async function findSpectraBySha(trx: Knex | Knex.Transaction, groupId: number, sha256: string): Promise<Pick<SpectrumRow, 'id' | 'name' | 'block_index' | 'deleted_at' | 'visibility' | 'owner_id'>[]> {
	return trx('spectra').where({ group_id: groupId, file_sha256: sha256 }).select('id', 'name', 'block_index', 'deleted_at', 'visibility', 'owner_id');
}

/** One full row (all BLOBs) with owner and group names, deleted or not; undefined when missing. */
export async function findSpectrumById(id: number, conn: Knex | Knex.Transaction = db()): Promise<SpectrumRow | undefined> {
	return conn('spectra as s')
		.leftJoin('users as u', 'u.id', 's.owner_id')
		.leftJoin('groups as g', 'g.id', 's.group_id')
		.where('s.id', id)
		.first('s.*', 'u.name as owner_name', 'g.name as group_name', 'g.slug as group_slug');
}

/** Summaries of visible rows matching the SQL filters, newest first (paging happens after fuzzy search). */
export async function listSpectrumSummaries(reader: Reader, f: SpectrumSqlFilter, conn: Knex = db()): Promise<SpectrumRow[]> {
	const q = conn('spectra as s')
		.leftJoin('users as u', 'u.id', 's.owner_id')
		.leftJoin('groups as g', 'g.id', 's.group_id')
		.select(f.withVector ? [...SUMMARY_COLUMNS, 's.search_vector'] : SUMMARY_COLUMNS)
		.orderBy('s.id', 'desc');
	visibleTo(q, reader);
	if (f.deleted === 'only') q.whereNotNull('s.deleted_at');
	else if (f.deleted !== 'include') q.whereNull('s.deleted_at');
	if (f.part) q.where('s.part', f.part);
	if (f.kind) q.where('s.kind', f.kind);
	if (f.solvent) q.whereRaw('LOWER(s.solvent) LIKE ?', [`%${f.solvent.toLowerCase().replace(/[%_\\]/g, '\\$&')}%`]);
	if (f.groupIds) q.whereIn('s.group_id', f.groupIds);
	if (f.ownerIds) q.whereIn('s.owner_id', f.ownerIds);
	if (f.visibility) q.where('s.visibility', f.visibility);
	if (f.ids) q.whereIn('s.id', f.ids);
	return q;
}

/**
 * Updates columns if the row still has `version`; bumps the version. Returns the number of rows
 * changed (0 = stale version or missing row).
 */
export async function updateSpectrumIfVersion(trx: Knex.Transaction, id: number, version: number, patch: Partial<NewSpectrumRow> & { deleted_at?: Date | null }): Promise<number> {
	return trx('spectra')
		.where({ id, version })
		.update({ ...patch, version: version + 1, updated_at: trx.fn.now() });
}

/** Resolves group slugs or ids to ids. */
export async function findGroupIds(keys: string[], conn: Knex = db()): Promise<number[]> {
	const nums = keys.filter((k) => /^\d+$/.test(k)).map(Number);
	const rows = await conn('groups').whereIn('slug', keys).orWhereIn('id', nums.length ? nums : [-1]).select('id');
	return rows.map((r: { id: number }) => Number(r.id));
}
