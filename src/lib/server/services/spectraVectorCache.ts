/**
 * The per-process Library index: the 1 nm search vectors packed in one contiguous Float32Array (in
 * a SharedArrayBuffer, so the similarity worker reads it without a copy) — each slot keeps only its
 * measured stretch, from its first to its last non-zero value (a vector is 0 outside the measured
 * range, grid.ts), with its offset, first grid index and length beside it; most UV–vis spectra
 * cover 200–800 nm, two thirds of the 190–1100 nm grid — and the narrow metadata the
 * filters read (group, owner, visibility, deleted, part, kind, solvent, unit, c·l, dates, λmax) in
 * typed columns, and an n-gram (trigram) index of names, synonyms and CAS numbers.
 *
 * Loaded lazily on first use, in pages of rows, and kept right by the Library's change counter:
 * every request reads `library_state.change_seq` (one primary-key lookup) and reloads exactly the
 * rows stamped after the value this process last saw. Several stateless app servers on one
 * database therefore answer alike. Rows that were hard-deleted (a whole group removed) linger here,
 * but every page is read back from the database with the caller's visibility applied, so they are
 * never shown; and when, after a change, the table holds fewer rows than the index, the index is
 * loaded again from scratch.
 */
import { currentChangeSeq, vectorRowsChangedSince, type VectorCacheRow } from '../db/spectra';
import { copyFloat32Into } from '../db/spectraBlobs';
import { db } from '../db/index';
import { GRID_FROM_NM, SEARCH_LENGTH } from '../../spectra/grid';
import { spectrumTermTexts, trigramsOf } from '../../spectra/trigrams';
import { vectorFacts } from './spectraVectorFilters';

const PAGE_ROWS = 2000;
/** Renamed spectra are scored one by one until this many, then the postings are rebuilt. */
const MAX_DIRTY = 2000;

const VISIBILITY = ['private', 'group', 'public'];

/** A growable list of slots. */
class Postings {
	a = new Int32Array(4);
	n = 0;
	push(v: number) {
		if (this.n === this.a.length) {
			const b = new Int32Array(this.a.length * 2);
			b.set(this.a);
			this.a = b;
		}
		this.a[this.n++] = v;
	}
}

/** String column stored as small integer codes. */
class Dictionary {
	readonly list: string[] = [];
	private readonly index = new Map<string, number>();
	code(s: string): number {
		let i = this.index.get(s);
		if (i === undefined) {
			i = this.list.length;
			this.list.push(s);
			this.index.set(s, i);
		}
		return i;
	}
	find(s: string): number | undefined {
		return this.index.get(s);
	}
}

export class VectorCache {
	readonly len = SEARCH_LENGTH;
	capacity = 0;
	count = 0;
	seq = -1;
	/** The packed stretches: slot s holds vecLen[s] values from grid index vecFrom[s], at vecOff[s]. */
	vectors = new Float32Array(new SharedArrayBuffer(0));
	vecOff = new Int32Array(new SharedArrayBuffer(0));
	vecFrom = new Int16Array(new SharedArrayBuffer(0));
	vecLen = new Int16Array(new SharedArrayBuffer(0));
	/** Floats of `vectors` in use (the rest of the buffer is reserved address space, never touched, so not resident). */
	used = 0;
	/** Floats left behind by stretches that were rewritten longer elsewhere. */
	wasted = 0;
	private readonly scratch = new Float32Array(SEARCH_LENGTH);
	ids = new Int32Array(new SharedArrayBuffer(0));
	invNorm = new Float64Array(new SharedArrayBuffer(0));
	kindCode = new Uint8Array(0);
	unitCode = new Uint8Array(0);
	partCode = new Uint8Array(0);
	visCode = new Uint8Array(0);
	ownerCode = new Int32Array(0);
	solventCode = new Int32Array(0);
	groupId = new Int32Array(0);
	deleted = new Uint8Array(0);
	updatedMs = new Float64Array(0);
	createdMs = new Float64Array(0);
	lambdaMax = new Float64Array(0);
	/** c·l (mol L⁻¹ · cm) or NaN when either is unknown. */
	cl = new Float64Array(0);
	max = new Float32Array(0);
	lastAbove5pct = new Int16Array(0);
	lastMeasured = new Int16Array(0);
	lastBelowHalf = new Int16Array(0);
	/** Whether the stored vector had the expected length (other ones never match a vector filter). */
	valid = new Uint8Array(0);
	names: string[] = [];
	synonyms: string[][] = [];
	cas: (string | null)[] = [];
	readonly slotOf = new Map<number, number>();
	readonly kinds = new Dictionary();
	readonly units = new Dictionary();
	readonly parts = new Dictionary();
	readonly owners = new Dictionary();
	readonly solvents = new Dictionary();
	private postings = new Map<number, Postings>();
	private readonly termKey: string[] = [];
	private readonly dirty = new Map<number, Set<number>>();
	private refreshing: Promise<void> | null = null;
	/** Scratch of rankedGramHits: grams shared per slot, which slots were touched, and a mark per touched slot. */
	private counts = new Uint16Array(0);
	private touched = new Int32Array(0);
	private inTouched = new Uint8Array(0);
	/** Whether slot order is id order (true unless a row ever arrived with an id below one already held). */
	idsAscending = true;
	/** Rows were removed from the table behind the index's back: load again from scratch. */
	stale = false;

	kindOf(slot: number): string {
		return this.kinds.list[this.kindCode[slot]];
	}

	unitOf(slot: number): string {
		return this.units.list[this.unitCode[slot]];
	}

	/** The whole 1 nm vector of a slot (a new array, 0 outside its stretch). */
	vector(slot: number): Float32Array {
		const v = new Float32Array(this.len);
		const n = this.vecLen[slot];
		if (n > 0) v.set(this.vectors.subarray(this.vecOff[slot], this.vecOff[slot] + n), this.vecFrom[slot]);
		return v;
	}

	/** Value of a slot's vector at grid index i (0 outside its stretch). */
	at(slot: number, i: number): number {
		const k = i - this.vecFrom[slot];
		return k >= 0 && k < this.vecLen[slot] ? this.vectors[this.vecOff[slot] + k] : 0;
	}

	/** Linear interpolation of a slot's vector at λ (nm): vectorAt() of spectraVectorFilters on the packed stretch, without a copy (tested equal). */
	valueAt(slot: number, wavelengthNm: number): number {
		const p = wavelengthNm - GRID_FROM_NM;
		if (p < 0 || p > this.len - 1) return 0;
		const i = Math.floor(p);
		const t = p - i;
		return i + 1 < this.len ? this.at(slot, i) * (1 - t) + this.at(slot, i + 1) * t : this.at(slot, i);
	}

	/** Room for `n` more floats of stretches (grows the buffer by half when full; copies only what is used). */
	private reserve(n: number) {
		if (this.used + n <= this.vectors.length) return;
		const cap = Math.max(this.used + n, Math.ceil(this.vectors.length * 1.5), 1024 * this.len);
		const a = new Float32Array(new SharedArrayBuffer(cap * 4));
		a.set(this.vectors.subarray(0, this.used));
		this.vectors = a;
	}

	/** Stores the stretch of `v` (first to last non-zero value) for a slot: in place when it fits, else at the end. */
	private pack(slot: number, isNew: boolean, v: Float32Array) {
		let first = 0;
		while (first < v.length && v[first] === 0) first++;
		let last = v.length - 1;
		while (last >= first && v[last] === 0) last--;
		const n = Math.max(0, last - first + 1);
		const old = isNew ? 0 : this.vecLen[slot];
		if (isNew || n > old) {
			this.reserve(n);
			if (!isNew) this.wasted += old;
			this.vecOff[slot] = this.used;
			this.used += n;
		} else this.wasted += old - n;
		this.vectors.set(v.subarray(first, first + n), this.vecOff[slot]);
		this.vecFrom[slot] = n ? first : 0;
		this.vecLen[slot] = n;
	}

	private grow(min: number) {
		if (min <= this.capacity) return;
		const cap = Math.max(min, Math.ceil(this.capacity * 1.5), 1024);
		const shared = <T extends Int16Array | Int32Array | Float64Array>(old: T, make: (b: SharedArrayBuffer) => T, width: number): T => {
			const a = make(new SharedArrayBuffer(cap * width));
			a.set(old.subarray(0, this.count) as never);
			return a;
		};
		// address space for whole vectors; only the packed stretches written into it become resident
		if (this.vectors.length < cap * this.len) {
			const a = new Float32Array(new SharedArrayBuffer(cap * this.len * 4));
			a.set(this.vectors.subarray(0, this.used));
			this.vectors = a;
		}
		this.vecOff = shared(this.vecOff, (b) => new Int32Array(b), 4);
		this.vecFrom = shared(this.vecFrom, (b) => new Int16Array(b), 2);
		this.vecLen = shared(this.vecLen, (b) => new Int16Array(b), 2);
		this.ids = shared(this.ids, (b) => new Int32Array(b), 4);
		this.invNorm = shared(this.invNorm, (b) => new Float64Array(b), 8);
		const copy = <T extends Uint8Array | Int16Array | Int32Array | Float32Array | Float64Array>(old: T, make: (n: number) => T): T => {
			const a = make(cap);
			a.set(old.subarray(0, this.count) as never);
			return a;
		};
		this.kindCode = copy(this.kindCode, (n) => new Uint8Array(n));
		this.unitCode = copy(this.unitCode, (n) => new Uint8Array(n));
		this.partCode = copy(this.partCode, (n) => new Uint8Array(n));
		this.visCode = copy(this.visCode, (n) => new Uint8Array(n));
		this.ownerCode = copy(this.ownerCode, (n) => new Int32Array(n));
		this.solventCode = copy(this.solventCode, (n) => new Int32Array(n));
		this.groupId = copy(this.groupId, (n) => new Int32Array(n));
		this.deleted = copy(this.deleted, (n) => new Uint8Array(n));
		this.updatedMs = copy(this.updatedMs, (n) => new Float64Array(n));
		this.createdMs = copy(this.createdMs, (n) => new Float64Array(n));
		this.lambdaMax = copy(this.lambdaMax, (n) => new Float64Array(n));
		this.cl = copy(this.cl, (n) => new Float64Array(n));
		this.max = copy(this.max, (n) => new Float32Array(n));
		this.lastAbove5pct = copy(this.lastAbove5pct, (n) => new Int16Array(n));
		this.lastMeasured = copy(this.lastMeasured, (n) => new Int16Array(n));
		this.lastBelowHalf = copy(this.lastBelowHalf, (n) => new Int16Array(n));
		this.valid = copy(this.valid, (n) => new Uint8Array(n));
		this.capacity = cap;
	}

	private addPostings(slot: number, grams: number[]) {
		for (const g of grams) {
			let p = this.postings.get(g);
			if (!p) this.postings.set(g, (p = new Postings()));
			p.push(slot);
		}
	}

	private rebuildPostings() {
		this.postings = new Map();
		this.dirty.clear();
		for (let s = 0; s < this.count; s++) this.addPostings(s, trigramsOf(...spectrumTermTexts({ name: this.names[s], synonyms: this.synonyms[s], cas: this.cas[s] })));
	}

	/** Writes one row into its slot (a new slot for a new id). */
	put(r: VectorCacheRow) {
		const id = Number(r.id);
		let slot = this.slotOf.get(id);
		const isNew = slot === undefined;
		if (slot === undefined) {
			this.grow(this.count + 1);
			if (this.count > 0 && id < this.ids[this.count - 1]) this.idsAscending = false;
			slot = this.count++;
			this.slotOf.set(id, slot);
		}
		const buf = r.vector;
		const ok = !!buf && buf.byteLength === this.len * 4;
		const v = this.scratch;
		if (ok) copyFloat32Into(buf!, v, 0);
		else v.fill(0);
		this.pack(slot, isNew, v);
		let ss = 0;
		for (let i = 0; i < v.length; i++) ss += v[i] * v[i];
		this.ids[slot] = id;
		this.invNorm[slot] = ss > 0 ? 1 / Math.sqrt(ss) : 0;
		this.kindCode[slot] = this.kinds.code(r.kind);
		this.unitCode[slot] = this.units.code(r.y_unit);
		this.partCode[slot] = this.parts.code(r.part);
		this.visCode[slot] = Math.max(0, VISIBILITY.indexOf(r.visibility));
		this.ownerCode[slot] = r.owner_id ? this.owners.code(r.owner_id) : -1;
		this.solventCode[slot] = r.solvent ? this.solvents.code(r.solvent.toLowerCase()) : -1;
		this.groupId[slot] = Number(r.group_id);
		this.deleted[slot] = r.deleted_at ? 1 : 0;
		this.updatedMs[slot] = new Date(r.updated_at).getTime();
		this.createdMs[slot] = new Date(r.created_at).getTime();
		this.lambdaMax[slot] = r.lambda_max_nm ?? NaN;
		this.cl[slot] = r.concentration_m && r.path_cm ? r.concentration_m * r.path_cm : NaN;
		const f = vectorFacts(v);
		this.max[slot] = f.max;
		this.lastAbove5pct[slot] = f.lastAbove5pct;
		this.lastMeasured[slot] = f.lastMeasured;
		this.lastBelowHalf[slot] = f.lastBelowHalf;
		this.valid[slot] = ok ? 1 : 0;
		const texts = spectrumTermTexts(r);
		const key = texts.join('\u0000');
		this.names[slot] = r.name;
		this.synonyms[slot] = texts.slice(1, -1);
		this.cas[slot] = r.cas;
		if (isNew) this.addPostings(slot, trigramsOf(...texts));
		else if (this.termKey[slot] !== key) this.dirty.set(slot, new Set(trigramsOf(...texts)));
		this.termKey[slot] = key;
	}

	/** Brings the index up to the database's change number (one small query when nothing changed). */
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
			if (this.dirty.size > MAX_DIRTY) this.rebuildPostings();
			// many stretches rewritten longer elsewhere: load again from scratch, packed tight
			if (this.wasted > Math.max(1 << 20, this.used / 4)) this.stale = true;
			if (since >= 0) {
				const [rows] = await db().raw('SELECT COUNT(*) AS n FROM spectra');
				if (Number(rows[0].n) < this.count) this.stale = true;
			}
			this.seq = seq;
		})();
		try {
			await this.refreshing;
		} finally {
			this.refreshing = null;
		}
	}

	/** Slots of the given ids that hold a usable vector (others dropped). */
	slotsOf(ids: ArrayLike<number>): Int32Array {
		const out = new Int32Array(ids.length);
		let n = 0;
		for (let i = 0; i < ids.length; i++) {
			const s = this.slotOf.get(ids[i]);
			if (s !== undefined && this.valid[s]) out[n++] = s;
		}
		return out.subarray(0, n);
	}

	/**
	 * Slots sharing at least `need` of the grams (the n-gram index), ranked: most grams shared first,
	 * then newest (highest id) first. Synchronous from start to end — its scratch counters are shared
	 * by every request of this process — and allocation-light: typed arrays, no object per candidate.
	 * @param accept - only slots passing this test are counted
	 * @param extra - slots that count as sharing exactly `need` grams when they share fewer (tag matches)
	 * @returns `slots[i]` with `hits[i]` grams shared, for i < n, in rank order
	 */
	rankedGramHits(grams: number[], need: number, accept: (slot: number) => boolean, extra: number[] = []): { slots: Int32Array; hits: Uint16Array; n: number } {
		if (this.counts.length < this.count) {
			this.counts = new Uint16Array(this.capacity);
			this.touched = new Int32Array(this.capacity);
			this.inTouched = new Uint8Array(this.capacity);
		}
		const { counts, touched, inTouched } = this;
		let nt = 0;
		// each slot enters `touched` once, whatever sets its count (postings, a rename, a tag)
		const touch = (s: number) => {
			if (inTouched[s]) return;
			inTouched[s] = 1;
			touched[nt++] = s;
		};
		for (const g of grams) {
			const p = this.postings.get(g);
			if (!p) continue;
			const a = p.a;
			for (let i = 0; i < p.n; i++) {
				const s = a[i];
				if (counts[s]++ === 0) touch(s);
			}
		}
		// renamed slots: their postings are stale, count them from their current grams
		for (const [s, set] of this.dirty) {
			let h = 0;
			for (const g of grams) if (set.has(g)) h++;
			touch(s);
			counts[s] = h;
		}
		for (const s of extra) {
			if (s < 0 || s >= this.count) continue;
			touch(s);
			if (counts[s] < need) counts[s] = need;
		}
		let n = 0;
		let top = 0;
		const pass = new Int32Array(nt);
		for (let i = 0; i < nt; i++) {
			const s = touched[i];
			if (counts[s] >= need && accept(s)) {
				pass[n++] = s;
				if (counts[s] > top) top = counts[s];
			}
		}
		// newest first within a count: slots follow ids (loaded and appended in id order) unless idsAscending is off
		const order = pass.subarray(0, n);
		if (this.idsAscending) order.sort().reverse();
		else order.sort((x, y) => this.ids[y] - this.ids[x]);
		// then a stable counting sort by the number of grams shared, most first
		const start = new Int32Array(top + 2);
		for (let i = 0; i < n; i++) start[top - counts[order[i]] + 1]++;
		for (let b = 1; b <= top + 1; b++) start[b] += start[b - 1];
		const slots = new Int32Array(n);
		const hits = new Uint16Array(n);
		for (let i = 0; i < n; i++) {
			const s = order[i];
			const j = start[top - counts[s]]++;
			slots[j] = s;
			hits[j] = counts[s];
		}
		for (let i = 0; i < nt; i++) {
			counts[touched[i]] = 0;
			inTouched[touched[i]] = 0;
		}
		return { slots, hits, n };
	}

	/** Bytes in use by the typed columns (the packed stretches included). */
	bytes(): number {
		return this.used * 4 + this.capacity * (4 + 2 + 2 + 4 + 8 + 4 * 1 + 4 * 3 + 8 * 4 + 4 + 2 * 3 + 1);
	}
}

let cache: VectorCache | null = null;

/** This process's index, refreshed to the database's change number. */
export async function vectorCache(): Promise<VectorCache> {
	cache ??= new VectorCache();
	await cache.refresh();
	if (cache.stale) {
		cache = new VectorCache();
		await cache.refresh();
	}
	return cache;
}

/** The index if this process has loaded it already (no database call), else null. */
export function loadedVectorCache(): VectorCache | null {
	return cache && cache.seq >= 0 && !cache.stale ? cache : null;
}

/** Drops the index (tests; a new one loads from scratch). */
export function resetVectorCache(): void {
	cache = null;
}
