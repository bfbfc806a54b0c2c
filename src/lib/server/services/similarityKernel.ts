/**
 * Top-k cosine similarity in one pass over a contiguous Float32Array of packed vectors (slot s: its
 * measured stretch, `lens[s]` values from grid index `froms[s]`, at `offs[s]`; 0 elsewhere, so the
 * dot product runs over the stretch only) with the inverse L2 norm of each slot precomputed:
 * score = (t · v)·‖t‖⁻¹·‖v‖⁻¹,
 * the same number as cosineSimilarity() of the spectra core (which is scale-invariant), summed in
 * Float64 with four accumulators (a different summation order: differences ~1e-15, far below 1e-6). The best `k` are kept in a binary min-heap ordered by (score, id); ties go to the higher
 * id, as in a stable sort of candidates listed newest first.
 *
 * The kernel is kept as plain JavaScript source so the very same code runs in-process and in a
 * worker thread (node:worker_threads, eval) that shares the vectors through a SharedArrayBuffer.
 */
import { Worker } from 'node:worker_threads';

const KERNEL_SOURCE = String.raw`
function dotAt(vectors, off, target, from, n) {
	var a0 = 0, a1 = 0, a2 = 0, a3 = 0, i = 0, n4 = n - (n & 3);
	for (; i < n4; i += 4) {
		a0 += target[from + i] * vectors[off + i];
		a1 += target[from + i + 1] * vectors[off + i + 1];
		a2 += target[from + i + 2] * vectors[off + i + 2];
		a3 += target[from + i + 3] * vectors[off + i + 3];
	}
	for (; i < n; i++) a0 += target[from + i] * vectors[off + i];
	return (a0 + a1) + (a2 + a3);
}
function heapWorse(hs, hi, a, b) { return hs[a] < hs[b] || (hs[a] === hs[b] && hi[a] < hi[b]); }
function heapSwap(hs, hi, a, b) { var s = hs[a]; hs[a] = hs[b]; hs[b] = s; var t = hi[a]; hi[a] = hi[b]; hi[b] = t; }
function heapDown(hs, hi, size, i) {
	for (;;) {
		var l = 2 * i + 1, r = l + 1, m = i;
		if (l < size && heapWorse(hs, hi, l, m)) m = l;
		if (r < size && heapWorse(hs, hi, r, m)) m = r;
		if (m === i) return;
		heapSwap(hs, hi, i, m);
		i = m;
	}
}
function heapUp(hs, hi, i) {
	while (i > 0) { var p = (i - 1) >> 1; if (!heapWorse(hs, hi, i, p)) return; heapSwap(hs, hi, i, p); i = p; }
}
function topK(vectors, offs, froms, lens, target, targetInv, slots, invNorm, ids, k) {
	var n = slots.length, hs = new Float64Array(Math.max(k, 1)), hi = new Int32Array(Math.max(k, 1)), size = 0;
	var ok = targetInv > 0;
	for (var j = 0; j < n; j++) {
		var s = slots[j], inv = invNorm[s];
		var score = ok && inv > 0 ? dotAt(vectors, offs[s], target, froms[s], lens[s]) * targetInv * inv : 0;
		var id = ids[s];
		if (size < k) { hs[size] = score; hi[size] = id; size++; heapUp(hs, hi, size - 1); }
		else if (k > 0 && (score > hs[0] || (score === hs[0] && id > hi[0]))) { hs[0] = score; hi[0] = id; heapDown(hs, hi, size, 0); }
	}
	var out = [];
	for (var q = 0; q < size; q++) out.push({ id: hi[q], score: hs[q] });
	out.sort(function (a, b) { return b.score - a.score || b.id - a.id; });
	return out;
}`;

export interface TopKJob {
	/** the packed stretches (VectorCache.vectors) */
	vectors: Float32Array;
	offs: Int32Array;
	froms: Int16Array;
	lens: Int16Array;
	target: Float32Array;
	targetInv: number;
	slots: Int32Array;
	invNorm: Float64Array;
	ids: Int32Array;
	k: number;
}

type Kernel = (vectors: Float32Array, offs: Int32Array, froms: Int16Array, lens: Int16Array, target: Float32Array, targetInv: number, slots: Int32Array, invNorm: Float64Array, ids: Int32Array, k: number) => { id: number; score: number }[];

const kernel = new Function(`${KERNEL_SOURCE}; return topK;`)() as Kernel;

/** Top-k in this thread. */
export function topKInProcess(j: TopKJob): { id: number; score: number }[] {
	return kernel(j.vectors, j.offs, j.froms, j.lens, j.target, j.targetInv, j.slots, j.invNorm, j.ids, j.k);
}

const WORKER_SOURCE = `
const { parentPort } = require('node:worker_threads');
${KERNEL_SOURCE}
parentPort.on('message', (m) => {
	try {
		const vectors = new Float32Array(m.vectorsBuffer, 0, m.vectorsLength);
		const offs = new Int32Array(m.offsBuffer, 0, m.slotsCapacity);
		const froms = new Int16Array(m.fromsBuffer, 0, m.slotsCapacity);
		const lens = new Int16Array(m.lensBuffer, 0, m.slotsCapacity);
		const invNorm = new Float64Array(m.invNormBuffer, 0, m.slotsCapacity);
		const ids = new Int32Array(m.idsBuffer, 0, m.slotsCapacity);
		parentPort.postMessage({ id: m.id, result: topK(vectors, offs, froms, lens, m.target, m.targetInv, m.slots, invNorm, ids, m.k) });
	} catch (e) {
		parentPort.postMessage({ id: m.id, error: String(e && e.message || e) });
	}
});`;

let worker: Worker | null = null;
let nextJob = 1;
const pending = new Map<number, { resolve: (r: { id: number; score: number }[]) => void; reject: (e: Error) => void }>();

function theWorker(): Worker {
	if (worker) return worker;
	const w = new Worker(WORKER_SOURCE, { eval: true, resourceLimits: { maxOldGenerationSizeMb: 128 } });
	w.unref();
	w.on('message', (m: { id: number; result?: { id: number; score: number }[]; error?: string }) => {
		const p = pending.get(m.id);
		if (!p) return;
		pending.delete(m.id);
		if (m.error) p.reject(new Error(m.error));
		else p.resolve(m.result!);
	});
	const fail = (e: Error) => {
		worker = null;
		for (const p of pending.values()) p.reject(e);
		pending.clear();
	};
	w.on('error', fail);
	w.on('exit', (code) => fail(new Error(`similarity worker exited (${code})`)));
	worker = w;
	return w;
}

/**
 * Top-k in the worker thread. The vectors, norms and ids must live in SharedArrayBuffers (no copy);
 * falls back to this thread if the worker cannot run.
 */
export async function topKInWorker(j: TopKJob): Promise<{ id: number; score: number }[]> {
	const shared = [j.vectors, j.offs, j.froms, j.lens, j.invNorm, j.ids].every((a) => a.buffer instanceof SharedArrayBuffer);
	if (!shared || j.ids.length !== j.offs.length || j.ids.length !== j.froms.length || j.ids.length !== j.lens.length) return topKInProcess(j);
	let w: Worker;
	try {
		w = theWorker();
	} catch {
		return topKInProcess(j);
	}
	const id = nextJob++;
	return new Promise((resolve, reject) => {
		pending.set(id, { resolve, reject });
		w.postMessage({
			id,
			vectorsBuffer: j.vectors.buffer,
			vectorsLength: j.vectors.length,
			offsBuffer: j.offs.buffer,
			fromsBuffer: j.froms.buffer,
			lensBuffer: j.lens.buffer,
			invNormBuffer: j.invNorm.buffer,
			idsBuffer: j.ids.buffer,
			slotsCapacity: j.ids.length,
			target: j.target,
			targetInv: j.targetInv,
			slots: j.slots,
			k: j.k
		});
	}).catch(() => topKInProcess(j)) as Promise<{ id: number; score: number }[]>;
}

/** Stops the worker (tests, shutdown). */
export async function stopSimilarityWorker(): Promise<void> {
	const w = worker;
	worker = null;
	if (w) await w.terminate();
}
