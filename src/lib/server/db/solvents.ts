import { db } from './index';
import type { ReferenceStatus } from '$lib/irradiation/data/solvents';

/** A solvent row as the API and pages use it. */
export interface Solvent {
	id: number;
	slug: string;
	name: string;
	synonyms: string[];
	cas: string | null;
	cutoffNm: number;
	refractiveIndex: number | null;
	source: string;
	status: ReferenceStatus;
	notes: string | null;
	spectrumId: number | null;
}

function toSolvent(r: Record<string, unknown>): Solvent {
	return {
		id: Number(r.id),
		slug: String(r.slug),
		name: String(r.name),
		synonyms: typeof r.synonyms === 'string' ? JSON.parse(r.synonyms) : ((r.synonyms as string[]) ?? []),
		cas: (r.cas as string) ?? null,
		cutoffNm: Number(r.cutoff_nm),
		refractiveIndex: r.refractive_index == null ? null : Number(r.refractive_index),
		source: String(r.source),
		status: r.status as ReferenceStatus,
		notes: (r.notes as string) ?? null,
		spectrumId: r.spectrum_id == null ? null : Number(r.spectrum_id)
	};
}

/** All solvents ordered by name. */
export async function listSolvents(): Promise<Solvent[]> {
	const rows = await db()('solvents').orderBy('name');
	return rows.map(toSolvent);
}

/** One solvent by numeric id, or null. */
export async function getSolvent(id: number): Promise<Solvent | null> {
	const r = await db()('solvents').where({ id }).first();
	return r ? toSolvent(r) : null;
}

/** Links (or with null unlinks) a measured spectrum to a solvent; returns rows changed. */
export async function setSolventSpectrum(solventId: number, spectrumId: number | null): Promise<number> {
	return db()('solvents').where({ id: solventId }).update({ spectrum_id: spectrumId, updated_at: db().fn.now() });
}
