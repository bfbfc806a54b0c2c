import { casEquals, classifyCasQuery } from '$lib/cas';
import { createSolventFuse } from '$lib/search/solventFuse';
import type { Solvent } from '$lib/server/db/solvents';
import { ApiError } from '$lib/server/http';

/**
 * Solvents matching a typed query. A CAS-shaped query is a CAS look-up: the solvent with exactly that CAS number or
 * nothing (a wrong check digit is a 400 naming `q`). Otherwise exact substrings of name and synonyms first, then fuzzy
 * matches over names and synonyms.
 */
export function searchSolvents(all: Solvent[], query: string): Solvent[] {
	const cas = classifyCasQuery(query);
	if (cas.kind === 'invalid-cas') throw new ApiError(400, 'invalid', `q: ${cas.message}`, { field: 'q' });
	if (cas.kind === 'cas') return all.filter((s) => casEquals(s.cas, cas.cas));
	const q = query.trim().toLowerCase();
	if (!q) return all;
	const direct = all.filter((s) => s.name.toLowerCase().includes(q) || s.synonyms.some((x) => x.toLowerCase().includes(q)));
	const fuzzy = createSolventFuse(all.map((s) => ({ ...s, cas: null })))
		.search(q)
		.map((r) => all.find((s) => s.id === r.item.id)!);
	return [...direct, ...fuzzy.filter((s) => !direct.includes(s))];
}
