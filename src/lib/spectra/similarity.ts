/**
 * Shape similarity of spectra: cosine similarity of 1 nm search vectors, each divided by its largest absolute value
 * on the compared stretch (cosine similarity is scale-invariant; the max-normalisation keeps Float32 sums well
 * conditioned). The compared stretch is where both spectra are measured and usable (not saturated, not noise) and at
 * least one of them is above its noise; its length in nm is reported as the overlap.
 */
import { GRID_FROM_NM, SEARCH_STEP_NM } from './grid';

/** Inclusive [fromNm, toNm] ranges on the 1 nm search grid (derive.ts). */
export interface SimilarityStretch {
	usable: [number, number][];
	aboveNoise: [number, number][];
}

/** Default least overlap (nm) for a score: shorter stretches say nothing about shape. */
export const MIN_OVERLAP_NM = 10;

/** Cosine similarity in [−1, 1] of two equally long vectors over the points where `mask` is 1 (all when omitted); 0 when either is all zeros. */
export function cosineSimilarity(a: ArrayLike<number>, b: ArrayLike<number>, mask?: ArrayLike<number>): number {
	if (a.length !== b.length) throw new RangeError(`vectors of length ${a.length} and ${b.length}`);
	let ma = 0;
	let mb = 0;
	for (let i = 0; i < a.length; i++) {
		if (mask && !mask[i]) continue;
		if (Math.abs(a[i]) > ma) ma = Math.abs(a[i]);
		if (Math.abs(b[i]) > mb) mb = Math.abs(b[i]);
	}
	if (!(ma > 0) || !(mb > 0)) return 0;
	let dot = 0;
	let na = 0;
	let nb = 0;
	for (let i = 0; i < a.length; i++) {
		if (mask && !mask[i]) continue;
		const u = a[i] / ma;
		const v = b[i] / mb;
		dot += u * v;
		na += u * u;
		nb += v * v;
	}
	return dot / Math.sqrt(na * nb);
}

function maskOf(ranges: [number, number][], length: number): Uint8Array {
	const m = new Uint8Array(length);
	for (const [from, to] of ranges) {
		const i0 = Math.max(0, Math.round((from - GRID_FROM_NM) / SEARCH_STEP_NM));
		const i1 = Math.min(length - 1, Math.round((to - GRID_FROM_NM) / SEARCH_STEP_NM));
		for (let i = i0; i <= i1; i++) m[i] = 1;
	}
	return m;
}

/** Usable and above-noise masks; without a stretch (rows derived before stretches existed) every non-zero point counts. */
function masksOf(v: ArrayLike<number>, s: SimilarityStretch | null | undefined): { usable: Uint8Array; above: Uint8Array } {
	if (s) return { usable: maskOf(s.usable, v.length), above: maskOf(s.aboveNoise, v.length) };
	const usable = Uint8Array.from({ length: v.length }, (_, i) => (v[i] !== 0 ? 1 : 0));
	return { usable, above: usable };
}

/** Cosine similarity on the compared stretch and its length in nm; score null when the overlap is below `minOverlapNm`. */
export function stretchSimilarity(
	a: ArrayLike<number>, b: ArrayLike<number>, sa?: SimilarityStretch | null, sb?: SimilarityStretch | null, minOverlapNm = MIN_OVERLAP_NM
): { score: number | null; overlapNm: number } {
	if (a.length !== b.length) throw new RangeError(`vectors of length ${a.length} and ${b.length}`);
	const A = masksOf(a, sa);
	const B = masksOf(b, sb);
	const mask = new Uint8Array(a.length);
	let count = 0;
	for (let i = 0; i < a.length; i++) {
		mask[i] = A.usable[i] && B.usable[i] && (A.above[i] || B.above[i]) ? 1 : 0;
		count += mask[i];
	}
	const overlapNm = count * SEARCH_STEP_NM;
	if (overlapNm < minOverlapNm) return { score: null, overlapNm };
	return { score: cosineSimilarity(a, b, mask), overlapNm };
}

export interface SimilarityCandidate<Id> {
	id: Id;
	vector: ArrayLike<number>;
	stretch?: SimilarityStretch | null;
}

/**
 * Candidates ranked by similarity to the target on their compared stretch, best first; candidates of another length
 * or with too short an overlap are left out.
 * @param limit - number returned (default 10)
 */
export function rankSimilar<Id>(
	target: ArrayLike<number>, candidates: SimilarityCandidate<Id>[], limit = 10, targetStretch?: SimilarityStretch | null
): { id: Id; score: number; overlapNm: number }[] {
	const scored: { id: Id; score: number; overlapNm: number }[] = [];
	for (const c of candidates) {
		if (c.vector.length !== target.length) continue;
		const r = stretchSimilarity(target, c.vector, targetStretch, c.stretch);
		if (r.score !== null) scored.push({ id: c.id, score: r.score, overlapNm: r.overlapNm });
	}
	return scored.sort((p, q) => q.score - p.score).slice(0, Math.max(0, limit));
}
