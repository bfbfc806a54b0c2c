/**
 * Linking a solvent to a measured absorption spectrum from the Library (it then wins over the cut-off edge model in
 * the Window finder). Solvent rows are shared by every group, so only a public spectrum may be linked, by a group
 * lead or an admin.
 */
import { getSolvent, setSolventSpectrum } from '$lib/server/db/solvents';
import { findSpectrumById } from '$lib/server/db/spectra';
import { ApiError, forbidden } from '$lib/server/http';
import { membershipsOf, requireUser } from '$lib/server/policy';

export async function linkSolventSpectrum(locals: App.Locals, solventIdRaw: unknown, spectrumIdRaw: unknown): Promise<void> {
	const user = requireUser(locals);
	if (user.siteRole !== 'admin' && !(await membershipsOf(user.id)).some((m) => m.role === 'lead')) throw forbidden('Only group leads and admins link solvent spectra.');
	const solventId = Number(solventIdRaw);
	const solvent = Number.isInteger(solventId) ? await getSolvent(solventId) : null;
	if (!solvent) throw new ApiError(400, 'invalid', 'solventId: no such solvent.', { field: 'solventId' });
	if (spectrumIdRaw === '' || spectrumIdRaw === null || spectrumIdRaw === undefined) {
		await setSolventSpectrum(solvent.id, null);
		return;
	}
	const spectrumId = Number(spectrumIdRaw);
	const row = Number.isInteger(spectrumId) && spectrumId > 0 ? await findSpectrumById(spectrumId) : undefined;
	if (!row || row.deleted_at || row.visibility !== 'public') throw new ApiError(400, 'invalid', 'spectrumId: give a public spectrum of the Library.', { field: 'spectrumId' });
	if (row.kind !== 'absorption') throw new ApiError(400, 'invalid', `spectrumId: spectrum ${spectrumId} is a ${row.kind} spectrum, not an absorption spectrum.`, { field: 'spectrumId' });
	await setSolventSpectrum(solvent.id, spectrumId);
}
