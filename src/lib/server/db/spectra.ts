/**
 * Repository of the Library's tables. `spectra` holds narrow metadata rows; the heavy data live in
 * side tables — `spectrum_points` (Float64 chunks of the original and normalised series),
 * `spectrum_vectors` (the 1 nm Float32 search vector), `spectrum_files` + `spectrum_file_chunks`
 * (the original file, stored once per upload). Every write stamps the next `library_state.change_seq` on the rows it
 * touches, so per-process caches (services/spectraVectorCache.ts) reload exactly what changed.
 *
 * To add a metadata column: a migration, a field in `SpectrumRow`, a name in `SUMMARY_COLUMNS`.
 */
import type { Knex } from 'knex';
import { db } from './index';
import { insertSql, sqlValue, sqlVar } from './sqlText';
import { FILE_CHUNK_BYTES, POINT_CHUNK_VALUES, POINT_SERIES, bufferToFloat64, chunkBytes, insertBatched, type PointSeries } from './spectraBlobs';

/** A `spectra` row with its points and vector (snake_case; JSON columns as text; BLOBs as Buffers). */
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
	/** Points (Float64 little-endian), assembled from `spectrum_points` by `findSpectrumById`. */
	x_original: Buffer;
	y_original: Buffer;
	x_unit_original: string;
	y_unit_original: string;
	x_nm: Buffer;
	y_normalised: Buffer;
	y_unit: string;
	point_count: number;
	/** The original file (`spectrum_files`); its bytes only through `withFileBytes`. */
	file_id: number | null;
	file_bytes?: Buffer;
	file_name: string;
	file_sha256: string;
	block_index: number;
	block_label: string | null;
	/** Time in a time series, s (rows-as-spectra tables); null otherwise. */
	block_time_s?: number | null;
	/** The 1 nm search vector (Float32 little-endian), from `spectrum_vectors`. */
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
	change_seq?: number;
	deleted_at: Date | null;
	created_at: Date;
	updated_at: Date;
	/** joined */
	owner_name?: string | null;
	group_name?: string | null;
	group_slug?: string | null;
}

/** What a new spectrum is made of: metadata, points and vector; the file is stored first (`insertSpectrumFile`). */
export type NewSpectrumRow = Omit<SpectrumRow, 'id' | 'version' | 'deleted_at' | 'created_at' | 'updated_at' | 'owner_name' | 'group_name' | 'group_slug' | 'file_bytes' | 'change_seq'>;

/** The heavy fields that live in side tables. */
const SIDE_FIELDS = new Set<string>([...POINT_SERIES, 'search_vector', 'file_bytes']);

/** Columns of a summary (the metadata row with owner and group names; no points, vector or file). */
export const SUMMARY_COLUMNS = [
	's.id', 's.group_id', 's.owner_id', 's.name', 's.synonyms', 's.cas', 's.part', 's.kind', 's.solvent', 's.concentration_m',
	's.path_cm', 's.thickness_mm', 's.temperature_c', 's.instrument', 's.notes', 's.visibility', 's.x_unit_original',
	's.y_unit_original', 's.y_unit', 's.point_count', 's.file_id', 's.file_name', 's.file_sha256', 's.block_index', 's.block_label', 's.block_time_s',
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

/** Deleted rows a caller may see: their own in groups where they are member+, any in groups they lead (admins: all). */
export interface DeletedScope {
	userId: string;
	isAdmin: boolean;
	memberGroupIds: number[];
	leadGroupIds: number[];
}

/** Filters the repository applies in SQL. */
export interface SpectrumSqlFilter {
	part?: string;
	kind?: string;
	solvent?: string;
	groupIds?: number[];
	ownerIds?: string[];
	/** Owner id, or a piece of the owner's name (case-insensitive). */
	owner?: string;
	visibility?: string;
	deleted?: 'only' | 'include';
	/** With `deleted`: which deleted rows the caller may see (default: all that are visible). */
	deletedScope?: DeletedScope;
	ids?: number[];
	/** CAS number, exact. */
	cas?: string;
	/** Also load the search vector (listSpectrumSummaries only; one extra query). */
	withVector?: boolean;
}

export const SORT_COLUMNS = {
	name: 's.name',
	part: 's.part',
	lambdaMaxNm: 's.lambda_max_nm',
	createdAt: 's.created_at',
	updatedAt: 's.updated_at',
	solvent: 's.solvent',
	owner: 'u.name',
	id: 's.id'
} as const;
export type SortKey = keyof typeof SORT_COLUMNS;
export interface SpectrumOrder {
	key: SortKey;
	dir: 'asc' | 'desc';
}

const NULLABLE_SORT = new Set<SortKey>(['lambdaMaxNm', 'solvent', 'owner']);

/** Rows visible to `reader`: own rows, public rows, group rows of the reader's groups (admins: all). */
function visibleTo(q: Knex.QueryBuilder, reader: Reader): Knex.QueryBuilder {
	if (reader.isAdmin) return q;
	return q.where((w) => {
		w.where('s.owner_id', reader.userId).orWhere('s.visibility', 'public');
		if (reader.groupIds.length) w.orWhere((g) => g.where('s.visibility', 'group').whereIn('s.group_id', reader.groupIds));
	});
}

const likeEscape = (s: string) => s.toLowerCase().replace(/[%_\\]/g, '\\$&');

/** Applies visibility and filters (`s` = spectra, `u` = users joined when the owner name is needed). */
function applyFilter(q: Knex.QueryBuilder, reader: Reader, f: SpectrumSqlFilter): Knex.QueryBuilder {
	visibleTo(q, reader);
	if (f.deleted === 'only') q.whereNotNull('s.deleted_at');
	else if (f.deleted !== 'include') q.whereNull('s.deleted_at');
	if (f.deleted && f.deletedScope && !f.deletedScope.isAdmin) {
		const d = f.deletedScope;
		q.where((w) => {
			w.whereNull('s.deleted_at');
			if (d.memberGroupIds.length) w.orWhere((o) => o.where('s.owner_id', d.userId).whereIn('s.group_id', d.memberGroupIds));
			if (d.leadGroupIds.length) w.orWhereIn('s.group_id', d.leadGroupIds);
		});
	}
	if (f.part) q.where('s.part', f.part);
	if (f.kind) q.where('s.kind', f.kind);
	if (f.solvent) q.whereRaw('LOWER(s.solvent) LIKE ?', [`%${likeEscape(f.solvent)}%`]);
	if (f.groupIds) q.whereIn('s.group_id', f.groupIds.length ? f.groupIds : [-1]);
	if (f.ownerIds) q.whereIn('s.owner_id', f.ownerIds.length ? f.ownerIds : ['']);
	if (f.owner) {
		const o = f.owner;
		q.where((w) => w.where('s.owner_id', o).orWhereIn('s.owner_id', (sub) => sub.from('users').whereRaw('LOWER(name) LIKE ?', [`%${likeEscape(o)}%`]).select('id')));
	}
	if (f.visibility) q.where('s.visibility', f.visibility);
	if (f.ids) q.whereIn('s.id', f.ids.length ? f.ids : [-1]);
	if (f.cas) q.where('s.cas', f.cas);
	return q;
}

/** ORDER BY for a sort: nulls last in both directions, ties by id in the same direction. */
function applyOrder(q: Knex.QueryBuilder, o: SpectrumOrder): Knex.QueryBuilder {
	const col = SORT_COLUMNS[o.key];
	if (NULLABLE_SORT.has(o.key)) q.orderByRaw(`${col} IS NULL`);
	if (o.key === 'name' || o.key === 'solvent' || o.key === 'owner') q.orderByRaw(`LOWER(${col}) ${o.dir}`);
	else q.orderBy(col, o.dir);
	if (o.key !== 'id') q.orderBy('s.id', o.key === 'createdAt' || o.key === 'updatedAt' ? o.dir : 'asc');
	return q;
}

/** Takes the next change number and leaves it in LAST_INSERT_ID() (the row stays locked until commit). */
const NEXT_CHANGE_SEQ_SQL = 'UPDATE library_state SET change_seq = LAST_INSERT_ID(change_seq + 1) WHERE id = 1';

/** Stamps the next Library change number (serialises concurrent writers on one row until commit). */
export async function nextChangeSeq(trx: Knex | Knex.Transaction): Promise<number> {
	// LAST_INSERT_ID(expr) puts the new value in the statement's OK packet (insertId): one round trip, no SELECT
	const [ok] = await trx.raw(NEXT_CHANGE_SEQ_SQL);
	const seq = Number((ok as { insertId?: number }).insertId);
	if (!seq) throw new Error('library_state has no row 1 (run the migrations)');
	return seq;
}

/** The Library's current change number (0 before any write). */
export async function currentChangeSeq(conn: Knex = db()): Promise<number> {
	const r = await conn('library_state').where({ id: 1 }).first('change_seq');
	return Number(r?.change_seq ?? 0);
}

/** Stores an uploaded file once (chunked); returns its id. */
export async function insertSpectrumFile(trx: Knex | Knex.Transaction, f: { groupId: number; sha256: string; fileName: string; bytes: Uint8Array }): Promise<number> {
	const chunks = chunkBytes(f.bytes, FILE_CHUNK_BYTES);
	const [id] = await trx('spectrum_files').insert({ group_id: f.groupId, sha256: f.sha256, file_name: f.fileName.slice(0, 255), byte_count: f.bytes.byteLength, chunk_count: chunks.length });
	await insertBatched(trx, 'spectrum_file_chunks', chunks.map((data, chunk_no) => ({ file_id: Number(id), chunk_no, data })));
	return Number(id);
}

/** The original file's bytes. */
export async function findSpectrumFileBytes(fileId: number, conn: Knex | Knex.Transaction = db()): Promise<Buffer> {
	const rows: { data: Buffer }[] = await conn('spectrum_file_chunks').where({ file_id: fileId }).orderBy('chunk_no').select('data');
	return Buffer.concat(rows.map((r) => r.data));
}

/** The row with `file_bytes` filled in (for "original file" exports). */
export async function withFileBytes<T extends Pick<SpectrumRow, 'file_id'>>(row: T): Promise<T & { file_bytes: Buffer }> {
	return { ...row, file_bytes: row.file_id ? await findSpectrumFileBytes(row.file_id) : Buffer.alloc(0) };
}

/** `spectrum_points` rows of one series. */
function pointRows(spectrumId: number, series: PointSeries, bytes: Buffer) {
	return chunkBytes(bytes, POINT_CHUNK_VALUES * 8).map((data, chunk_no) => ({ spectrum_id: spectrumId, series: POINT_SERIES.indexOf(series), chunk_no, data }));
}

/** Splits a row into the metadata columns and the side-table values. */
function splitRow<T extends Record<string, unknown>>(row: T) {
	const meta: Record<string, unknown> = {};
	const side: Partial<Record<PointSeries | 'search_vector', Buffer>> = {};
	for (const [k, v] of Object.entries(row)) {
		if (k === 'file_bytes') continue;
		if (SIDE_FIELDS.has(k)) {
			if (v !== undefined) side[k as PointSeries | 'search_vector'] = v as Buffer;
		} else meta[k] = v;
	}
	return { meta, side };
}

/**
 * The side values of a NEW spectrum as stored: when the file's own series are byte for byte the
 * normalised ones (a file in nm, ascending, in the stored unit — most UV–vis exports), only the
 * normalised pair is written and the original pair is implied (sideDataOf fills it back in).
 */
function storedSide(side: Partial<Record<PointSeries | 'search_vector', Buffer>>): Partial<Record<PointSeries | 'search_vector', Buffer>> {
	const { x_original: xo, y_original: yo, ...rest } = side;
	if (xo && yo && side.x_nm && side.y_normalised && xo.equals(side.x_nm) && yo.equals(side.y_normalised)) return rest;
	return side;
}

/** The `spectrum_points` and `spectrum_vectors` rows of new spectra (storedSide applied); `idOf(i)` is the i-th id. */
function sideTableRows(split: { side: Partial<Record<PointSeries | 'search_vector', Buffer>> }[], idOf: (i: number) => unknown) {
	const points: Record<string, unknown>[] = [];
	const vectors: Record<string, unknown>[] = [];
	split.forEach(({ side: given }, i) => {
		const side = storedSide(given);
		const id = idOf(i);
		for (const s of POINT_SERIES) if (side[s]) for (const p of pointRows(0, s, side[s]!)) points.push({ ...p, spectrum_id: id });
		if (side.search_vector) vectors.push({ spectrum_id: id, vector: side.search_vector });
	});
	return { points, vectors };
}

/**
 * Inserts spectra (one metadata row each) and their points and vectors with
 * multi-row inserts batched below max_allowed_packet; returns the ids in order.
 */
export async function insertSpectra(trx: Knex.Transaction, rows: NewSpectrumRow[], seq?: number, opts: { newFile?: boolean } = {}): Promise<number[]> {
	const changeSeq = seq ?? (await nextChangeSeq(trx));
	const ids: number[] = [];
	const split = rows.map((row) => splitRow(row as unknown as Record<string, unknown>));
	const fileId = rows[0]?.file_id;
	// (`newFile`: the caller inserted the file in this transaction, so no spectrum can reference it yet)
	if (rows.length > 1 && fileId && rows.every((r) => r.file_id === fileId) && (opts.newFile || !(await trx('spectra').where({ file_id: fileId }).first('id')))) {
		// one multi-row insert for the spectra of one new file; their ids read back in insertion order
		await insertBatched(trx, 'spectra', split.map(({ meta }) => ({ ...meta, change_seq: changeSeq })));
		const got = (await trx('spectra').where({ file_id: fileId }).orderBy('id').select('id')).map((r: { id: number }) => Number(r.id));
		if (got.length !== rows.length) throw new Error(`insertSpectra: ${got.length} rows for ${rows.length} spectra of file ${fileId}`);
		ids.push(...got);
	} else {
		for (const { meta } of split) {
			const [id] = await trx('spectra').insert({ ...meta, change_seq: changeSeq });
			ids.push(Number(id));
		}
	}
	const { points, vectors } = sideTableRows(split, (i) => ids[i]);
	await insertBatched(trx, 'spectrum_points', points);
	await insertBatched(trx, 'spectrum_vectors', vectors);
	return ids;
}

let consecutiveIds: boolean | null = null;

/**
 * Whether one multi-row INSERT gets consecutive auto-increment ids: innodb_autoinc_lock_mode 0 or 1
 * ("simple inserts" take their whole range at once) and an increment of 1. Read once per process.
 */
export async function multiRowIdsAreConsecutive(conn: Knex | Knex.Transaction): Promise<boolean> {
	if (consecutiveIds !== null) return consecutiveIds;
	try {
		const [rows] = await conn.raw('SELECT @@innodb_autoinc_lock_mode AS mode, @@auto_increment_increment AS step');
		consecutiveIds = Number(rows[0]?.mode) <= 1 && Number(rows[0]?.step) === 1;
	} catch {
		consecutiveIds = false;
	}
	return consecutiveIds;
}

/** Bytes the one-trip store of a file would send (BLOBs travel as hex): compare with statementBudget(). */
export function oneTripBytes(bytes: Uint8Array, rows: NewSpectrumRow[]): number {
	let n = 2 * bytes.byteLength + 4096;
	for (const r of rows) {
		for (const [k, v] of Object.entries(r)) n += v instanceof Uint8Array ? 2 * v.byteLength + 16 : k.length + String(v ?? 'NULL').length * 2 + 8;
	}
	return n;
}

/** The read-back of storeNewFileOneTrip (constant text, compiled once). */
let readBackSql: string | undefined;

/**
 * Stores a new file and its spectra in ONE round trip: a MariaDB compound statement (BEGIN NOT
 * ATOMIC … END is a single statement, so the connection needs no multi-statement mode) that runs its
 * own transaction — an exit handler rolls back and re-raises any error, a duplicate (ER_DUP_ENTRY
 * on group + file hash + block) included, so nothing is written — and inside it stamps the change
 * number (first, as every writer does), inserts the file and its chunks, the spectra in one
 * multi-row insert, their points, vectors, `create` revisions and tags keyed on LAST_INSERT_ID(),
 * reads the new rows back as summaries (a result set of the same statement) and commits.
 * Only for servers where multi-row ids are consecutive (multiRowIdsAreConsecutive) and files that
 * fit one statement (oneTripBytes ≤ statementBudget).
 * @returns the summary rows in insertion order
 */
export async function storeNewFileOneTrip(
	conn: Knex,
	file: { groupId: number; sha256: string; fileName: string; bytes: Uint8Array },
	rows: NewSpectrumRow[],
	extra: { revisionUserId: string | null; tagNames: string[] }
): Promise<SpectrumRow[]> {
	if (!rows.length) throw new Error('storeNewFileOneTrip: no spectra');
	const chunks = chunkBytes(file.bytes, FILE_CHUNK_BYTES);
	const split = rows.map((row) => splitRow(row as unknown as Record<string, unknown>));
	const { points, vectors } = sideTableRows(split, (i) => sqlVar('ws_first', i));
	const statements = [
		NEXT_CHANGE_SEQ_SQL,
		// no row 1: NULL, which the NOT NULL change_seq of the spectra insert refuses
		'SET @ws_seq = IF(ROW_COUNT() = 1, LAST_INSERT_ID(), NULL)',
		insertSql('spectrum_files', [{ group_id: file.groupId, sha256: file.sha256, file_name: file.fileName.slice(0, 255), byte_count: file.bytes.byteLength, chunk_count: chunks.length }]),
		'SET @ws_file = LAST_INSERT_ID()',
		insertSql('spectrum_file_chunks', chunks.map((data, chunk_no) => ({ file_id: sqlVar('ws_file'), chunk_no, data }))),
		insertSql('spectra', split.map(({ meta }) => ({ ...meta, file_id: sqlVar('ws_file'), change_seq: sqlVar('ws_seq') }))),
		'SET @ws_first = LAST_INSERT_ID()'
	];
	if (points.length) statements.push(insertSql('spectrum_points', points));
	if (vectors.length) statements.push(insertSql('spectrum_vectors', vectors));
	statements.push(insertSql('spectrum_revisions', rows.map((_, i) => ({ spectrum_id: sqlVar('ws_first', i), version: 1, action: 'create', user_id: extra.revisionUserId, changes: null }))));
	if (extra.tagNames.length) {
		statements.push(insertSql('tags', extra.tagNames.map((name) => ({ name })), 'IGNORE'));
		statements.push(`INSERT INTO spectrum_tags (spectrum_id, tag_id) SELECT s.id, t.id FROM spectra s JOIN tags t ON t.name IN (${extra.tagNames.map(sqlValue).join(', ')}) WHERE s.file_id = @ws_file`);
	}
	// the read-back before COMMIT: a failure anywhere, this SELECT included, leaves nothing written
	// by primary-key range (no sort), the file checked too; a row missing from the range fails the id check below
	readBackSql ??= summaryQuery(conn).whereRaw('s.id BETWEEN @ws_first AND @ws_first + @ws_n - 1 AND s.file_id = @ws_file').orderBy('s.id').select([...SUMMARY_COLUMNS, conn.raw('@ws_first AS ws_first')]).toString();
	statements.push(`SET @ws_n = ${rows.length}`, readBackSql);
	statements.push('COMMIT');
	const sql = `BEGIN NOT ATOMIC\nDECLARE EXIT HANDLER FOR SQLEXCEPTION BEGIN ROLLBACK; RESIGNAL; END;\nSTART TRANSACTION;\n${statements.join(';\n')};\nEND`;
	// no bindings: the text is complete (db/sqlText.ts), so neither knex nor mysql2 scans it again
	const [results] = await conn.raw(sql);
	// mysql2: the result set, then the OK packet of the statement
	const got: (SpectrumRow & { ws_first: number })[] = Array.isArray(results[0]) ? results[0] : results;
	const first = Number(got[0]?.ws_first);
	if (got.length !== rows.length || got.some((r, i) => Number(r.id) !== first + i))
		throw new Error(`storeNewFileOneTrip: the spectra of ${file.fileName} did not get consecutive ids (${got.map((r) => r.id).join(', ')} from ${first})`);
	return got.map(({ ws_first: _, ...r }) => r as SpectrumRow);
}

/** Inserts one spectrum; returns its id. */
export async function insertSpectrum(trx: Knex.Transaction, row: NewSpectrumRow): Promise<number> {
	return (await insertSpectra(trx, [row]))[0];
}

/** The rows of `groupId` that already hold this file (any block), deleted ones included. */
export async function findSpectraBySha(trx: Knex | Knex.Transaction, groupId: number, sha256: string): Promise<Pick<SpectrumRow, 'id' | 'name' | 'block_index' | 'deleted_at' | 'owner_id' | 'visibility'>[]> {
	return trx('spectra').where({ group_id: groupId, file_sha256: sha256 }).select('id', 'name', 'block_index', 'deleted_at', 'owner_id', 'visibility');
}

/** Points and vectors of some spectra, assembled per id. */
export async function sideDataOf(ids: number[], conn: Knex | Knex.Transaction, what: { points: boolean; vector: boolean }) {
	const out = new Map<number, Partial<Record<PointSeries | 'search_vector', Buffer>>>();
	for (const id of ids) out.set(id, {});
	if (!ids.length) return out;
	if (what.points) {
		const rows: { spectrum_id: number; series: number; data: Buffer }[] = await conn('spectrum_points').whereIn('spectrum_id', ids).orderBy(['spectrum_id', 'series', 'chunk_no']).select('spectrum_id', 'series', 'data');
		const parts = new Map<string, Buffer[]>();
		for (const r of rows) {
			const k = `${r.spectrum_id}:${r.series}`;
			parts.set(k, [...(parts.get(k) ?? []), r.data]);
		}
		for (const id of ids) {
			const o = out.get(id)!;
			for (let s = 0; s < POINT_SERIES.length; s++) o[POINT_SERIES[s]] = Buffer.concat(parts.get(`${id}:${s}`) ?? []);
			// no original pair stored: the file's series were the normalised ones (storedSide)
			if (!parts.has(`${id}:0`) && !parts.has(`${id}:1`)) {
				o.x_original = o.x_nm;
				o.y_original = o.y_normalised;
			}
		}
	}
	if (what.vector) {
		const rows: { spectrum_id: number; vector: Buffer }[] = await conn('spectrum_vectors').whereIn('spectrum_id', ids).select('spectrum_id', 'vector');
		for (const r of rows) out.get(Number(r.spectrum_id))!.search_vector = r.vector;
		for (const id of ids) out.get(id)!.search_vector ??= Buffer.alloc(0);
	}
	return out;
}

const summaryQuery = (conn: Knex | Knex.Transaction) =>
	conn('spectra as s').leftJoin('users as u', 'u.id', 's.owner_id').leftJoin('groups as g', 'g.id', 's.group_id');

/** One full row (points and vector, not the file bytes) with owner and group names, deleted or not; undefined when missing. */
export async function findSpectrumById(id: number, conn: Knex | Knex.Transaction = db()): Promise<SpectrumRow | undefined> {
	const row = await summaryQuery(conn).where('s.id', id).first(SUMMARY_COLUMNS);
	if (!row) return undefined;
	const side = await sideDataOf([Number(row.id)], conn, { points: true, vector: true });
	return { ...row, ...side.get(Number(row.id)) } as SpectrumRow;
}

/** The metadata row only (no points, vector or file), deleted or not. */
export async function findSpectrumSummaryById(id: number, conn: Knex | Knex.Transaction = db()): Promise<SpectrumRow | undefined> {
	return summaryQuery(conn).where('s.id', id).first(SUMMARY_COLUMNS);
}

/** Metadata rows by id, in the order given (no visibility rule: for the writer's own answer). */
export async function findSpectrumSummariesByIds(ids: number[], conn: Knex | Knex.Transaction = db()): Promise<SpectrumRow[]> {
	if (!ids.length) return [];
	const rows: SpectrumRow[] = await summaryQuery(conn).whereIn('s.id', ids).select(SUMMARY_COLUMNS);
	const byId = new Map(rows.map((r) => [Number(r.id), r]));
	return ids.map((id) => byId.get(id)).filter((r): r is SpectrumRow => !!r);
}

/** The search vectors of some spectra (Float32 little-endian bytes) by id. */
export async function findVectors(ids: number[], conn: Knex = db()): Promise<Map<number, Buffer>> {
	const side = await sideDataOf(ids, conn, { points: false, vector: true });
	return new Map([...side].map(([id, s]) => [id, s.search_vector!]));
}

/**
 * Summaries of visible rows matching the filters (newest change first, or `order`); at most
 * `limit` rows when given. With `withVector` the vectors are attached (one more query).
 */
export async function listSpectrumSummaries(reader: Reader, f: SpectrumSqlFilter, conn: Knex = db(), opts: { order?: SpectrumOrder; limit?: number } = {}): Promise<SpectrumRow[]> {
	const q = applyOrder(applyFilter(summaryQuery(conn).select(SUMMARY_COLUMNS), reader, f), opts.order ?? { key: 'id', dir: 'desc' });
	if (opts.limit) q.limit(opts.limit);
	const rows: SpectrumRow[] = await q;
	if (!f.withVector) return rows;
	const vectors = await findVectors(rows.map((r) => Number(r.id)), conn);
	return rows.map((r) => ({ ...r, search_vector: vectors.get(Number(r.id)) ?? Buffer.alloc(0) }));
}

/** One upload of ≥ 3 measured absorbance spectra (a kinetics or irradiation series), its spectra in file order. */
export interface AbsorbanceSeries {
	fileName: string | null;
	spectra: { id: number; name: string; block_label: string | null; block_time_s: number | null; path_cm: number | null }[];
}

/**
 * The newest `limit` uploads (one stored file each) with at least 3 visible, not deleted absorbance spectra, and
 * whether there are more. The uploads are walked newest first along the file index and the walk stops after
 * `limit` of them (≈ 8 ms at 100,000 spectra, where grouping the whole table took 200 ms) — a Library of that
 * size is never read whole.
 */
export async function listAbsorbanceSeries(reader: Reader, limit: number, conn: Knex = db()): Promise<{ series: AbsorbanceSeries[]; more: boolean }> {
	const measured = (q: Knex.QueryBuilder) => applyFilter(q, reader, { kind: 'absorption' }).where('s.y_unit', 'absorbance');
	const top: { file_id: number }[] = await measured(conn.from(conn.raw('`spectra` AS `s` FORCE INDEX (`spectra_file_id_foreign`)')))
		.whereNotNull('s.file_id')
		.groupBy('s.file_id')
		.havingRaw('COUNT(*) >= 3')
		.orderBy('s.file_id', 'desc')
		.limit(limit + 1)
		.select('s.file_id');
	const more = top.length > limit;
	const fileIds = top.slice(0, limit).map((t) => Number(t.file_id));
	if (!fileIds.length) return { series: [], more };
	const rows: (AbsorbanceSeries['spectra'][number] & { file_id: number; file_name: string | null })[] = await measured(conn('spectra as s'))
		.whereIn('s.file_id', fileIds)
		.orderBy(['s.block_index', 's.id'])
		.select('s.id', 's.name', 's.block_label', 's.block_time_s', 's.path_cm', 's.file_id', 's.file_name');
	const byFile = new Map<number, typeof rows>();
	for (const r of rows) byFile.set(Number(r.file_id), [...(byFile.get(Number(r.file_id)) ?? []), r]);
	const series = fileIds.map((id) => {
		const list = byFile.get(id) ?? [];
		return { fileName: list[0]?.file_name ?? null, spectra: list.map((r) => ({ id: Number(r.id), name: r.name, block_label: r.block_label, block_time_s: r.block_time_s, path_cm: r.path_cm })) };
	});
	return { series, more };
}

/** One page of visible summaries and the exact number of matching rows. */
export async function pageSpectrumSummaries(reader: Reader, f: SpectrumSqlFilter, order: SpectrumOrder, limit: number, offset: number, conn: Knex = db(), opts: { count?: boolean } = {}): Promise<{ rows: SpectrumRow[]; total: number }> {
	const pageQ = applyOrder(applyFilter(summaryQuery(conn).select(SUMMARY_COLUMNS), reader, f), order).limit(limit).offset(offset);
	if (opts.count === false) return { rows: await pageQ, total: -1 };
	const countQ = applyFilter(conn('spectra as s'), reader, f).count({ n: '*' });
	const [[c], rows] = await Promise.all([countQ, pageQ]);
	return { rows, total: Number((c as { n: number }).n) };
}

/** Ids of every visible row matching the filters, in `order` (one integer column; for the vector filters). */
export async function listSpectrumIds(reader: Reader, f: SpectrumSqlFilter, order: SpectrumOrder, conn: Knex = db()): Promise<Int32Array> {
	const q = applyOrder(applyFilter(conn('spectra as s'), reader, f), order).select('s.id');
	if (order.key === 'owner' || f.owner) q.leftJoin('users as u', 'u.id', 's.owner_id');
	const rows: number[][] = await q.options({ rowsAsArray: true });
	const out = new Int32Array(rows.length);
	for (let i = 0; i < rows.length; i++) out[i] = rows[i][0];
	return out;
}

/** Summaries by id, in the order given (missing or hidden ids dropped). */
export async function summariesByIds(reader: Reader, ids: number[], f: SpectrumSqlFilter = { deleted: 'include' }, conn: Knex = db()): Promise<SpectrumRow[]> {
	if (!ids.length) return [];
	const rows: SpectrumRow[] = await applyFilter(summaryQuery(conn).select(SUMMARY_COLUMNS), reader, { ...f, ids });
	const byId = new Map(rows.map((r) => [Number(r.id), r]));
	return ids.map((id) => byId.get(id)).filter((r): r is SpectrumRow => !!r);
}

/**
 * Updates a spectrum if the row still has `version`; bumps the version and the change number.
 * Points and vector in the patch replace the stored ones.
 * Returns the number of rows changed (0 = stale version or missing row).
 */
export async function updateSpectrumIfVersion(trx: Knex.Transaction, id: number, version: number, patch: Partial<NewSpectrumRow> & { deleted_at?: Date | null }): Promise<number> {
	const { meta, side } = splitRow(patch as Record<string, unknown>);
	const seq = await nextChangeSeq(trx);
	const n = await trx('spectra')
		.where({ id, version })
		.update({ ...meta, version: version + 1, change_seq: seq, updated_at: trx.fn.now() });
	if (n !== 1) return n;
	if ((side.x_nm || side.y_normalised) && !side.x_original && !side.y_original) await keepImpliedOriginals(trx, id);
	for (const s of POINT_SERIES) {
		if (!side[s]) continue;
		await trx('spectrum_points').where({ spectrum_id: id, series: POINT_SERIES.indexOf(s) }).delete();
		await insertBatched(trx, 'spectrum_points', pointRows(id, s, side[s]!));
	}
	if (side.search_vector) {
		await trx('spectrum_vectors').where({ spectrum_id: id }).delete();
		await trx('spectrum_vectors').insert({ spectrum_id: id, vector: side.search_vector });
	}
	return n;
}

/**
 * Before the normalised series of a spectrum are rewritten: if its original pair is implied (not
 * stored, storedSide), write it out from the normalised pair as it is now, so the file's own
 * numbers never change with an edit.
 */
export async function keepImpliedOriginals(trx: Knex.Transaction, id: number): Promise<void> {
	const x = POINT_SERIES.indexOf('x_original');
	const y = POINT_SERIES.indexOf('y_original');
	const has = await trx('spectrum_points').where({ spectrum_id: id }).whereIn('series', [x, y]).first('series');
	if (has) return;
	await trx.raw(
		'INSERT INTO spectrum_points (spectrum_id, series, chunk_no, data) SELECT spectrum_id, CASE series WHEN ? THEN ? ELSE ? END, chunk_no, data FROM spectrum_points WHERE spectrum_id = ? AND series IN (?, ?)',
		[POINT_SERIES.indexOf('x_nm'), x, y, id, POINT_SERIES.indexOf('x_nm'), POINT_SERIES.indexOf('y_normalised')]
	);
}

/** What the Library index (services/spectraVectorCache.ts) reads of each spectrum. */
export type VectorCacheRow = Pick<
	SpectrumRow,
	'id' | 'group_id' | 'owner_id' | 'name' | 'synonyms' | 'cas' | 'part' | 'kind' | 'solvent' | 'visibility' | 'y_unit' | 'concentration_m' | 'path_cm' | 'lambda_max_nm' | 'deleted_at' | 'created_at' | 'updated_at'
> & { change_seq: number; vector: Buffer | null };

/** Rows changed after `seq` with id > `afterId`, at most `limit`, by id. */
export async function vectorRowsChangedSince(seq: number, afterId: number, limit: number, conn: Knex = db()): Promise<VectorCacheRow[]> {
	return conn('spectra as s')
		.leftJoin('spectrum_vectors as v', 'v.spectrum_id', 's.id')
		.where('s.change_seq', '>', seq)
		.andWhere('s.id', '>', afterId)
		.orderBy('s.id')
		.limit(limit)
		.select(
			's.id', 's.group_id', 's.owner_id', 's.name', 's.synonyms', 's.cas', 's.part', 's.kind', 's.solvent', 's.visibility', 's.y_unit',
			's.concentration_m', 's.path_cm', 's.lambda_max_nm', 's.deleted_at', 's.created_at', 's.updated_at', 's.change_seq', 'v.vector'
		);
}

/** Ids of users whose name contains `text` (case-insensitive). */
export async function userIdsNamed(text: string, conn: Knex = db()): Promise<string[]> {
	const rows: { id: string }[] = await conn('users').whereRaw('LOWER(name) LIKE ?', [`%${likeEscape(text)}%`]).select('id');
	return rows.map((r) => r.id);
}

/** Names of users by id. */
export async function userNames(ids: string[], conn: Knex = db()): Promise<Map<string, string>> {
	if (!ids.length) return new Map();
	const rows: { id: string; name: string }[] = await conn('users').whereIn('id', ids).select('id', 'name');
	return new Map(rows.map((r) => [r.id, r.name]));
}

/** Ids of spectra carrying any of the tags. */
export async function spectrumIdsTagged(tagIds: number[], conn: Knex = db()): Promise<number[]> {
	if (!tagIds.length) return [];
	const rows: { spectrum_id: number }[] = await conn('spectrum_tags').whereIn('tag_id', tagIds).distinct('spectrum_id');
	return rows.map((r) => Number(r.spectrum_id));
}

/** Resolves group slugs or ids to ids. */
export async function findGroupIds(keys: string[], conn: Knex = db()): Promise<number[]> {
	const nums = keys.filter((k) => /^\d+$/.test(k)).map(Number);
	const rows = await conn('groups').whereIn('slug', keys).orWhereIn('id', nums.length ? nums : [-1]).select('id');
	return rows.map((r: { id: number }) => Number(r.id));
}

/** Reads the points of a stored row back as Float64 arrays (convenience for callers). */
export const pointsOf = (row: Pick<SpectrumRow, 'x_nm' | 'y_normalised'>) => ({ x: bufferToFloat64(row.x_nm), y: bufferToFloat64(row.y_normalised) });
