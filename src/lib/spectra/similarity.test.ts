/** Cosine similarity (definition: a·b / (|a||b|)) on max-normalised 1 nm vectors. */
import { describe, expect, it } from 'vitest';
import { toSearchVector } from './grid';
import { cosineSimilarity, rankSimilar } from './similarity';

const band = (c: number, s: number, scale = 1) => {
	const x = Float64Array.from({ length: 601 }, (_, i) => 250 + i);
	return toSearchVector({ x, y: x.map((v) => scale * Math.exp(-0.5 * ((v - c) / s) ** 2)) });
};

describe('similarity', () => {
	it('scale-invariant; identical shapes score 1, orthogonal vectors 0', () => {
		expect(cosineSimilarity(band(400, 20), band(400, 20, 37))).toBeCloseTo(1, 6);
		expect(cosineSimilarity([1, 0], [0, 1])).toBe(0);
		expect(cosineSimilarity([0, 0], [0, 1])).toBe(0);
	});
	it('ranks nearer bands first and honours the limit', () => {
		const target = band(400, 20);
		const ranked = rankSimilar(target, [{ id: 'far', vector: band(600, 20) }, { id: 'near', vector: band(410, 20) }, { id: 'same', vector: band(400, 20, 3) }], 2);
		expect(ranked.map((r) => r.id)).toEqual(['same', 'near']);
	});
});

describe('similarity on the usable stretch', () => {
	const x = Float64Array.from({ length: 611 }, (_, i) => 190 + i);
	const withEdge = (c: number, cut: number) => ({ kind: 'absorption' as const, x, y: x.map((l) => Math.min(4, 0.8 * Math.exp(-0.5 * ((l - c) / 18) ** 2) + 10 ** ((cut - l) / 10))), yUnit: 'absorbance' as const });
	it('the same band with a saturated solvent edge scores ≈ 1; a band 50 nm away clearly lower', async () => {
		const { deriveSpectrum } = await import('./derive');
		const { stretchSimilarity } = await import('./similarity');
		const a = deriveSpectrum(withEdge(420, 190));
		const b = deriveSpectrum(withEdge(420, 260)); // the same band, measured in a solvent cutting off at 260 nm
		const c = deriveSpectrum(withEdge(470, 190));
		const same = stretchSimilarity(a.searchVector, b.searchVector, a.similarity, b.similarity);
		const far = stretchSimilarity(a.searchVector, c.searchVector, a.similarity, c.similarity);
		// plain cosine over every point: the saturated edge dominates, the same band scores like a band 50 nm away
		expect(cosineSimilarity(a.searchVector, b.searchVector)).toBeLessThan(0.3);
		// on the usable stretch (saturated samples left out): only the solvent's unsaturated tail 258–290 nm differs
		expect(same.score!).toBeGreaterThan(0.9);
		expect(far.score!).toBeLessThan(0.5);
		expect(same.overlapNm).toBeGreaterThan(100);
	});
});
