/**
 * Search (fuzzy names, "absorbs at", "transparent above"), similar spectra and export → re-import.
 * Spectra are invented test data (Gaussian bands in ε), except the PMMA sheet
 * (aphalo/photobiologyFilters Clear_0A000_XT.csv, MANIFEST.md).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/index';
import { findSpectrumById } from '../../src/lib/server/db/spectra';
import { spectrumListQuerySchema } from '../../src/lib/schemas/spectra';
import { exportSpectrum, spectrumData } from '../../src/lib/server/services/spectraExport';
import { searchSpectra } from '../../src/lib/server/services/spectraSearch';
import { similarSpectra } from '../../src/lib/server/services/spectraSimilar';
import { parseSpectrumFile } from '../../src/lib/spectra/parse/index';
import { normaliseSpectrum } from '../../src/lib/spectra/normalise';
import { csvOf, external, gauss, localsOf, resetSpectraWorld, upload, uploadPath } from './spectraTestKit';

const ids: Record<string, number> = {};
beforeAll(async () => {
	await resetSpectraWorld();
	const add = async (key: string, name: string, f: (x: number) => number, meta: Record<string, unknown> = {}) =>
		(ids[key] = (await upload('member', `${key}.csv`, csvOf('wavelength (nm),epsilon (M-1 cm-1)', f), { name, ...meta })).items[0].id);
	await add('blue', 'Tidewater Blue catalyst', (x) => gauss(x, 452, 22, 14000) + gauss(x, 290, 15, 30000), { part: 'photocatalyst', synonyms: ['TWB-7'], tags: ['blue'] });
	await add('blue2', 'Harbour Cyan dye', (x) => gauss(x, 458, 24, 9000) + gauss(x, 292, 15, 20000), { part: 'photocatalyst' });
	await add('uvc', 'Pinewick ester', (x) => gauss(x, 262, 12, 12000), { part: 'substrate', cas: '50-00-0' });
	await add('uva', 'Morrow enone', (x) => gauss(x, 365, 15, 8000), { part: 'substrate' });
	ids.pmma = (await uploadPath('member', external('transmission/pmma-clear-sheet.csv'), { part: 'wall', name: 'PMMA sheet' })).items[0].id;
});
afterAll(closeDb);

/** Searches as member2 within the test group (public demo spectra of other groups stay out). */
const search = async (params: Record<string, string>) => (await searchSpectra(localsOf('member2'), spectrumListQuerySchema.parse({ limit: '100', group: 'spx-a', ...params }))).items.map((s) => s.id);

describe('search', () => {
	it('absorbs at 450 nm finds the blue-absorbing catalysts only', async () => {
		const got = await search({ absorbsAt: '450' });
		expect(got.sort()).toEqual([ids.blue, ids.blue2].sort());
		// with a threshold in ε: 14000 M⁻¹ cm⁻¹ at 452 nm (invented band) passes 10000, 9000·exp(−(8/24)²/2) does not
		expect(await search({ absorbsAt: '450', minEpsilon: '10000' })).toEqual([ids.blue]);
	});
	it('transparent above 320 nm: the UV-C substrate, not the UV-A one; the PMMA sheet above 400 nm', async () => {
		const got = await search({ transparentAbove: '320' });
		expect(got).toContain(ids.uvc);
		expect(got).not.toContain(ids.uva);
		expect(await search({ transparentAbove: '400', part: 'wall' })).toEqual([ids.pmma]);
	});
	it('fuzzy name search finds a misspelt name, a synonym and a CAS number', async () => {
		expect((await search({ q: 'Tidewatr blu' }))[0]).toBe(ids.blue);
		expect((await search({ q: 'twb7' }))[0]).toBe(ids.blue);
		expect((await search({ q: '50-00-0' }))[0]).toBe(ids.uvc);
	});
	it('sorts and pages on the server', async () => {
		const all = await searchSpectra(localsOf('member'), spectrumListQuerySchema.parse({ sort: 'lambdaMaxNm', dir: 'asc', limit: '2', offset: '0', part: 'substrate', group: 'spx-a' }));
		expect(all.total).toBe(2);
		expect(all.items.map((s) => s.id)).toEqual([ids.uvc, ids.uva]);
	});
});

describe('similar', () => {
	it('the nearest shape to the blue catalyst is the other blue dye', async () => {
		const r = await similarSpectra(localsOf('member'), String(ids.blue), '3');
		expect(r.items[0].id).toBe(ids.blue2);
		expect(r.items[0].similarity).toBeGreaterThan(0.9);
	});
});

describe('export → re-import', () => {
	for (const format of ['csv', 'jcamp'] as const) {
		it(`${format}: the same points within 1e-9 relative`, async () => {
			for (const key of ['blue', 'pmma']) {
				const row = (await findSpectrumById(ids[key]))!;
				const file = exportSpectrum(row, format);
				const parsed = parseSpectrumFile(new TextEncoder().encode(file.body as string), file.filename);
				expect(parsed.ok).toBe(true);
				if (!parsed.ok) return;
				const n = normaliseSpectrum(parsed.value[0]);
				expect(n.ok).toBe(true);
				if (!n.ok) return;
				const stored = spectrumData(row, null);
				expect(n.value.kind).toBe(stored.kind);
				expect(n.value.yUnit).toBe(stored.yUnit);
				expect(n.value.x.length).toBe(stored.x.length);
				// JCAMP-DX 4.24 XYDATA are integers × YFACTOR: the error is bounded relative to the largest |y|
				// (14 significant digits of the maximum here), not relative to each point.
				const yMax = stored.y.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
				for (let i = 0; i < stored.x.length; i++) {
					expect(Math.abs(n.value.x[i] - stored.x[i])).toBeLessThanOrEqual(1e-9 * Math.abs(stored.x[i]));
					expect(Math.abs(n.value.y[i] - stored.y[i])).toBeLessThanOrEqual(1e-9 * Math.max(format === 'jcamp' ? yMax : Math.abs(stored.y[i]), 1e-300));
				}
			}
		});
	}
});
