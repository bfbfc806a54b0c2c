/**
 * Derived values through the upload service and the API view: the longest-wavelength band and the stretches left
 * out, on real files from ../shared/external (check values: MANIFEST.md, computed there by an independent script),
 * and shape similarity with its overlap length (invented Gaussian test bands).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/index';
import { similarSpectra } from '../../src/lib/server/services/spectraSimilar';
import { csvOf, external, gauss, localsOf, resetSpectraWorld, upload, uploadPath } from './spectraTestKit';

beforeAll(async () => {
	await resetSpectraWorld();
});
afterAll(closeDb);

describe('longest-wavelength band through the upload service', () => {
	it('THF dye file (cheminfo/jcampconverter uv.jdx): longestWavelengthBandNm 541 nm, A 0.312; cut-off noise listed from 190 nm', async () => {
		const r = await uploadPath('member', external('jcamp/uv-vis-thf-link-absorbance-plus-variance.jdx'));
		const s = r.items[0];
		expect(Math.abs(s.longestWavelengthBandNm! - 541)).toBeLessThanOrEqual(1);
		expect(s.longestWavelengthBand).toMatchObject({ saturated: false });
		expect((s.longestWavelengthBand as { absorbance: number }).absorbance).toBeCloseTo(0.312, 3);
		// MANIFEST: "below ~230 nm noise (solvent cut-off)"
		expect(s.excludedRanges[0]).toMatchObject({ fromNm: 190, reason: 'noise' });
		expect(r.warnings.some((w) => w.code === 'noisy_short_end')).toBe(true);
	});
	it('cobalt aquation, 5 blocks (nzhagen/jcamp blckpac1.jdx): longest band of every block is the d–d band, 614 → 596 nm', async () => {
		const r = await uploadPath('member', external('jcamp/cobalt-aquation-kinetics-5-blocks.jdx'));
		const expected = [614, 608, 606, 602, 596]; // MANIFEST
		r.items.forEach((s, i) => expect(Math.abs(s.longestWavelengthBandNm! - expected[i])).toBeLessThanOrEqual(2));
	});
});

describe('similar spectra', () => {
	it('answers the overlap in nm and leaves a saturated solvent edge out of the score', async () => {
		const band = (c: number, edgeNm: number) => (x: number) => Math.min(3.6, gauss(x, c, 18, 0.8) + 10 ** ((edgeNm - x) / 10));
		const a = (await upload('member', 'sim-a.csv', csvOf('wavelength (nm),absorbance', band(420, 190), 190, 800), { name: 'Sim band' })).items[0];
		const b = (await upload('member', 'sim-b.csv', csvOf('wavelength (nm),absorbance', band(420, 265), 190, 800), { name: 'Sim band, solvent edge' })).items[0];
		const c = (await upload('member', 'sim-c.csv', csvOf('wavelength (nm),absorbance', band(470, 190), 190, 800), { name: 'Sim band 50 nm away' })).items[0];
		const out = await similarSpectra(localsOf('member2'), String(a.id), '10');
		const byId = new Map(out.items.map((s) => [s.id, s]));
		expect(byId.get(b.id)!.similarity).toBeGreaterThan(0.9);
		expect(byId.get(c.id)!.similarity).toBeLessThan(0.5);
		expect(byId.get(b.id)!.overlapNm).toBeGreaterThan(100);
	});
});
