/** GET /api/spectra/similar?to=:id&limit=: the caller's visible spectra nearest in shape (cosine on the 1 nm vectors). */
import { bufferToVector } from '../../spectra/grid';
import { rankSimilar } from '../../spectra/similarity';
import { ApiError } from '../http';
import { listSpectrumSummaries } from '../db/spectra';
import { visibleSpectrum } from './spectraAccess';
import { spectrumToApi } from './spectraView';
import { parseDerivedExtra } from './spectraDerive';

/**
 * Ranks spectra of the same kind by shape similarity to `to`.
 * @param limitParam - 1–50 (default 5)
 * @returns `{ to, items: [{ ...spectrum, similarity }] }`
 */
export async function similarSpectra(locals: App.Locals, toParam: string | null, limitParam: string | null) {
	if (!toParam) throw new ApiError(400, 'invalid', 'to: the id of a spectrum', { field: 'to' });
	const limit = limitParam ? Number(limitParam) : 5;
	if (!Number.isInteger(limit) || limit < 1 || limit > 50) throw new ApiError(400, 'invalid', 'limit: a whole number from 1 to 50', { field: 'limit' });
	const { caller, row } = await visibleSpectrum(locals, toParam);
	const rows = (await listSpectrumSummaries(caller.reader, { kind: row.kind, withVector: true })).filter((r) => r.id !== row.id);
	// compared on the stretch both are measured, unsaturated and above noise (overlapNm says how long it is)
	const stretch = (r: { derived_extra: string | null }) => parseDerivedExtra(r.derived_extra)?.similarity ?? null;
	const ranked = rankSimilar(bufferToVector(row.search_vector), rows.map((r) => ({ id: r.id, vector: bufferToVector(r.search_vector), stretch: stretch(r) })), limit, stretch(row));
	const byId = new Map(rows.map((r) => [r.id, r]));
	return { to: row.id, items: ranked.map((h) => ({ ...spectrumToApi(byId.get(h.id)!), similarity: h.score, overlapNm: h.overlapNm })) };
}
