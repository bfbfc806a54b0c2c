import Fuse from 'fuse.js';
import type { Solvent } from '$lib/server/db/solvents';

/**
 * Solvents matching a typed query: exact substrings of name, synonyms and CAS first, then fuse.js fuzzy
 * matches (ignoreLocation, weighted keys: name 0.6, synonyms 0.3, CAS 0.1, threshold 0.35).
 */
export function searchSolvents(all: Solvent[], query: string): Solvent[] {
	const q = query.trim().toLowerCase();
	if (!q) return all;
	const direct = all.filter(
		(s) => s.name.toLowerCase().includes(q) || s.synonyms.some((x) => x.toLowerCase().includes(q)) || (s.cas ?? '').includes(q)
	);
	const fuse = new Fuse(all, {
		keys: [
			{ name: 'name', weight: 0.6 },
			{ name: 'synonyms', weight: 0.3 },
			{ name: 'cas', weight: 0.1 }
		],
		ignoreLocation: true,
		threshold: 0.35
	});
	const fuzzy = fuse.search(q).map((r) => r.item);
	return [...direct, ...fuzzy.filter((s) => !direct.includes(s))];
}
