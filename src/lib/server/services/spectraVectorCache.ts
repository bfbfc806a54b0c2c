/**
 * The per-process cache of the Library's 1 nm search vectors: one contiguous Float32Array (in a
 * SharedArrayBuffer, so the similarity worker reads it without a copy) plus per-spectrum columns
 * (id, kind, unit, c·l, inverse L2 norm, the facts of spectraVectorFilters.ts).
 *
 * Loaded lazily on first use, in pages of rows, and kept right by the Library's change counter:
 * every request reads `library_state.change_seq` (one primary-key lookup) and reloads exactly the
 * rows stamped after the value this process last saw. Several stateless app servers on one
 * database therefore answer alike. Rows that were hard-deleted linger here, but every answer is
 * built from ids the database has just returned for the caller, so they are never shown.
 */
import { currentChangeSeq, vectorRowsChangedSince, type VectorCacheRow } from '../db/spectra';
import { copyFloat32Into } from '../db/spectraBlobs';
import { db } from '../db/index';
import { SEARCH_LENGTH } from '../../spectra/grid';
import { vectorFacts } from './spectraVectorFilters';

const PAGE_ROWS = 2000;

export class VectorCache {
	readonly len = SEARCH_LENGTH;
	capacity = 0;
	count = 0;
	seq = -1;
	vectors = new Float32Array(new SharedArrayBuffer(0));
	ids = new Int32Array(new SharedArrayBuffer(0));
	invNorm = new Float64Array(new SharedArrayBuffer(0));
	kindCode = new Uint8Array(0);
	unitCode = new Uint8Array(0);
	/** c·l (mol L⁻¹ · cm) or NaN when either is unknown. */
	cl = new Float64Array(0);
	max = new Float32Array(0);
	lastAbove5pct = new Int16Array(0);
	lastMeasured = new Int16Array(0);
	lastBelowHalf = new Int16Array(0);
	/** Whether the stored vector had the expected length (other ones never match and are skipped). */
	valid = new Uint8Array(0);
	readonly slotOf = new Map<number, number>();
	readonly kinds: string[] = [];
	readonly units: string[] = [];
	private refreshing: Promise<void> | null = null;

	private code(list: string[], s: string): number {
		let i = list.indexOf(s);
		if (i < 0) {
			list.push(s);
			i = list.length - 1;
		}
		return i;
	}

	kindOf(slot: number): string {
		return this.kinds[this.kindCode[slot]];
	}

	unitOf(slot: number): string {
		return this.units[this.unitCode[slot]];
	}

	/** The vector of a slot (a view, no copy). */
	vector(slot: number): Float32Array {
		return this.vectors.subarray(slot * this.len, (slot + 1) * this.len);
	}

	private grow(min: number) {
		if (min <= this.capacity) return;
		const cap = Math.max(min, Math.ceil(this.capacity * 1.5), 1024);
		const vec = new Float32Array(new SharedArrayBuffer(cap * this.len * 4));
		vec.set(this.vectors.subarray(0, this.count * this.len));
		this.vectors = vec;
		const ids = new Int32Array(new SharedArrayBuffer(cap * 4));
		ids.set(this.ids.subarray(0, this.count));
		this.ids = ids;
		const inv = new Float64Array(new SharedArrayBuffer(cap * 8));
		inv.set(this.invNorm.subarray(0, this.count));
		this.invNorm = inv;
		const copy = <T extends Uint8Array | Int16Array | Float32Array | Float64Array>(old: T, make: (n: number) => T): T => {
			const a = make(cap);
			a.set(old.subarray(0, this.count) as never);
			return a;
		};
		this.kindCode = copy(this.kindCode, (n) => new Uint8Array(n));
		this.unitCode = copy(this.unitCode, (n) => new Uint8Array(n));
		this.cl = copy(this.cl, (n) => new Float64Array(n));
		this.max = copy(this.max, (n) => new Float32Array(n));
		this.lastAbove5pct = copy(this.lastAbove5pct, (n) => new Int16Array(n));
		this.lastMeasured = copy(this.lastMeasured, (n) => new Int16Array(n));
		this.lastBelowHalf = copy(this.lastBelowHalf, (n) => new Int16Array(n));
		this.valid = copy(this.valid, (n) => new Uint8Array(n));
		this.capacity = cap;
	}

	/** Writes one row into its slot (a new slot for a new id). */
	put(r: VectorCacheRow) {
		const id = Number(r.id);
		let slot = this.slotOf.get(id);
		if (slot === undefined) {
			this.grow(this.count + 1);
			slot = this.count++;
			this.slotOf.set(id, slot);
		}
		const off = slot * this.len;
		const buf = r.vector;
		const ok = !!buf && buf.byteLength === this.len * 4;
		if (ok) copyFloat32Into(buf!, this.vectors, off);
		else this.vectors.fill(0, off, off + this.len);
		const v = this.vector(slot);
		let ss = 0;
		for (let i = 0; i < v.length; i++) ss += v[i] * v[i];
		this.ids[slot] = id;
		this.invNorm[slot] = ss > 0 ? 1 / Math.sqrt(ss) : 0;
		this.kindCode[slot] = this.code(this.kinds, r.kind);
		this.unitCode[slot] = this.code(this.units, r.y_unit);
		this.cl[slot] = r.concentration_m && r.path_cm ? r.concentration_m * r.path_cm : NaN;
		const f = vectorFacts(v);
		this.max[slot] = f.max;
		this.lastAbove5pct[slot] = f.lastAbove5pct;
		this.lastMeasured[slot] = f.lastMeasured;
		this.lastBelowHalf[slot] = f.lastBelowHalf;
		this.valid[slot] = ok ? 1 : 0;
	}

	/** Brings the cache up to the database's change number (one small query when nothing changed). */
	async refresh(): Promise<void> {
		while (this.refreshing) await this.refreshing;
		const seq = await currentChangeSeq(db());
		if (seq === this.seq) return;
		if (this.refreshing) return this.refresh();
		this.refreshing = (async () => {
			const since = this.seq < 0 ? -1 : this.seq;
			if (since < 0) {
				const [rows] = await db().raw('SELECT COUNT(*) AS n FROM spectra');
				this.grow(Math.ceil(Number(rows[0].n) * 1.05) + 64);
			}
			for (let after = 0; ; ) {
				const rows = await vectorRowsChangedSince(since, after, PAGE_ROWS);
				for (const r of rows) this.put(r);
				if (rows.length < PAGE_ROWS) break;
				after = Number(rows[rows.length - 1].id);
			}
			this.seq = seq;
		})();
		try {
			await this.refreshing;
		} finally {
			this.refreshing = null;
		}
	}

	/** Slots of the given ids (ids not in the cache are dropped). */
	slotsOf(ids: ArrayLike<number>): Int32Array {
		const out = new Int32Array(ids.length);
		let n = 0;
		for (let i = 0; i < ids.length; i++) {
			const s = this.slotOf.get(ids[i]);
			if (s !== undefined && this.valid[s]) out[n++] = s;
		}
		return out.subarray(0, n);
	}

	/** Bytes held (vectors and columns). */
	bytes(): number {
		return this.capacity * (this.len * 4 + 4 + 8 + 1 + 1 + 8 + 4 + 2 * 3 + 1);
	}
}

let cache: VectorCache | null = null;

/** This process's cache, refreshed to the database's change number. */
export async function vectorCache(): Promise<VectorCache> {
	cache ??= new VectorCache();
	await cache.refresh();
	return cache;
}

/** Drops the cache (tests; a new one loads from scratch). */
export function resetVectorCache(): void {
	cache = null;
}
