/**
 * Float64 point arrays and Float32 vectors ↔ little-endian bytes, and the chunking rules for the
 * BLOB side tables (`spectrum_points`, `spectrum_file_chunks`): values and bytes are cut into rows
 * of bounded size, and multi-row inserts are batched so that every statement stays well below the
 * server's max_allowed_packet (mysql2 sends a Buffer as X'…' hex, twice its size).
 */
import { endianness } from 'node:os';
import type { Knex } from 'knex';

const LITTLE_ENDIAN = endianness() === 'LE';

/** Values per `spectrum_points` row: 65,536 Float64 = 512 KiB. */
export const POINT_CHUNK_VALUES = 65536;
/** Bytes per `spectrum_file_chunks` row: 1 MiB. */
export const FILE_CHUNK_BYTES = 1 << 20;
/** The point series of a spectrum, as stored in `spectrum_points.series`. */
export const POINT_SERIES = ['x_original', 'y_original', 'x_nm', 'y_normalised'] as const;
export type PointSeries = (typeof POINT_SERIES)[number];

/** Float64 values → little-endian bytes. */
export function float64ToBuffer(v: ArrayLike<number>): Buffer {
	if (LITTLE_ENDIAN) {
		const f = v instanceof Float64Array ? v : Float64Array.from(v as ArrayLike<number>);
		return Buffer.from(f.buffer.slice(f.byteOffset, f.byteOffset + f.byteLength));
	}
	const out = Buffer.alloc(v.length * 8);
	for (let i = 0; i < v.length; i++) out.writeDoubleLE(v[i], i * 8);
	return out;
}

/** Little-endian bytes → Float64 values (copies; any alignment). */
export function bufferToFloat64(buf: Uint8Array): Float64Array {
	if (buf.byteLength % 8 !== 0) throw new RangeError(`buffer of ${buf.byteLength} bytes is not a Float64 array`);
	const out = new Float64Array(buf.byteLength / 8);
	if (LITTLE_ENDIAN) {
		new Uint8Array(out.buffer).set(buf);
		return out;
	}
	const view = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
	for (let i = 0; i < out.length; i++) out[i] = view.getFloat64(i * 8, true);
	return out;
}

/** Little-endian bytes → Float32 values written into `out` at `offset` (one memcpy on little-endian hosts). */
export function copyFloat32Into(buf: Uint8Array, out: Float32Array, offset: number): void {
	const n = buf.byteLength >> 2;
	if (LITTLE_ENDIAN) {
		new Uint8Array(out.buffer, out.byteOffset + offset * 4, n * 4).set(buf.subarray(0, n * 4));
		return;
	}
	const view = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
	for (let i = 0; i < n; i++) out[offset + i] = view.getFloat32(i * 4, true);
}

/** Splits bytes into pieces of at most `size` bytes (at least one piece, possibly empty). */
export function chunkBytes(bytes: Uint8Array, size: number): Buffer[] {
	const n = Math.max(1, Math.ceil(bytes.byteLength / size));
	const out: Buffer[] = [];
	for (let c = 0; c < n; c++) out.push(Buffer.from(bytes.buffer, bytes.byteOffset + c * size, Math.min(size, bytes.byteLength - c * size)));
	return out;
}

let packetBudget: number | null = null;

/**
 * Bytes one insert statement may carry: a quarter of the server's max_allowed_packet, at most
 * 8 MiB (read once per process; 4 MiB when the server cannot be asked).
 */
export async function statementBudget(conn: Knex | Knex.Transaction): Promise<number> {
	if (packetBudget !== null) return packetBudget;
	try {
		const [rows] = await conn.raw('SELECT @@max_allowed_packet AS p');
		const p = Number(rows[0]?.p);
		packetBudget = Number.isFinite(p) && p > 0 ? Math.min(8 << 20, Math.floor(p / 4)) : 4 << 20;
	} catch {
		packetBudget = 4 << 20;
	}
	return packetBudget;
}

/** Approximate size of a row in an insert statement: BLOBs as hex (2×), other values as text. */
function rowStatementBytes(row: Record<string, unknown>): number {
	let n = 16;
	for (const v of Object.values(row)) n += v instanceof Uint8Array ? 2 * v.byteLength + 4 : String(v ?? 'NULL').length * 2 + 4;
	return n;
}

/** Multi-row inserts in batches that keep each statement below the budget (never one statement per value). */
export async function insertBatched(trx: Knex | Knex.Transaction, table: string, rows: Record<string, unknown>[], maxRows = 5000): Promise<void> {
	if (!rows.length) return;
	const budget = await statementBudget(trx);
	let batch: Record<string, unknown>[] = [];
	let bytes = 0;
	for (const r of rows) {
		const b = rowStatementBytes(r);
		if (batch.length && (bytes + b > budget || batch.length >= maxRows)) {
			await trx(table).insert(batch);
			batch = [];
			bytes = 0;
		}
		batch.push(r);
		bytes += b;
	}
	if (batch.length) await trx(table).insert(batch);
}
