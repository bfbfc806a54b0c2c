/**
 * Shape similarity of spectra: cosine similarity of 1 nm search vectors after dividing each by its
 * largest absolute value (cosine similarity is scale-invariant; the max-normalisation keeps Float32
 * sums well conditioned). Points where either vector is 0 (outside a measured range) still count.
 */

/** Cosine similarity in [−1, 1] of two equally long vectors, 0 when either is all zeros. */
export function cosineSimilarity(a: ArrayLike<number>, b: ArrayLike<number>): number {
	if (a.length !== b.length) throw new RangeError(`vectors of length ${a.length} and ${b.length}`);
	let ma = 0;
	let mb = 0;
	for (let i = 0; i < a.length; i++) {
		if (Math.abs(a[i]) > ma) ma = Math.abs(a[i]);
		if (Math.abs(b[i]) > mb) mb = Math.abs(b[i]);
	}
	if (!(ma > 0) || !(mb > 0)) return 0;
	let dot = 0;
	let na = 0;
	let nb = 0;
	for (let i = 0; i < a.length; i++) {
		const u = a[i] / ma;
		const v = b[i] / mb;
		dot += u * v;
		na += u * u;
		nb += v * v;
	}
	return dot / Math.sqrt(na * nb);
}

export interface SimilarityCandidate<Id> {
	id: Id;
	vector: ArrayLike<number>;
}

/**
 * Candidates ranked by cosine similarity to the target, best first.
 * @param limit - number returned (default 10); candidates of another length are skipped
 */
export function rankSimilar<Id>(target: ArrayLike<number>, candidates: SimilarityCandidate<Id>[], limit = 10): { id: Id; score: number }[] {
	const scored: { id: Id; score: number }[] = [];
	for (const c of candidates) if (c.vector.length === target.length) scored.push({ id: c.id, score: cosineSimilarity(target, c.vector) });
	return scored.sort((p, q) => q.score - p.score).slice(0, Math.max(0, limit));
}
