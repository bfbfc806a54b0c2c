/**
 * Solvents linked to measured Library spectra and exact CAS look-ups, against the real test database.
 * The measured solvent curve here is invented test data; the check is Beer–Lambert (A = a·l: the planner's solvent
 * absorbance over the reaction path equals the measured absorbance per cm times that path).
 * CAS numbers: CAS Registry (tetrahydrofuran 109-99-9, acetonitrile 75-05-8, water 7732-18-5; from memory, check digits verified by the formula).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '../../src/lib/server/db/index';
import { getSolventBySlug, listSolvents } from '../../src/lib/server/db/solvents';
import { spectrumListQuerySchema } from '../../src/lib/schemas/spectra';
import { linkSolventSpectrum, solventCurveOnGrid } from '../../src/lib/server/services/solventLink';
import { searchSolvents } from '../../src/lib/server/services/solventSearch';
import { searchSpectra } from '../../src/lib/server/services/spectraSearch';
import { computeWindowFor } from '../../src/lib/server/services/window';
import { COMPUTATION_GRID } from '../../src/lib/irradiation/wavelengthGrid';
import { apiFailure, csvOf, gauss, localsOf, resetSpectraWorld, upload } from './spectraTestKit';

/** Invented neat-solvent curve (1 nm, 190–700 nm): an edge at 215 nm plus a weak impurity band at 265 nm, measured over 0.5 cm. */
const solventA = (x: number) => Math.min(3, 10 ** ((215 - x) / 9)) + gauss(x, 265, 8, 0.08);
const ids: Record<string, number> = {};
let heptaneId = 0;
let lampId = 0;

beforeAll(async () => {
	const { groupA } = await resetSpectraWorld();
	const up = async (key: string, text: string, meta: Record<string, unknown>) => (ids[key] = (await upload('lead', `${key}.csv`, text, meta)).items[0].id);
	await up('heptane', csvOf('wavelength (nm),absorbance', solventA, 190, 700), { name: 'Heptane, neat (0.5 cm), spx', part: 'solvent', pathCm: 0.5, visibility: 'public', cas: '142-82-5' });
	await up('private', csvOf('wavelength (nm),absorbance', (x) => solventA(x) * 1.01, 190, 700), { name: 'Heptane, private copy', part: 'solvent', pathCm: 0.5, visibility: 'group' });
	await up('thfdye', csvOf('wavelength (nm),epsilon (M-1 cm-1)', (x) => gauss(x, 300, 15, 8000), 190, 700), { name: 'Spx dye in THF', part: 'substrate', cas: '109-99-9' });
	await up('other', csvOf('wavelength (nm),epsilon (M-1 cm-1)', (x) => gauss(x, 320, 15, 8000), 190, 700), { name: 'Spx other', part: 'substrate', cas: '75-05-8' });
	heptaneId = (await getSolventBySlug('n-heptane'))!.id;
	await db()('lamps').where({ group_id: groupA }).delete();
	[lampId] = await db()('lamps').insert({ group_id: groupA, name: 'Spx LED 265', model: JSON.stringify({ type: 'led', peakNm: 265, fwhmNm: 12, shape: 'gaussian' }), power_w: 0.5, coupling_factor: 1 });
});
afterAll(async () => {
	await db()('solvents').where({ id: heptaneId }).update({ spectrum_id: null });
	await db()('lamps').where({ id: lampId }).delete();
	await closeDb();
});

describe('linking a solvent to a measured spectrum', () => {
	it('only leads (and admins) link; members and viewers get 403', async () => {
		expect((await apiFailure(linkSolventSpectrum(localsOf('member'), heptaneId, ids.heptane))).status).toBe(403);
		expect((await apiFailure(linkSolventSpectrum(localsOf('viewer'), heptaneId, ids.heptane))).status).toBe(403);
	});
	it('refuses a spectrum that is not public, naming spectrumId, and writes nothing', async () => {
		const e = await apiFailure(linkSolventSpectrum(localsOf('lead'), heptaneId, ids.private));
		expect(e.status).toBe(400);
		expect(e.extra.field).toBe('spectrumId');
		expect((await getSolventBySlug('n-heptane'))!.spectrumId).toBeNull();
	});
	it('the planner uses the linked curve: A_solvent(λ) over the path = measured A(λ)/0.5 cm × path, and says which spectrum', async () => {
		const linked = await linkSolventSpectrum(localsOf('lead'), heptaneId, ids.heptane);
		expect(linked.spectrumId).toBe(ids.heptane);
		const curve = await solventCurveOnGrid(linked, COMPUTATION_GRID);
		expect(curve.basis).toBe('measured');
		expect(curve.spectrumId).toBe(ids.heptane);
		const i265 = (265 - COMPUTATION_GRID.fromNm) / COMPUTATION_GRID.stepNm;
		// Beer–Lambert: absorbance per cm = A(0.5 cm)/0.5
		expect(curve.absorbancePerCm[i265]).toBeCloseTo(solventA(265) / 0.5, 4);
		const silica = await db()('wall_materials').where({ slug: 'fused-silica-uv-grade' }).first('id');
		const body = { substrate: { spectrumId: ids.thfdye, concentrationM: 1e-4 }, solvent: { id: heptaneId }, wall: { materialId: silica.id, thicknessMm: 1 }, pathCm: 2, lamps: [lampId], includeCurves: true };
		const out = await computeWindowFor(localsOf('member'), body);
		expect(out.solvent).toMatchObject({ basis: 'measured', spectrumId: ids.heptane, spectrumName: 'Heptane, neat (0.5 cm), spx' });
		const j = out.curves!.x.indexOf(265);
		expect(out.curves!.solventAbsorbance[j]).toBeCloseTo((solventA(265) / 0.5) * 2, 4);
		// unlinked, the edge model is back and labelled as such
		await linkSolventSpectrum(localsOf('lead'), heptaneId, null);
		const again = await computeWindowFor(localsOf('member'), body);
		expect(again.solvent).toMatchObject({ basis: 'edge model', spectrumId: null });
	});
});

describe('CAS look-ups are exact', () => {
	it('solvents: a CAS number finds exactly its solvent; an unknown valid one finds nothing; a bad check digit is a 400 naming q', async () => {
		const all = await listSolvents();
		expect(searchSolvents(all, '109-99-9').map((s) => s.slug)).toEqual(['tetrahydrofuran']);
		expect(searchSolvents(all, '75-05-8').map((s) => s.slug)).toEqual(['acetonitrile']);
		expect(searchSolvents(all, '999-99-5')).toEqual([]);
		let err: { status: number; extra: { field?: string } } | undefined;
		try {
			searchSolvents(all, '999-99-9');
		} catch (e) {
			err = e as never;
		}
		expect(err?.status).toBe(400);
		expect(err?.extra.field).toBe('q');
		// names and synonyms stay fuzzy
		expect(searchSolvents(all, 'tetrahydrofuan').map((s) => s.slug)).toContain('tetrahydrofuran');
		expect(searchSolvents(all, 'oxolane')[0].slug).toBe('tetrahydrofuran');
	});
	it('spectra: a CAS-shaped q matches the CAS column exactly, never fuzzily', async () => {
		const q = (text: string) => searchSpectra(localsOf('member'), spectrumListQuerySchema.parse({ q: text, group: 'spx-a' }));
		expect((await q('109-99-9')).items.map((s) => s.id)).toEqual([ids.thfdye]);
		expect((await q('75-05-8')).items.map((s) => s.id)).toEqual([ids.other]);
		expect((await q('999-99-5')).total).toBe(0);
		expect((await apiFailure(q('999-99-9'))).status).toBe(400);
	});
});
