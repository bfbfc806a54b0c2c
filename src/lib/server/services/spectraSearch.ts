/**
 * GET /api/spectra, the Library table and every picker. Three paths, each with an exact total:
 *
 * - plain listing (and a CAS-shaped `q`, which matches CAS numbers exactly, never fuzzily):
 *   filters, ORDER BY and LIMIT/OFFSET in SQL, COUNT(*) for the total;
 * - name search (`q`): the process's n-gram index (spectraVectorCache.ts) gives every row the caller
 *   may see that shares at least half of the query's trigrams (plus rows whose tags match), and
 *   fuse.js re-ranks the best RERANK candidates on the real text;
 * - vector filters (`absorbsAt`, `transparentAbove`): the same index holds the vectors and the
 *   narrow metadata, so filters, visibility, the vector test and the order are applied in memory.
 * Only the page's rows are then read from the database, with the caller's visibility applied again.
 */
import Fuse from 'fuse.js';
import pLimit from 'p-limit';
import { classifyCasQuery } from '../../cas';
import { ApiError } from '../http';
import type { SpectrumListQuery } from '../../schemas/spectra';
import { trigramsOf } from '../../spectra/trigrams';
import { db } from '../db/index';
import {
	findGroupIds,
	pageSpectrumSummaries,
	spectrumIdsTagged,
	summariesByIds,
	userIdsNamed,
	userNames,
	type SortKey,
	type SpectrumOrder,
	type SpectrumRow,
	type SpectrumSqlFilter
} from '../db/spectra';
import { tagsOfSpectra } from '../db/tags';
import { roleAtLeast } from '../policy';
import { callerOf, canEditSpectrum, type Caller } from './spectraAccess';
import { absorbsAtValue, absorptionOf, transparentAboveFromFacts, type VectorRow } from './spectraVectorFilters';
import { loadedVectorCache, vectorCache, type VectorCache } from './spectraVectorCache';
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
	// src/lib/cas.ts: check digit validated; a CAS-shaped query with a wrong check digit is a 400 naming q.
	const c = classifyCasQuery(q);
	if (c.kind === 'invalid-cas') throw new ApiError(400, 'invalid', `q: ${c.message}`, { field: 'q' });
	return c.kind === 'cas' ? c.cas : null;
}

interface Hit {
	id: number;
	slot?: number;
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

/**
 * The same rows as the SQL filter (db/spectra.ts applyFilter) selects, as a test on index slots:
 * visibility, deleted scope, part, kind, solvent, group, owner, visibility, CAS.
 */
export async function slotFilter(c: VectorCache, caller: Caller, f: SpectrumSqlFilter): Promise<(slot: number) => boolean> {
	const r = caller.reader;
	const me = c.owners.find(r.userId) ?? -2;
	const readerGroups = new Set(r.groupIds);
	const none = () => false;
	const code = (d: { find(s: string): number | undefined }, v: string | undefined) => (v === undefined ? undefined : (d.find(v) ?? -9));
	const part = code(c.parts, f.part);
	const kind = code(c.kinds, f.kind);
	if (part === -9 || kind === -9) return none;
	const vis = f.visibility === undefined ? undefined : ['private', 'group', 'public'].indexOf(f.visibility);
	const groups = f.groupIds ? new Set(f.groupIds) : undefined;
	let solvents: Set<number> | undefined;
	if (f.solvent) {
		const needle = f.solvent.toLowerCase();
		solvents = new Set(c.solvents.list.flatMap((s, i) => (s.includes(needle) ? [i] : [])));
	}
	let owners: Set<number> | undefined;
	if (f.owner) {
		const ids = [f.owner, ...(await userIdsNamed(f.owner))];
		owners = new Set(ids.map((id) => c.owners.find(id)).filter((x): x is number => x !== undefined));
	}
	const d = f.deletedScope;
	const memberGroups = new Set(d?.memberGroupIds ?? []);
	const leadGroups = new Set(d?.leadGroupIds ?? []);
	return (s) => {
		if (!r.isAdmin && !(c.ownerCode[s] === me || c.visCode[s] === 2 || (c.visCode[s] === 1 && readerGroups.has(c.groupId[s])))) return false;
		const del = c.deleted[s] === 1;
		if (f.deleted === 'only' ? !del : f.deleted !== 'include' && del) return false;
		if (del && f.deleted && d && !d.isAdmin && !((c.ownerCode[s] === me && memberGroups.has(c.groupId[s])) || leadGroups.has(c.groupId[s]))) return false;
		if (part !== undefined && c.partCode[s] !== part) return false;
		if (kind !== undefined && c.kindCode[s] !== kind) return false;
		if (solvents && !solvents.has(c.solventCode[s])) return false;
		if (groups && !groups.has(c.groupId[s])) return false;
		if (owners && !owners.has(c.ownerCode[s])) return false;
		if (vis !== undefined && c.visCode[s] !== vis) return false;
		if (f.cas !== undefined && c.cas[s] !== f.cas) return false;
		return true;
	};
}

/** Sorts hits by the order (as db/spectra.ts applyOrder does: nulls last, ties by id). */
async function sortHits(c: VectorCache, hits: Hit[], o: SpectrumOrder): Promise<void> {
	const sign = o.dir === 'desc' ? -1 : 1;
	const idSign = o.key === 'createdAt' || o.key === 'updatedAt' || o.key === 'id' ? sign : 1;
	let key: (s: number) => number | string | null;
	switch (o.key) {
		case 'updatedAt':
			key = (s) => c.updatedMs[s];
			break;
		case 'createdAt':
			key = (s) => c.createdMs[s];
			break;
		case 'lambdaMaxNm':
			key = (s) => (Number.isNaN(c.lambdaMax[s]) ? null : c.lambdaMax[s]);
			break;
		case 'name':
			key = (s) => c.names[s].toLowerCase();
			break;
		case 'part':
			key = (s) => c.parts.list[c.partCode[s]];
			break;
		case 'solvent':
			key = (s) => (c.solventCode[s] < 0 ? null : c.solvents.list[c.solventCode[s]]);
			break;
		case 'owner': {
			const names = await userNames(c.owners.list);
			key = (s) => (c.ownerCode[s] < 0 ? null : (names.get(c.owners.list[c.ownerCode[s]])?.toLowerCase() ?? null));
			break;
		}
		default:
			key = () => 0;
	}
	const keys = new Map<number, number | string | null>();
	for (const h of hits) keys.set(h.id, key(h.slot!));
	hits.sort((a, b) => {
		const x = keys.get(a.id)!;
		const y = keys.get(b.id)!;
		if (x === null || y === null) return x === y ? a.id - b.id : x === null ? 1 : -1;
		if (x < y) return -sign;
		if (x > y) return sign;
		return (a.id - b.id) * idSign;
	});
}

const vectorRowOf = (c: VectorCache, slot: number): VectorRow => {
	const cl = c.cl[slot];
	return { kind: c.kindOf(slot), y_unit: c.unitOf(slot), concentration_m: Number.isNaN(cl) ? null : cl, path_cm: Number.isNaN(cl) ? null : 1 };
};

/** The hit if the slot's vector passes the query's vector filters, else null. */
function vectorHit(c: VectorCache, slot: number, q: SpectrumListQuery): Hit | null {
	if (!c.valid[slot]) return null;
	const kind = c.kindOf(slot);
	const hit: Hit = { id: c.ids[slot], slot };
	if (q.transparentAbove !== undefined) {
		const facts = { max: c.max[slot], lastAbove5pct: c.lastAbove5pct[slot], lastMeasured: c.lastMeasured[slot], lastBelowHalf: c.lastBelowHalf[slot] };
		if (!transparentAboveFromFacts(kind, facts, q.transparentAbove)) return null;
	}
	if (q.absorbsAt !== undefined) {
		if (kind !== 'absorption') return null;
		const rule = { wavelengthNm: q.absorbsAt, minAbsorbance: q.minAbsorbance, minEpsilon: q.minEpsilon };
		const row = vectorRowOf(c, slot);
		const y = c.valueAt(slot, rule.wavelengthNm);
		if (!absorbsAtValue(row, y, c.max[slot], rule)) return null;
		const at = absorptionOf(row, y);
		if (at.absorbance !== undefined) hit.absorbanceAt = at.absorbance;
		if (at.epsilon !== undefined) hit.epsilonAt = at.epsilon;
	}
	return hit;
}

let tagList: { seq: number; tags: { id: number; name: string }[] } = { seq: -1, tags: [] };

/** Tags whose name is close to the query (the tag list is small; re-read when the Library changed). */
async function matchingTagIds(c: VectorCache, text: string): Promise<number[]> {
	if (tagList.seq !== c.seq) tagList = { seq: c.seq, tags: await db()('tags').select('id', 'name') };
	if (!tagList.tags.length) return [];
	return new Fuse(tagList.tags, { keys: ['name'], threshold: 0.3, ignoreLocation: true, minMatchCharLength: 2 }).search(text).map((h) => Number(h.item.id));
}

/** The answer of a fuzzy name search: the fuse.js re-ranked head, then the other candidates by shared trigrams. */
interface FuzzyRanking {
	total: number;
	/** Hits from `from` (inclusive) to `to` (exclusive) in rank order — objects for these only. */
	range(from: number, to: number): Hit[];
}

/** Lets other requests (a health check, a page) run between the steps of a long search. */
const yieldToLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Ranked hits of a fuzzy name search among the slots passing `accept` (see the module comment). */
async function fuzzyHits(c: VectorCache, accept: (slot: number) => boolean, text: string, tagCache: Map<number, string[]>): Promise<FuzzyRanking> {
	const grams = trigramsOf(text);
	if (!grams.length) return { total: 0, range: () => [] };
	const need = Math.max(1, Math.ceil(grams.length * MIN_SHARE));
	const tagged: number[] = [];
	for (const id of await spectrumIdsTagged(await matchingTagIds(c, text))) {
		const slot = c.slotOf.get(id);
		if (slot !== undefined) tagged.push(slot);
	}
	// one synchronous pass (the index's shared scratch); then the loop is let go before the re-rank
	const ranked = c.rankedGramHits(grams, need, accept, tagged);
	await yieldToLoop();
	const headN = Math.min(RERANK, ranked.n);
	const head = Array.from(ranked.slots.subarray(0, headN));
	const tags = await tagsOfSpectra(head.map((sl) => c.ids[sl]));
	for (const [id, t] of tags) tagCache.set(id, t);
	for (const sl of head) if (!tagCache.has(c.ids[sl])) tagCache.set(c.ids[sl], []);
	const docs = head.map((sl) => ({ slot: sl, name: c.names[sl], synonyms: c.synonyms[sl], cas: c.cas[sl] ?? '', tags: tags.get(c.ids[sl]) ?? [] }));
	const fused: Hit[] = new Fuse(docs, FUSE_OPTIONS).search(text).map((h) => ({ id: c.ids[h.item.slot], slot: h.item.slot, score: h.score ?? 0 }));
	const seen = new Set(fused.map((h) => h.slot!));
	// the rest, in trigram rank order (positions in `ranked`): the head's slots fuse.js did not match, then all after the head
	const restHead = head.flatMap((sl, j) => (seen.has(sl) ? [] : [j]));
	const total = fused.length + restHead.length + (ranked.n - headN);
	const restHit = (k: number): Hit => {
		const j = k < restHead.length ? restHead[k] : headN + (k - restHead.length);
		const sl = ranked.slots[j];
		return { id: c.ids[sl], slot: sl, score: Number((1 - ranked.hits[j] / grams.length).toFixed(4)) };
	};
	return {
		total,
		range(from, to) {
			const out: Hit[] = [];
			for (let k = Math.max(0, from); k < Math.min(to, total); k++) out.push(k < fused.length ? fused[k] : restHit(k - fused.length));
			return out;
		}
	};
}

/** Shapes one page of rows. */
async function itemsOf(caller: Caller, rows: SpectrumRow[], hits?: Map<number, Hit>, known?: Map<number, string[]>) {
	const missing = rows.map((r) => Number(r.id)).filter((id) => !known?.has(id));
	const tags = new Map([...(known ?? []), ...(missing.length ? await tagsOfSpectra(missing) : [])]);
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

/**
 * The lane of index searches (fuzzy names, vector filters): at most WINDOWSILL_SEARCH_LANE of them
 * (default 1) run at once in this process; the others wait their turn without holding the event
 * loop. Their work is CPU on the one JavaScript thread, so running more at once only interleaves
 * them — it never finishes them sooner — while a queue of them in the loop would delay everything
 * else (a health check, a page, a sign-in) behind their steps.
 */
const searchLane = pLimit(Math.max(1, Math.floor(Number(process.env.WINDOWSILL_SEARCH_LANE ?? 1)) || 1));

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
		// the page from SQL; the exact total from the index when this process has it loaded (the same rows:
		// it was brought to the change counter just now), else COUNT(*) in SQL
		const loaded = loadedVectorCache();
		if (loaded) {
			const c = await vectorCache();
			const accept = await slotFilter(c, caller, f);
			const { rows } = await pageSpectrumSummaries(caller.reader, f, order, q.limit, q.offset, undefined, { count: false });
			let total = 0;
			for (let s = 0; s < c.count; s++) if (accept(s)) total++;
			return { total, items: await itemsOf(caller, rows) };
		}
		const { rows, total } = await pageSpectrumSummaries(caller.reader, f, order, q.limit, q.offset);
		return { total, items: await itemsOf(caller, rows) };
	}

	return searchLane(() => searchIndex(caller, q, f, order, fuzzy ? text : '', needVector));
}

/** The fuzzy and vector-filter searches over the process's Library index (run in the search lane). */
async function searchIndex(caller: Caller, q: SpectrumListQuery, f: SpectrumSqlFilter, order: SpectrumOrder, text: string, needVector: boolean) {
	const fuzzy = text !== '';
	const c = await vectorCache();
	const accept = await slotFilter(c, caller, f);
	let hits: Hit[];
	const knownTags = new Map<number, string[]>();
	if (fuzzy) {
		const ranking = await fuzzyHits(c, accept, text, knownTags);
		if (!needVector && !q.sort) {
			// the common case (a picker, the Library's search box): objects for the page only
			const page = ranking.range(q.offset, q.offset + q.limit);
			const rows = await summariesByIds(caller.reader, page.map((h) => h.id), { deleted: 'include' });
			return { total: ranking.total, items: await itemsOf(caller, rows, new Map(page.map((h) => [h.id, h])), knownTags) };
		}
		hits = ranking.range(0, ranking.total);
		if (needVector)
			hits = hits.flatMap((h) => {
				const v = vectorHit(c, h.slot!, q);
				return v ? [{ ...v, score: h.score }] : [];
			});
		if (q.sort) await sortHits(c, hits, order);
	} else {
		hits = [];
		for (let s = 0; s < c.count; s++) {
			if (!accept(s)) continue;
			const h = vectorHit(c, s, q);
			if (h) hits.push(h);
		}
		await sortHits(c, hits, order);
	}
	const page = hits.slice(q.offset, q.offset + q.limit);
	const rows = await summariesByIds(caller.reader, page.map((h) => h.id), { deleted: 'include' });
	return { total: hits.length, items: await itemsOf(caller, rows, new Map(page.map((h) => [h.id, h])), knownTags) };
}
