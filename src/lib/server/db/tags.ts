/** Repository of `tags` and `spectrum_tags`. Tag names are stored lower-case and trimmed. */
import type { Knex } from 'knex';
import { db } from './index';

/** Normalises tag names: trimmed, lower-case, unique, empty ones dropped. */
export function cleanTags(names: string[]): string[] {
	return [...new Set(names.map((n) => n.trim().toLowerCase()).filter(Boolean))];
}

/** Inserts the tags that do not exist yet (no-op for existing names). */
export async function insertMissingTags(trx: Knex | Knex.Transaction, names: string[]): Promise<void> {
	if (!names.length) return;
	await trx('tags').insert(names.map((name) => ({ name }))).onConflict('name').ignore();
}

/** Ids of tags by name. */
export async function findTagIds(trx: Knex | Knex.Transaction, names: string[]): Promise<number[]> {
	if (!names.length) return [];
	const rows = await trx('tags').whereIn('name', names).select('id');
	return rows.map((r: { id: number }) => Number(r.id));
}

/** Removes all tags of a spectrum. */
export async function clearSpectrumTags(trx: Knex | Knex.Transaction, spectrumId: number): Promise<void> {
	await trx('spectrum_tags').where({ spectrum_id: spectrumId }).delete();
}

/** Attaches tag ids to a spectrum. */
export async function addSpectrumTags(trx: Knex | Knex.Transaction, spectrumId: number, tagIds: number[]): Promise<void> {
	if (!tagIds.length) return;
	await trx('spectrum_tags').insert(tagIds.map((tag_id) => ({ spectrum_id: spectrumId, tag_id })));
}

/** Tag names per spectrum id. */
export async function tagsOfSpectra(ids: number[], conn: Knex | Knex.Transaction = db()): Promise<Map<number, string[]>> {
	const out = new Map<number, string[]>();
	if (!ids.length) return out;
	const rows = await conn('spectrum_tags as st').join('tags as t', 't.id', 'st.tag_id').whereIn('st.spectrum_id', ids).orderBy('t.name').select('st.spectrum_id', 't.name');
	for (const r of rows as { spectrum_id: number; name: string }[]) {
		const k = Number(r.spectrum_id);
		out.set(k, [...(out.get(k) ?? []), r.name]);
	}
	return out;
}
