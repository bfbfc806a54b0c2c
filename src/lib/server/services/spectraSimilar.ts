/**
 * GET /api/spectra/similar?to=:id&limit=: the caller's visible spectra nearest in shape (cosine on
 * the 1 nm vectors). Candidates: what the caller may see, same kind, not deleted (the process's
 * Library index, kept right by the change counter); scores: one pass over its contiguous vectors —
 * in a worker thread when there are many candidates, so the request's event loop stays free. The
 * winners are read back from the database with the caller's visibility applied.
 */
import { ApiError } from '../http';
import { findSpectrumSummaryById, findVectors, summariesByIds } from '../db/spectra';
import { notFound } from '../http';
import { canReadRow } from '../policy';
import { slotFilter } from './spectraSearch';
import { tagsOfSpectra } from '../db/tags';
import { copyFloat32Into } from '../db/spectraBlobs';
import { callerOf, canEditSpectrum, spectrumIdOf } from './spectraAccess';
import { spectrumToApi } from './spectraView';
import { parseDerivedExtra } from './spectraDerive';
import { rankSimilar } from '../../spectra/similarity';
import { vectorCache } from './spectraVectorCache';
import { topKInProcess, topKInWorker, type TopKJob } from './similarityKernel';

/** Candidates from which the scan runs in the worker thread (WINDOWSILL_SIMILAR_WORKER_MIN, default 20,000). */
const workerMin = () => Number(process.env.WINDOWSILL_SIMILAR_WORKER_MIN ?? 20_000);

/** The metadata row of a spectrum the caller may read — the rules of spectraAccess.visibleSpectrum, without points. */
async function visibleSummary(locals: App.Locals, idParam: string) {
	const caller = await callerOf(locals);
	const row = await findSpectrumSummaryById(spectrumIdOf(idParam));
	const policyRow = row && { ownerId: row.owner_id, groupId: Number(row.group_id), visibility: row.visibility };
	if (!row || !canReadRow(caller.user, caller.memberships, policyRow!)) throw notFound('No such spectrum.');
	if (row.deleted_at && !canEditSpectrum(caller, row)) throw notFound('No such spectrum.');
	return { caller, row };
}

/**
 * Ranks spectra of the same kind by shape similarity to `to`.
 * @param limitParam - 1–50 (default 5)
 * @returns `{ to, items: [{ ...spectrum, similarity }] }`
 */
export async function similarSpectra(locals: App.Locals, toParam: string | null, limitParam: string | null) {
	if (!toParam) throw new ApiError(400, 'invalid', 'to: the id of a spectrum', { field: 'to' });
	const limit = limitParam ? Number(limitParam) : 5;
	if (!Number.isInteger(limit) || limit < 1 || limit > 50) throw new ApiError(400, 'invalid', 'limit: a whole number from 1 to 50', { field: 'limit' });
	const { caller, row } = await visibleSummary(locals, toParam);
	const cache = await vectorCache();
	const accept = await slotFilter(cache, caller, { kind: row.kind });
	const all = new Int32Array(cache.count);
	let n = 0;
	for (let s = 0; s < cache.count; s++) if (cache.valid[s] && cache.ids[s] !== Number(row.id) && accept(s)) all[n++] = s;
	const slots = all.subarray(0, n);
	// the target's vector: from the index (refreshed to the change counter just now), else from the database
	const target = new Float32Array(cache.len);
	const slot = cache.slotOf.get(Number(row.id));
	if (slot !== undefined && cache.valid[slot]) target.set(cache.vector(slot));
	else {
		const tv = (await findVectors([Number(row.id)])).get(Number(row.id));
		if (tv && tv.byteLength === cache.len * 4) copyFloat32Into(tv, target, 0);
	}
	let ss = 0;
	for (let i = 0; i < target.length; i++) ss += target[i] * target[i];
	// Two stages: the one-pass kernel over whole vectors picks the candidates (RERANK_POOL of them), then each is
	// scored on the stretch both spectra are measured, unsaturated and above noise (overlapNm says how long it is).
	const pool = Math.max(limit * 20, Number(process.env.WINDOWSILL_SIMILAR_RERANK ?? 200));
	const job: TopKJob = { vectors: cache.vectors, offs: cache.vecOff, froms: cache.vecFrom, lens: cache.vecLen, target, targetInv: ss > 0 ? 1 / Math.sqrt(ss) : 0, slots, invNorm: cache.invNorm, ids: cache.ids, k: pool };
	const pre = slots.length >= workerMin() ? await topKInWorker(job) : topKInProcess(job);
	const rows = await summariesByIds(caller.reader, pre.map((h) => h.id));
	const stretch = (r: { derived_extra?: string | null }) => parseDerivedExtra(r.derived_extra ?? null)?.similarity ?? null;
	const candidates = rows.flatMap((r) => {
		const sl = cache.slotOf.get(Number(r.id));
		return sl === undefined || !cache.valid[sl] ? [] : [{ id: Number(r.id), vector: cache.vector(sl), stretch: stretch(r) }];
	});
	const ranked = rankSimilar(target, candidates, limit, stretch(row));
	const tags = await tagsOfSpectra(ranked.map((h) => h.id));
	const byId = new Map(rows.map((r) => [Number(r.id), r]));
	return {
		to: row.id,
		items: ranked.filter((h) => byId.has(h.id)).map((h) => ({ ...spectrumToApi(byId.get(h.id)!, tags.get(h.id) ?? []), similarity: h.score, overlapNm: h.overlapNm }))
	};
}
