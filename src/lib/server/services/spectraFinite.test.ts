/**
 * The store's guard: no NaN or Infinity ever reaches the database. Input: the THF LINK file of
 * ../shared/external/jcamp (cheminfo/jcampconverter test data, MANIFEST.md) prepared as an upload, then one value
 * poisoned by hand; the store must refuse with 422 before it opens a transaction.
 */
import type { Knex } from 'knex';
import { describe, expect, it } from 'vitest';
import { readExternal } from '../../spectra/__fixtures__/external';
import { ApiError } from '../http';
import { assertFiniteSpectra } from './spectraFinite';
import { prepareSpectra } from './spectraPrepare';
import { storeSpectra } from './spectraStore';

const prepared = () => prepareSpectra(readExternal('jcamp/uv-vis-thf-link-absorbance-plus-variance.jdx'), 'thf.jdx', {});
const noDb = { transaction: () => { throw new Error('the store opened a transaction'); } } as unknown as Knex;

describe('assertFiniteSpectra', () => {
	it('passes a real upload', () => {
		expect(() => assertFiniteSpectra(prepared().spectra, 'thf.jdx')).not.toThrow();
	});
	it.each([
		['y (normalised)', (s: ReturnType<typeof prepared>['spectra'][0]) => (s.norm.y[10] = NaN)],
		['wavelength (nm)', (s: ReturnType<typeof prepared>['spectra'][0]) => (s.norm.x[0] = -Infinity)],
		['y (file)', (s: ReturnType<typeof prepared>['spectra'][0]) => (s.raw.y[3] = Infinity)],
		['lambdaMaxNm', (s: ReturnType<typeof prepared>['spectra'][0]) => (s.derived.lambdaMaxNm = NaN)],
		['search vector', (s: ReturnType<typeof prepared>['spectra'][0]) => (s.derived.searchVector[5] = NaN)]
	])('refuses a non-finite %s with 422 and writes nothing', async (field, poison) => {
		const p = prepared();
		poison(p.spectra[0]);
		const err = await storeSpectra(noDb, { groupId: 1, ownerId: 'u', bytes: new Uint8Array([1]), filename: 'thf.jdx', meta: {}, spectra: p.spectra, warnings: [] }).catch((e) => e);
		expect(err).toBeInstanceOf(ApiError);
		expect(err.status).toBe(422);
		expect(err.extra.field).toBe(field);
		expect(err.message).toMatch(/nothing was stored/);
	});
});
