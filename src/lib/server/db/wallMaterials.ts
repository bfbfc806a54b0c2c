import { db } from './index';
import type { WallMaterialModel } from '$lib/irradiation/walls';
import type { ReferenceStatus } from '$lib/irradiation/data/solvents';

/** A wall material row: reference rows have no group; group rows come from a member's measured spectrum. */
export interface WallMaterial {
	id: number;
	slug: string;
	name: string;
	model: WallMaterialModel;
	refractiveIndex: number;
	typicalThicknessMm: number | null;
	source: string;
	status: ReferenceStatus | string;
	notes: string | null;
	groupId: number | null;
	spectrumId: number | null;
}

function toMaterial(r: Record<string, unknown>): WallMaterial {
	return {
		id: Number(r.id),
		slug: String(r.slug),
		name: String(r.name),
		model: (typeof r.model === 'string' ? JSON.parse(r.model) : r.model) as WallMaterialModel,
		refractiveIndex: Number(r.refractive_index),
		typicalThicknessMm: r.typical_thickness_mm == null ? null : Number(r.typical_thickness_mm),
		source: String(r.source),
		status: String(r.status),
		notes: (r.notes as string) ?? null,
		groupId: r.group_id == null ? null : Number(r.group_id),
		spectrumId: r.spectrum_id == null ? null : Number(r.spectrum_id)
	};
}

/** Reference materials plus those of the given groups, ordered by name. */
export async function listWallMaterials(groupIds: number[] = []): Promise<WallMaterial[]> {
	const q = db()('wall_materials').whereNull('group_id');
	if (groupIds.length) q.orWhereIn('group_id', groupIds);
	return (await q.orderBy('name')).map(toMaterial);
}

/** One material by id (reference rows or rows of the given groups), or null. */
export async function getWallMaterial(id: number, groupIds: number[] = []): Promise<WallMaterial | null> {
	const r = await db()('wall_materials')
		.where({ id })
		.andWhere((w) => {
			w.whereNull('group_id');
			if (groupIds.length) w.orWhereIn('group_id', groupIds);
		})
		.first();
	return r ? toMaterial(r) : null;
}

/** Inserts a group's own material; returns its id. */
export async function insertWallMaterial(row: {
	slug: string;
	name: string;
	model: WallMaterialModel;
	refractiveIndex: number;
	typicalThicknessMm: number;
	source: string;
	status: string;
	notes: string | null;
	groupId: number;
	/** The Library spectrum the material was made from; null for one made from an uploaded n, k table. */
	spectrumId: number | null;
	createdBy: string;
}): Promise<number> {
	const [id] = await db()('wall_materials').insert({
		slug: row.slug,
		name: row.name,
		family: row.model.model,
		model: JSON.stringify(row.model),
		refractive_index: row.refractiveIndex,
		typical_thickness_mm: row.typicalThicknessMm,
		source: row.source,
		status: row.status,
		notes: row.notes,
		group_id: row.groupId,
		spectrum_id: row.spectrumId,
		created_by: row.createdBy
	});
	return Number(id);
}
