/** Repository: the absorption spectra a group's lamp × absorber matrix compares (points only, no file BLOBs). */
import type { Knex } from 'knex';
import { db } from './index';
import { sideDataOf, type Reader, type SpectrumRow } from './spectra';

export type AbsorberCurveRow = Pick<SpectrumRow, 'id' | 'name' | 'part' | 'kind' | 'y_unit' | 'concentration_m' | 'path_cm' | 'x_nm' | 'y_normalised' | 'lambda_max_nm' | 'longest_band_nm' | 'visibility' | 'owner_id' | 'group_id'>;

/**
 * The group's absorption spectra whose part is substrate or photocatalyst, not deleted, that `reader` may see
 * (shared with the group or public, or the reader's own), by part then name.
 */
export async function listGroupAbsorberCurves(groupId: number, reader: Reader, k: Knex = db()): Promise<AbsorberCurveRow[]> {
	const q = k('spectra as s')
		.where('s.group_id', groupId)
		.whereIn('s.part', ['substrate', 'photocatalyst'])
		.where('s.kind', 'absorption')
		.whereNull('s.deleted_at')
		.orderBy('s.part', 'desc')
		.orderBy('s.name')
		.select('s.id', 's.name', 's.part', 's.kind', 's.y_unit', 's.concentration_m', 's.path_cm', 's.lambda_max_nm', 's.longest_band_nm', 's.visibility', 's.owner_id', 's.group_id');
	if (!reader.isAdmin) q.where((w) => w.whereIn('s.visibility', ['group', 'public']).orWhere('s.owner_id', reader.userId));
	const rows: Omit<AbsorberCurveRow, 'x_nm' | 'y_normalised'>[] = await q;
	// the normalised points live in spectrum_points (db/spectra.ts)
	const side = await sideDataOf(rows.map((r) => Number(r.id)), k, { points: true, vector: false });
	return rows.map((r) => ({ ...r, x_nm: side.get(Number(r.id))?.x_nm ?? Buffer.alloc(0), y_normalised: side.get(Number(r.id))?.y_normalised ?? Buffer.alloc(0) }));
}

/** How often each solvent name appears on the group's absorption spectra (for the matrix defaults). */
export async function groupSpectrumSolvents(groupId: number, k: Knex = db()): Promise<{ solvent: string; n: number }[]> {
	const rows = await k('spectra').where({ group_id: groupId }).whereNull('deleted_at').whereNotNull('solvent').groupBy('solvent').orderBy('n', 'desc').select('solvent').count('* as n');
	return rows.map((r: Record<string, unknown>) => ({ solvent: String(r.solvent), n: Number(r.n) }));
}
