/**
 * Visibility (policy.ts rules: private = owner, group = members, public = every signed-in user;
 * never leak another group's private rows: 404), optimistic locking, soft delete and restore.
 * Spectra here are invented test data (Gaussian bands).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/index';
import { visibleSpectrum } from '../../src/lib/server/services/spectraAccess';
import { patchSpectrum, setSpectrumDeleted } from '../../src/lib/server/services/spectraEdit';
import { revisionsOf } from '../../src/lib/server/services/spectraRevisions';
import { searchSpectra } from '../../src/lib/server/services/spectraSearch';
import { spectrumListQuerySchema } from '../../src/lib/schemas/spectra';
import { apiFailure, csvOf, gauss, localsOf, resetSpectraWorld, upload, type Who } from './spectraTestKit';

let ids: Record<'private' | 'group' | 'public', number>;
beforeAll(async () => {
	await resetSpectraWorld();
	const make = async (vis: string, centre: number) => (await upload('member', `access-${vis}.csv`, csvOf('wavelength (nm),absorbance', (x) => gauss(x, centre, 20, 0.8)), { visibility: vis, name: `Access test ${vis}` })).items[0].id;
	ids = { private: await make('private', 400), group: await make('group', 420), public: await make('public', 440) };
});
afterAll(closeDb);

const sees = async (who: Who, id: number) => visibleSpectrum(localsOf(who), String(id)).then(() => true, (e) => (e.status === 404 ? false : Promise.reject(e)));
const list = (who: Who) => searchSpectra(localsOf(who), spectrumListQuerySchema.parse({ q: 'Access test', limit: 50, group: 'spx-a' }));

describe('visibility', () => {
	it('private: only the owner', async () => {
		expect(await sees('member', ids.private)).toBe(true);
		expect(await sees('member2', ids.private)).toBe(false);
		expect(await sees('lead', ids.private)).toBe(false);
		expect(await sees('outsider', ids.private)).toBe(false);
	});
	it('group: members of the group, not another group (404, same as missing)', async () => {
		expect(await sees('viewer', ids.group)).toBe(true);
		expect(await sees('outsider', ids.group)).toBe(false);
		expect(await sees('outsider', 999999999)).toBe(false);
	});
	it('public: every signed-in user', async () => {
		expect(await sees('outsider', ids.public)).toBe(true);
		expect((await apiFailure(visibleSpectrum({ user: null, session: null } as App.Locals, String(ids.public)))).status).toBe(401);
	});
	it('the list shows the same rows', async () => {
		expect((await list('outsider')).items.map((s) => s.id)).toEqual([ids.public]);
		expect((await list('member2')).items.map((s) => s.id).sort()).toEqual([ids.group, ids.public].sort());
		expect((await list('member')).total).toBe(3);
	});
});

describe('editing', () => {
	it('optimistic locking: a save with the old version → 409, nothing changed', async () => {
		const a = await patchSpectrum(localsOf('member'), String(ids.group), { name: 'Access test group (renamed)', tags: ['Blue', 'test'], version: 1 });
		expect(a.version).toBe(2);
		expect(a.tags).toEqual(['blue', 'test']);
		const e = await apiFailure(patchSpectrum(localsOf('lead'), String(ids.group), { name: 'Stale save', version: 1 }));
		expect(e.status).toBe(409);
		const { row } = await visibleSpectrum(localsOf('member'), String(ids.group));
		expect(row.name).toBe('Access test group (renamed)');
		const revs = await revisionsOf(ids.group);
		expect(revs.map((r) => r.action)).toEqual(['edit', 'create']);
		expect(revs[0].changes?.name).toEqual({ from: 'Access test group', to: 'Access test group (renamed)' });
	});
	it('a lead may edit a member’s group spectrum; another member may not (403); a viewer may not (403)', async () => {
		const { row } = await visibleSpectrum(localsOf('lead'), String(ids.group));
		await patchSpectrum(localsOf('lead'), String(ids.group), { notes: 'checked by the lead', version: row.version });
		expect((await apiFailure(patchSpectrum(localsOf('member2'), String(ids.group), { notes: 'x', version: row.version + 1 }))).status).toBe(403);
		expect((await apiFailure(patchSpectrum(localsOf('viewer'), String(ids.group), { notes: 'x', version: row.version + 1 }))).status).toBe(403);
		expect((await apiFailure(patchSpectrum(localsOf('outsider'), String(ids.group), { notes: 'x', version: row.version + 1 }))).status).toBe(404);
	});
	it('setting concentration and path turns absorbance into ε (Beer–Lambert ε = A/(c·l))', async () => {
		const { row } = await visibleSpectrum(localsOf('member'), String(ids.public));
		const before = row.value_at_max!;
		const s = await patchSpectrum(localsOf('member'), String(ids.public), { concentrationM: 2e-5, pathCm: 1, version: row.version });
		expect(s.yUnit).toBe('epsilon');
		expect(s.valueAtMax!).toBeCloseTo(before / 2e-5, 6);
	});
	it('negative path → 422 naming the field', async () => {
		const { row } = await visibleSpectrum(localsOf('member'), String(ids.public));
		const e = await apiFailure(patchSpectrum(localsOf('member'), String(ids.public), { pathCm: -1, version: row.version }));
		expect(e.status).toBe(422);
		expect(e.extra.field).toBe('pathCm');
	});
});

describe('soft delete and restore', () => {
	it('hides the spectrum from others, keeps it for the owner, and restores it', async () => {
		await setSpectrumDeleted(localsOf('member'), String(ids.group), true);
		expect(await sees('member2', ids.group)).toBe(false);
		expect(await sees('member', ids.group)).toBe(true);
		expect((await list('member2')).items.map((s) => s.id)).not.toContain(ids.group);
		await setSpectrumDeleted(localsOf('member'), String(ids.group), false);
		expect(await sees('member2', ids.group)).toBe(true);
		expect((await revisionsOf(ids.group)).map((r) => r.action).slice(0, 2)).toEqual(['restore', 'delete']);
	});
	it('a viewer may not delete (403)', async () => {
		expect((await apiFailure(setSpectrumDeleted(localsOf('viewer'), String(ids.group), true))).status).toBe(403);
	});
});
