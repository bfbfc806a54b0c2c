/**
 * GET /api/spectra and the Library table: SQL filters (visibility, part, solvent, group, owner,
 * deleted), vector filters (absorbs at λ, transparent above λ), fuzzy search with fuse.js over
 * names, synonyms, CAS and tags, then server-side sorting and paging.
 */
import Fuse from 'fuse.js';
import { casEquals, classifyCasQuery } from '../../cas';
import { ApiError } from '../http';
import { bufferToVector } from '../../spectra/grid';
import type { SpectrumListQuery } from '../../schemas/spectra';
import { findGroupIds, listSpectrumSummaries, type SpectrumRow } from '../db/spectra';
import { tagsOfSpectra } from '../db/tags';
import { callerOf, canEditSpectrum } from './spectraAccess';
import { absorbsAt, absorptionAt, transparentAbove } from './spectraVectorFilters';
import { spectrumToApi } from './spectraView';

interface Candidate {
	row: SpectrumRow;
	name: string;
	synonyms: string[];
	cas: string;
	tags: string[];
}

/** Fuse options: weighted keys, match anywhere in a name (ignoreLocation), threshold tuned on misspelt names ("benzofenone", "irdium"). */
const FUSE_OPTIONS = {
	keys: [
		{ name: 'name', weight: 0.5 },
		{ name: 'synonyms', weight: 0.25 },
		{ name: 'tags', weight: 0.15 },
		{ name: 'cas', weight: 0.1 }
	],
	ignoreLocation: true,
	threshold: 0.38,
	includeScore: true,
	minMatchCharLength: 2
};

const SORT_KEY: Record<string, (r: SpectrumRow) => string | number | null> = {
	name: (r) => r.name.toLowerCase(),
	part: (r) => r.part,
	lambdaMaxNm: (r) => r.lambda_max_nm,
	createdAt: (r) => new Date(r.created_at).getTime(),
	updatedAt: (r) => new Date(r.updated_at).getTime(),
	solvent: (r) => r.solvent?.toLowerCase() ?? null,
	owner: (r) => r.owner_name?.toLowerCase() ?? null
};

/** Sorts in place; nulls last whatever the direction; ties by id. */
function sortRows(c: Candidate[], key: string, dir: 'asc' | 'desc') {
	const get = SORT_KEY[key];
	const sign = dir === 'desc' ? -1 : 1;
	c.sort((a, b) => {
		const x = get(a.row);
		const y = get(b.row);
		if (x === null && y === null) return a.row.id - b.row.id;
		if (x === null) return 1;
		if (y === null) return -1;
		return (x < y ? -1 : x > y ? 1 : a.row.id - b.row.id) * sign;
	});
}

/** Searches the Library as the caller sees it. @returns `{ items, total }` (total before paging) */
export async function searchSpectra(locals: App.Locals, q: SpectrumListQuery) {
	const caller = await callerOf(locals);
	const groupIds = q.group ? await findGroupIds(q.group.split(',')) : undefined;
	const owner = q.owner === 'me' ? caller.user.id : q.owner;
	const needVector = q.absorbsAt !== undefined || q.transparentAbove !== undefined;
	let rows = await listSpectrumSummaries(caller.reader, {
		part: q.part,
		kind: q.kind,
		solvent: q.solvent,
		groupIds,
		visibility: q.visibility,
		deleted: q.deleted,
		withVector: needVector
	});
	if (owner) rows = rows.filter((r) => r.owner_id === owner || r.owner_name?.toLowerCase().includes(owner.toLowerCase()));
	if (q.deleted) rows = rows.filter((r) => !r.deleted_at || canEditSpectrum(caller, r));
	const extra = new Map<number, { absorbanceAt?: number; epsilonAt?: number }>();
	if (needVector) {
		rows = rows.filter((r) => {
			const v = bufferToVector(r.search_vector);
			if (q.absorbsAt !== undefined && !absorbsAt(r, v, { wavelengthNm: q.absorbsAt, minAbsorbance: q.minAbsorbance, minEpsilon: q.minEpsilon })) return false;
			if (q.transparentAbove !== undefined && !transparentAbove(r, v, q.transparentAbove)) return false;
			if (q.absorbsAt !== undefined) {
				const at = absorptionAt(r, v, q.absorbsAt);
				extra.set(r.id, { absorbanceAt: at.absorbance, epsilonAt: at.epsilon });
			}
			return true;
		});
	}
	const tags = await tagsOfSpectra(rows.map((r) => r.id));
	let cands: Candidate[] = rows.map((row) => ({ row, name: row.name, synonyms: JSON.parse(row.synonyms || '[]'), cas: row.cas ?? '', tags: tags.get(row.id) ?? [] }));
	const scores = new Map<number, number>();
	const casQuery = q.q ? classifyCasQuery(q.q) : null;
	if (casQuery?.kind === 'invalid-cas') throw new ApiError(400, 'invalid', `q: ${casQuery.message}`, { field: 'q' });
	if (casQuery?.kind === 'cas') cands = cands.filter((c) => casEquals(c.cas, casQuery.cas)); // CAS look-up: exact, never fuzzy
	else if (q.q) {
		const hits = new Fuse(cands, FUSE_OPTIONS).search(q.q);
		for (const h of hits) scores.set(h.item.row.id, h.score ?? 0);
		cands = hits.map((h) => h.item);
	}
	if (q.sort) sortRows(cands, q.sort, q.dir);
	else if (!q.q) sortRows(cands, 'updatedAt', 'desc');
	const page = cands.slice(q.offset, q.offset + q.limit);
	return {
		total: cands.length,
		items: page.map((c) => ({
			...spectrumToApi(c.row, c.tags, { canEdit: canEditSpectrum(caller, c.row) }),
			...(scores.has(c.row.id) ? { score: scores.get(c.row.id) } : {}),
			...(extra.get(c.row.id) ?? {})
		}))
	};
}
