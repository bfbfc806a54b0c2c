/**
 * Several stored spectra as one JCAMP-DX LINK file (GET /api/spectra/export?ids=1,2,3&format=jcamp): each id is
 * checked like a single export (404 for one the caller cannot see, never revealing which exists elsewhere).
 */
import { exportJcampLink } from '../../spectra/export/jcamp';
import type { SpectrumFileMetadata } from '../../spectra/types';
import { ApiError } from '../http';
import { visibleSpectrum } from './spectraAccess';
import { normalisedOf } from './spectraExport';

/** Most spectra one LINK export may hold. */
export const MAX_LINK_EXPORT = 100;

/** Parses `ids` ("1,2,3"): 1…100 distinct positive integers in the given order. @throws ApiError 400 naming `ids` */
export function parseIdList(param: string | null): number[] {
	const parts = (param ?? '').split(',').map((s) => s.trim()).filter(Boolean);
	if (!parts.length) throw new ApiError(400, 'invalid', 'ids: give the spectra as ids=1,2,3', { field: 'ids' });
	if (parts.length > MAX_LINK_EXPORT) throw new ApiError(400, 'invalid', `ids: at most ${MAX_LINK_EXPORT} spectra in one export`, { field: 'ids' });
	const ids = parts.map((p) => (/^\d{1,15}$/.test(p) ? Number(p) : NaN));
	const bad = parts.find((_, i) => !(ids[i] > 0));
	if (bad !== undefined) throw new ApiError(400, 'invalid', `ids: "${bad.slice(0, 20)}" is not a spectrum id`, { field: 'ids' });
	return [...new Set(ids)];
}

/** The LINK file for the visible spectra `ids`. @throws 400 (ids, format), 404 (a spectrum the caller cannot see) */
export async function exportSpectraLink(locals: App.Locals, idsParam: string | null, format: string | null) {
	if (format !== null && format !== '' && format !== 'jcamp' && format !== 'jdx') throw new ApiError(400, 'invalid', 'format: several spectra export as jcamp (a LINK file)', { field: 'format' });
	const ids = parseIdList(idsParam);
	const items: { spec: ReturnType<typeof normalisedOf>; metadata: SpectrumFileMetadata }[] = [];
	for (const id of ids) {
		const { row } = await visibleSpectrum(locals, String(id));
		const metadata: SpectrumFileMetadata = { title: row.name, origin: `Windowsill spectrum ${row.id}`, owner: row.owner_name ?? undefined, date: new Date(row.updated_at).toISOString().slice(0, 10) };
		if (row.cas) metadata.cas = row.cas;
		if (row.solvent) metadata.solvent = row.solvent;
		if (row.concentration_m != null) metadata.concentrationM = row.concentration_m;
		if (row.path_cm != null) metadata.pathCm = row.path_cm;
		items.push({ spec: normalisedOf(row), metadata });
	}
	return { body: exportJcampLink(items, `${items.length} spectra from Windowsill`), type: 'chemical/x-jcamp-dx; charset=utf-8', filename: `spectra-${ids.slice(0, 5).join('-')}${ids.length > 5 ? '-etc' : ''}.jdx` };
}
