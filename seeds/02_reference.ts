import type { Knex } from 'knex';
import { SOLVENTS } from '../src/lib/irradiation/data/solvents';
import { WALL_MATERIALS } from '../src/lib/irradiation/data/materials';

/**
 * Reference data (all modes, production too): solvents with cut-offs and wall materials with their optical models,
 * each row naming its source and status. Upserts by slug, so re-running refreshes values without duplicating rows
 * (and keeps a solvent's link to a measured spectrum).
 */
export async function seed(knex: Knex): Promise<void> {
	for (const s of SOLVENTS) {
		const row = {
			slug: s.id,
			name: s.name,
			synonyms: JSON.stringify(s.synonyms),
			cas: s.casNumber,
			cutoff_nm: s.cutoffNm,
			refractive_index: s.refractiveIndex ?? null,
			source: s.source,
			status: s.status,
			notes: s.notes
		};
		await knex('solvents').insert(row).onConflict('slug').merge(Object.keys(row).filter((k) => k !== 'slug'));
	}
	for (const m of WALL_MATERIALS) {
		const row = {
			slug: m.id,
			name: m.name,
			family: m.definition.model,
			model: JSON.stringify(m.definition),
			refractive_index: m.n,
			typical_thickness_mm: m.typicalThicknessMm,
			source: m.source,
			status: m.status,
			notes: m.notes
		};
		await knex('wall_materials').insert(row).onConflict('slug').merge(Object.keys(row).filter((k) => k !== 'slug'));
	}
}
