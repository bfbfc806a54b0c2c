import { createSolventFuse } from '$lib/search/solventFuse';
import type { Solvent } from '$lib/server/db/solvents';

/** Solvents matching a typed query: exact substrings of name, synonyms and CAS first, then fuzzy matches. */
export function searchSolvents(all: Solvent[], query: string): Solvent[] {
	const q = query.trim().toLowerCase();
	if (!q) return all;
	const direct = all.filter(
		(s) => s.name.toLowerCase().includes(q) || s.synonyms.some((x) => x.toLowerCase().includes(q)) || (s.cas ?? '').includes(q)
	);
	const fuzzy = createSolventFuse(all)
		.search(q)
		.map((r) => r.item);
	return [...direct, ...fuzzy.filter((s) => !direct.includes(s))];
}
