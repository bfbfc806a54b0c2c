/**
 * Upload through the service the API uses, against the real MariaDB: real third-party files from
 * ../shared/external (expected values from ../shared/external/MANIFEST.md, computed there from each
 * file by an independent script; tolerance ±1 sampling step for λ), duplicates and bad files.
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/index';
import { findSpectrumById, withFileBytes } from '../../src/lib/server/db/spectra';
import { spectrumData } from '../../src/lib/server/services/spectraExport';
import { uploadSpectrumFile } from '../../src/lib/server/services/spectraUpload';
import { apiFailure, external, fixture, localsOf, resetSpectraWorld, rowCounts, upload, uploadPath } from './spectraTestKit';

beforeAll(resetSpectraWorld);
afterAll(closeDb);

/** Value of the stored normalised data at wavelength w (exact sample). */
async function valueAt(id: number, w: number) {
	const d = spectrumData((await findSpectrumById(id))!, null);
	return d.y[d.x.findIndex((x) => Math.abs(x - w) < 1e-9)];
}

describe('real instrument exports (MANIFEST.md)', () => {
	it('THF LINK file: keeps the absorbance block, drops the variance block, λmax 541 nm A 0.312', async () => {
		// source: cheminfo/jcampconverter __tests__/data/misc/uv.jdx, values from MANIFEST.md
		const r = await uploadPath('member', external('jcamp/uv-vis-thf-link-absorbance-plus-variance.jdx'), { part: 'substrate' });
		expect(r.items).toHaveLength(1);
		const s = r.items[0];
		expect(s.pointCount).toBe(911);
		expect(s.lambdaMaxNm).toBeCloseTo(541, 0);
		expect(s.valueAtMax!).toBeCloseTo(0.312, 3);
		expect(await valueAt(s.id, 350)).toBeCloseTo(0.231, 3);
		expect(r.warnings.map((w) => w.code)).toContain('block_not_spectrum');
		const row = (await findSpectrumById(s.id))!;
		expect(row.file_sha256).toMatch(/^[0-9a-f]{64}$/);
		expect((await withFileBytes(row)).file_bytes.byteLength).toBe(readFileSync(external('jcamp/uv-vis-thf-link-absorbance-plus-variance.jdx')).byteLength);
		expect(row.search_vector.byteLength).toBe(911 * 4); // 190–1100 nm at 1 nm, Float32
	});

	it('UV file labelled as infrared 1/CM: read as nm with a clear warning, max 3.076 at 216 nm', async () => {
		// source: cheminfo/jcampconverter __tests__/data/misc/uv_ACD.jdx, values from MANIFEST.md
		const r = await uploadPath('member', external('jcamp/uv-mislabelled-as-infrared-1-per-cm.jdx'));
		expect(r.items).toHaveLength(1);
		expect(r.items[0].pointCount).toBe(881);
		expect(r.items[0].lambdaMaxNm!).toBeGreaterThanOrEqual(215.5);
		expect(r.items[0].lambdaMaxNm!).toBeLessThanOrEqual(217);
		expect(r.items[0].valueAtMax!).toBeCloseTo(3.076, 3);
		expect(r.warnings.some((w) => /units_contradict_data|data_type_mismatch/.test(w.code))).toBe(true);
	});

	it('cobalt kinetics, 5 blocks: 176 points each, d–d band 614 → 596 nm', async () => {
		// source: nzhagen/jcamp data/Robert_J_Lancashire_test_data/blckpac1.jdx, values from MANIFEST.md (DELTAX 2 nm)
		const r = await uploadPath('member', external('jcamp/cobalt-aquation-kinetics-5-blocks.jdx'));
		expect(r.items).toHaveLength(5);
		expect(r.items.every((s) => s.pointCount === 176)).toBe(true);
		const expected = [614, 608, 606, 602, 596];
		r.items.forEach((s, i) => expect(Math.abs(s.lambdaMaxNm! - expected[i])).toBeLessThanOrEqual(2));
		expect(r.items[0].valueAtMax!).toBeCloseTo(0.0632, 3);
		expect(r.items[4].valueAtMax!).toBeCloseTo(0.0534, 3);
		expect(await valueAt(r.items[0].id, 350)).toBeCloseTo(0.1934, 3);
	});

	it('cobalt kinetics, 20 blocks: 351 points each, band 610 → 594 nm over t1–t8, product band 505 nm at t20', async () => {
		// source: svn2github/JSSpecView dev2/JSpecView/data/aquation20.jdx, values from MANIFEST.md (DELTAX 1 nm)
		const r = await uploadPath('member', external('jcamp/cobalt-aquation-kinetics-20-blocks.jdx'));
		expect(r.items).toHaveLength(20);
		expect(r.items.every((s) => s.pointCount === 351)).toBe(true);
		const expected = [610, 608, 605, 606, 601, 599, 596, 594];
		expected.forEach((w, i) => expect(Math.abs(r.items[i].lambdaMaxNm! - w)).toBeLessThanOrEqual(1));
		expect(r.items[0].valueAtMax!).toBeCloseTo(0.0636, 3);
		expect(Math.abs(r.items[19].lambdaMaxNm! - 505)).toBeLessThanOrEqual(1);
		expect(r.items[19].valueAtMax!).toBeCloseTo(0.1215, 3);
		expect(await valueAt(r.items[0].id, 350)).toBeCloseTo(0.2027, 3);
		expect(await valueAt(r.items[19].id, 350)).toBeCloseTo(0.181, 3);
	});

	it('NIST nanoparticle CSV: 35 spectra of 551 points; column "4" 0.1832 at 388 nm, "140" 0.2643 at 389 nm', async () => {
		// source: usnistgov/NanoUV-VIS www/example-to-download.csv, values from MANIFEST.md
		const r = await uploadPath('member', external('csv/nanoparticle-growth-35-spectra-descending.csv'), { name: 'Nanoparticle growth' });
		expect(r.items).toHaveLength(35);
		expect(r.items.every((s) => s.pointCount === 551)).toBe(true);
		const first = r.items[0];
		const last = r.items[34];
		expect(first.name).toMatch(/4$/);
		expect(Math.abs(first.lambdaMaxNm! - 388)).toBeLessThanOrEqual(1);
		expect(first.valueAtMax!).toBeCloseTo(0.1832, 3);
		expect(Math.abs(last.lambdaMaxNm! - 389)).toBeLessThanOrEqual(1);
		expect(last.valueAtMax!).toBeCloseTo(0.2643, 3);
	});

	it('columns picks some CSV columns only', async () => {
		const text = readFileSync(external('csv/nanoparticle-growth-35-spectra-descending.csv'), 'utf8').replace(/\n$/, '\n\n');
		const r = await upload('member2', 'nanoparticle-subset.csv', text, { columns: [1, 35] });
		expect(r.items).toHaveLength(2);
	});

	it('PMMA sheet %T: cut-offs T 10 % at 369.0 nm and 50 % at 379.3 nm', async () => {
		// source: aphalo/photobiologyFilters data-raw/Plexiglas/Clear_0A000_XT.csv, values from MANIFEST.md
		const r = await uploadPath('member', external('transmission/pmma-clear-sheet.csv'), { part: 'wall', kind: 'transmission' });
		expect(r.items[0].kind).toBe('transmission');
		expect(r.items[0].cutoff10Nm!).toBeCloseTo(369.0, 0);
		expect(r.items[0].cutoff50Nm!).toBeCloseTo(379.3, 0);
	});
});

describe('refusals write nothing', () => {
	it('the same file again in the group → 409 naming the existing spectrum', async () => {
		const before = await rowCounts();
		const e = await apiFailure(uploadPath('member2', external('jcamp/uv-vis-thf-link-absorbance-plus-variance.jdx')));
		expect(e.status).toBe(409);
		expect(e.message).toMatch(/marstoja|already in the Library/);
		expect(e.extra.existingId).toBeGreaterThan(0);
		expect(await rowCounts()).toEqual(before);
	});

	it('the same file in another group is fine', async () => {
		const r = await uploadPath('outsider', external('jcamp/uv-vis-thf-link-absorbance-plus-variance.jdx'));
		expect(r.items).toHaveLength(1);
	});

	it('negative transmittance → 422 with the line number', async () => {
		const before = await rowCounts();
		const e = await apiFailure(uploadPath('member', fixture('bad-negative-transmittance.csv')));
		expect(e.status).toBe(422);
		expect(e.extra.line).toBe(4);
		expect(e.message).toMatch(/line 4/);
		expect(await rowCounts()).toEqual(before);
	});

	it('binary content → 415; prose → 415; an empty file → 415', async () => {
		const before = await rowCounts();
		expect((await apiFailure(upload('member', 'photo.png', new Uint8Array([137, 80, 78, 71, 13, 10, 26, 10, 0, 0, 0, 13])))).status).toBe(415);
		expect((await apiFailure(upload('member', 'notes.txt', 'Dear colleague,\nplease find the spectrum attached.\n')) ).status).toBe(415);
		expect((await apiFailure(upload('member', 'empty.csv', ''))).status).toBe(415);
		expect(await rowCounts()).toEqual(before);
	});

	it('a bad number in the data → 400 with its line; conflicting duplicate x → 422', async () => {
		const before = await rowCounts();
		const bad = await apiFailure(upload('member', 'typo.csv', 'wavelength (nm),absorbance\n300,0.1\n301,0.2\n302,0.3\n303,0.x4\n304,0.5\n305,0.6\n'));
		expect(bad.status).toBe(400);
		expect(bad.extra.line).toBe(5);
		const dup = await apiFailure(upload('member', 'dup.csv', 'wavelength (nm),absorbance\n300,0.1\n301,0.2\n301,0.3\n303,0.4\n304,0.5\n305,0.6\n'));
		expect(dup.status).toBe(422);
		expect(await rowCounts()).toEqual(before);
	});

	it('negative concentration → 422 naming the field; bad metadata JSON → 400; invalid CAS → 400', async () => {
		const before = await rowCounts();
		const e = await apiFailure(uploadPath('member', fixture('violet-ketone-absorbance.csv'), { concentrationM: -0.001, pathCm: 1 }));
		expect(e.status).toBe(422);
		expect(e.extra.field).toBe('concentrationM');
		const j = await apiFailure(uploadSpectrumFile(localsOf('member'), new File(['wavelength,absorbance\n'], 'x.csv'), '{"part": subs'));
		expect(j.status).toBe(400);
		expect(j.extra.field).toBe('metadata');
		const cas = await apiFailure(uploadPath('member', fixture('violet-ketone-absorbance.csv'), { cas: '50-00-1' }));
		// Check digit of formaldehyde's CAS RN 50-00-0 is 0 (CAS check-digit rule): 50-00-1 is invalid.
		expect(cas.status).toBe(400);
		expect(cas.extra.field).toBe('cas');
		expect(await rowCounts()).toEqual(before);
	});

	it('a file above UPLOAD_LIMIT_MB → 413', async () => {
		const old = process.env.UPLOAD_LIMIT_MB;
		process.env.UPLOAD_LIMIT_MB = '0.001';
		try {
			const e = await apiFailure(uploadPath('member', fixture('violet-ketone-absorbance.csv')));
			expect(e.status).toBe(413);
		} finally {
			if (old === undefined) delete process.env.UPLOAD_LIMIT_MB;
			else process.env.UPLOAD_LIMIT_MB = old;
		}
	});

	it('a viewer may not upload (403) and a preview stores nothing', async () => {
		const before = await rowCounts();
		expect((await apiFailure(uploadPath('viewer', fixture('violet-ketone-absorbance.csv')))).status).toBe(403);
		const p = (await upload('member', 'violet.csv', readFileSync(fixture('violet-ketone-absorbance.csv')), {}, true)) as unknown as { preview: { kind: string; pointCount: number }[] };
		expect(p.preview[0].kind).toBe('absorption');
		expect(p.preview[0].pointCount).toBe(451);
		expect(await rowCounts()).toEqual(before);
	});
});
