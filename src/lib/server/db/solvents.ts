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
	/** Linked measured absorption spectrum of the Library (wins over the cut-off edge model), null when none. */
	spectrumId: number | null;
	/** Name of the linked spectrum when it is still there (not deleted), else null. */
	spectrumName: string | null;
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
		spectrumId: r.spectrum_id == null ? null : Number(r.spectrum_id),
		spectrumName: r.spectrum_name == null ? null : String(r.spectrum_name)
	};
}

const solventQuery = () =>
	db()('solvents as v')
		.leftJoin('spectra as s', function () {
			this.on('s.id', '=', 'v.spectrum_id').andOnNull('s.deleted_at');
		})
		.select('v.*', 's.name as spectrum_name');

/** All solvents ordered by name. */
export async function listSolvents(): Promise<Solvent[]> {
	const rows = await solventQuery().orderBy('v.name');
	return rows.map(toSolvent);
}

/** One solvent by numeric id, or null. */
export async function getSolvent(id: number): Promise<Solvent | null> {
	const r = await solventQuery().where('v.id', id).first();
	return r ? toSolvent(r) : null;
}

/** One solvent by slug, or null. */
export async function getSolventBySlug(slug: string): Promise<Solvent | null> {
	const r = await solventQuery().where('v.slug', slug).first();
	return r ? toSolvent(r) : null;
}

/** Links (or with null unlinks) a measured spectrum to a solvent; returns rows changed. */
export async function setSolventSpectrum(solventId: number, spectrumId: number | null): Promise<number> {
	return db()('solvents').where({ id: solventId }).update({ spectrum_id: spectrumId, updated_at: db().fn.now() });
}

/** A public absorption spectrum a solvent may be linked to. */
export interface LinkableSpectrum {
	id: number;
	name: string;
	part: string;
	solvent: string | null;
	cas: string | null;
	pathCm: number | null;
}

/** Public, not deleted absorption spectra (solvent parts first, then by name): the choices for a solvent link. */
export async function listLinkableSpectra(): Promise<LinkableSpectrum[]> {
	const rows = await db()('spectra')
		.where({ visibility: 'public', kind: 'absorption' })
		.whereNull('deleted_at')
		.select('id', 'name', 'part', 'solvent', 'cas', 'path_cm')
		.orderByRaw("part = 'solvent' desc")
		.orderBy('name');
	return rows.map((r) => ({ id: Number(r.id), name: String(r.name), part: String(r.part), solvent: r.solvent ?? null, cas: r.cas ?? null, pathCm: r.path_cm == null ? null : Number(r.path_cm) }));
}
