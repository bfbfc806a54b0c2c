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
