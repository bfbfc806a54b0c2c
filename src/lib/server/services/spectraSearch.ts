/**
 * GET /api/spectra, the Library table and every picker. Three paths, each with an exact total:
 *
 * - plain listing: filters, ORDER BY and LIMIT/OFFSET in SQL, COUNT(*) for the total;
 * - name search (`q`): a CAS-shaped query matches CAS numbers exactly; otherwise the n-gram index
 *   (`spectrum_terms`) gives every visible row sharing at least half of the query's trigrams (plus
 *   rows whose tags match), and fuse.js re-ranks the best RERANK candidates on the real text;
 * - vector filters (`absorbsAt`, `transparentAbove`): SQL lists the ids that pass the other filters
 *   in the requested order, the process's vector cache keeps those whose vector passes.
 * Only the page's rows are then read in full.
 */
import Fuse from 'fuse.js';
import type { SpectrumListQuery } from '../../schemas/spectra';
import { trigramsOf } from '../../spectra/trigrams';
import { db } from '../db/index';
import {
	findGroupIds,
	listSpectrumIds,
	pageSpectrumSummaries,
	summariesByIds,
	termCandidates,
	type SortKey,
	type SpectrumOrder,
	type SpectrumRow,
	type SpectrumSqlFilter
} from '../db/spectra';
import { tagsOfSpectra } from '../db/tags';
import { roleAtLeast } from '../policy';
import { callerOf, canEditSpectrum, type Caller } from './spectraAccess';
import { absorbsAtWithMax, transparentAboveFromFacts, absorptionAt, type VectorRow } from './spectraVectorFilters';
import { vectorCache, type VectorCache } from './spectraVectorCache';
import { spectrumToApi } from './spectraView';

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

/** Candidates re-ranked by fuse.js (the rest follow by shared trigrams). */
const RERANK = 200;
/** Share of the query's trigrams a name must contain to be a candidate. */
const MIN_SHARE = 0.5;

/**
 * The CAS number a query asks for, or null when the query is not CAS-shaped. A CAS-shaped query
 * matches CAS numbers exactly and is never searched fuzzily.
 * (Place for the shared CAS parser of src/lib/cas.ts: normalise and check the digit here.)
 */
export function casQuery(q: string): string | null {
	const m = q.trim().match(/^(\d{2,7})-(\d{2})-(\d)$/);
	return m ? `${m[1]}-${m[2]}-${m[3]}` : null;
}

interface Hit {
	id: number;
	score?: number;
	absorbanceAt?: number;
	epsilonAt?: number;
}

/** The SQL filter of a query for this caller. */
async function sqlFilterOf(caller: Caller, q: SpectrumListQuery): Promise<SpectrumSqlFilter> {
	const groupIds = q.group ? await findGroupIds(q.group.split(',').map((s) => s.trim()).filter(Boolean)) : undefined;
	return {
		part: q.part,
		kind: q.kind,
		solvent: q.solvent,
		groupIds,
		owner: q.owner === 'me' ? caller.user.id : q.owner,
		visibility: q.visibility,
		deleted: q.deleted,
		deletedScope: {
			userId: caller.user.id,
			isAdmin: caller.user.siteRole === 'admin',
			memberGroupIds: caller.memberships.filter((m) => roleAtLeast(m.role, 'member')).map((m) => m.groupId),
			leadGroupIds: caller.memberships.filter((m) => roleAtLeast(m.role, 'lead')).map((m) => m.groupId)
		}
	};
}

const vectorRowOf = (c: VectorCache, slot: number): VectorRow => {
	const cl = c.cl[slot];
	return { kind: c.kindOf(slot), y_unit: c.unitOf(slot), concentration_m: Number.isNaN(cl) ? null : cl, path_cm: Number.isNaN(cl) ? null : 1 };
};

/** Keeps the ids whose cached vector passes the query's vector filters (order kept). */
function vectorFiltered(c: VectorCache, ids: ArrayLike<number>, q: SpectrumListQuery): Hit[] {
	const out: Hit[] = [];
	const rule = q.absorbsAt !== undefined ? { wavelengthNm: q.absorbsAt, minAbsorbance: q.minAbsorbance, minEpsilon: q.minEpsilon } : undefined;
	for (let i = 0; i < ids.length; i++) {
		const slot = c.slotOf.get(ids[i]);
		if (slot === undefined || !c.valid[slot]) continue;
		const kind = c.kindOf(slot);
		if (rule && kind !== 'absorption') continue;
		if (q.transparentAbove !== undefined) {
			const facts = { max: c.max[slot], lastAbove5pct: c.lastAbove5pct[slot], lastMeasured: c.lastMeasured[slot], lastBelowHalf: c.lastBelowHalf[slot] };
			if (!transparentAboveFromFacts(kind, facts, q.transparentAbove)) continue;
		}
		if (rule) {
			const row = vectorRowOf(c, slot);
			const v = c.vector(slot);
			if (!absorbsAtWithMax(row, v, c.max[slot], rule)) continue;
			const at = absorptionAt(row, v, rule.wavelengthNm);
			out.push({ id: ids[i], absorbanceAt: at.absorbance, epsilonAt: at.epsilon });
		} else out.push({ id: ids[i] });
	}
	return out;
}

/** Tags whose name is close to the query (the tag list is small). */
async function matchingTagIds(text: string): Promise<number[]> {
	const tags: { id: number; name: string }[] = await db()('tags').select('id', 'name');
	if (!tags.length) return [];
	return new Fuse(tags, { keys: ['name'], threshold: 0.3, ignoreLocation: true, minMatchCharLength: 2 }).search(text).map((h) => Number(h.item.id));
}

/** Ranked ids of a fuzzy name search (see the module comment). */
async function fuzzyIds(caller: Caller, f: SpectrumSqlFilter, text: string): Promise<Hit[]> {
	const grams = trigramsOf(text);
	if (!grams.length) return [];
	const need = Math.max(1, Math.ceil(grams.length * MIN_SHARE));
	const cands = await termCandidates(caller.reader, f, grams, need, await matchingTagIds(text));
	cands.sort((a, b) => b.hits - a.hits || b.id - a.id);
	const top = cands.slice(0, RERANK);
	const rows = await summariesByIds(caller.reader, top.map((c) => c.id));
	const tags = await tagsOfSpectra(rows.map((r) => Number(r.id)));
	const docs = rows.map((r) => ({ id: Number(r.id), name: r.name, synonyms: parseList(r.synonyms), cas: r.cas ?? '', tags: tags.get(Number(r.id)) ?? [] }));
	const fused = new Fuse(docs, FUSE_OPTIONS).search(text);
	const seen = new Set<number>();
	const out: Hit[] = [];
	for (const h of fused) {
		seen.add(h.item.id);
		out.push({ id: h.item.id, score: h.score ?? 0 });
	}
	for (const c of cands) if (!seen.has(c.id)) out.push({ id: c.id, score: Number((1 - c.hits / grams.length).toFixed(4)) });
	return out;
}

function parseList(s: string | null): string[] {
	try {
		const v = JSON.parse(s || '[]');
		return Array.isArray(v) ? v.filter((x) => typeof x === 'string') : [];
	} catch {
		return [];
	}
}

/** Shapes one page of hits. */
async function itemsOf(caller: Caller, rows: SpectrumRow[], hits?: Map<number, Hit>) {
	const tags = await tagsOfSpectra(rows.map((r) => Number(r.id)));
	return rows.map((row) => {
		const h = hits?.get(Number(row.id));
		return {
			...spectrumToApi(row, tags.get(Number(row.id)) ?? [], { canEdit: canEditSpectrum(caller, row) }),
			...(h?.score !== undefined ? { score: h.score } : {}),
			...(h?.absorbanceAt !== undefined ? { absorbanceAt: h.absorbanceAt } : {}),
			...(h?.epsilonAt !== undefined ? { epsilonAt: h.epsilonAt } : {})
		};
	});
}

/** Searches the Library as the caller sees it. @returns `{ items, total }` (total before paging) */
export async function searchSpectra(locals: App.Locals, q: SpectrumListQuery) {
	const caller = await callerOf(locals);
	const f = await sqlFilterOf(caller, q);
	const order: SpectrumOrder = q.sort ? { key: q.sort as SortKey, dir: q.dir } : { key: 'updatedAt', dir: 'desc' };
	const needVector = q.absorbsAt !== undefined || q.transparentAbove !== undefined;
	const text = q.q?.trim() ?? '';
	const cas = text ? casQuery(text) : null;
	if (cas) f.cas = cas;
	const fuzzy = !!text && !cas;

	if (!fuzzy && !needVector) {
		const { rows, total } = await pageSpectrumSummaries(caller.reader, f, order, q.limit, q.offset);
		return { total, items: await itemsOf(caller, rows) };
	}

	let hits: Hit[];
	if (fuzzy) {
		hits = await fuzzyIds(caller, f, text);
		if (q.sort && hits.length) {
			const rank = new Map(hits.map((h) => [h.id, h]));
			const ordered = await listSpectrumIds(caller.reader, { ...f, ids: hits.map((h) => h.id) }, order);
			hits = Array.from(ordered, (id) => rank.get(id)!);
		}
		if (needVector) {
			const c = await vectorCache();
			const passed = new Map(vectorFiltered(c, hits.map((h) => h.id), q).map((h) => [h.id, h]));
			hits = hits.filter((h) => passed.has(h.id)).map((h) => ({ ...passed.get(h.id)!, score: h.score }));
		}
	} else {
		const kindFilter: SpectrumSqlFilter = q.absorbsAt !== undefined && !f.kind ? { kind: 'absorption' } : {};
		const [c, ids] = await Promise.all([vectorCache(), listSpectrumIds(caller.reader, { ...f, ...kindFilter }, order)]);
		hits = vectorFiltered(c, ids, q);
	}
	const page = hits.slice(q.offset, q.offset + q.limit);
	const rows = await summariesByIds(caller.reader, page.map((h) => h.id), { deleted: 'include' });
	return { total: hits.length, items: await itemsOf(caller, rows, new Map(page.map((h) => [h.id, h]))) };
}
