/**
 * Delimited-text uploads through the service the API uses, against the real MariaDB: the csv-variety sample
 * (../shared/external/csv-variety, outcomes from its MANIFEST.md rows), a kinetics table stored as a time series
 * (block_time_s + block_label, file order), reflectance stored as its own kind, refusals that write nothing, and
 * an n, k table added as a wall material. Invented tables are written here (an invented dye series).
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '../../src/lib/server/db/index';
import { findSpectrumById } from '../../src/lib/server/db/spectra';
import { getWallMaterial } from '../../src/lib/server/db/wallMaterials';
import { addWallMaterialFromOpticalConstants } from '../../src/lib/server/services/wallFromOpticalConstants';
import { wallTransmission } from '../../src/lib/irradiation/walls';
import { apiFailure, external, localsOf, resetSpectraWorld, rowCounts, upload, uploadPath } from './spectraTestKit';

let groupA = 0;
beforeAll(async () => ({ groupA } = await resetSpectraWorld()));
afterAll(closeDb);

const run = Date.now().toString(36);

describe('csv-variety through the upload service (MANIFEST.md)', () => {
	it('absorbance-key-value-header.txt: one absorption spectrum in absorbance, 1801 points, the instrument from the header', async () => {
		const r = await uploadPath('member', external('csv-variety/absorbance-key-value-header.txt'));
		expect(r.items).toHaveLength(1);
		expect([r.items[0].kind, r.items[0].pointCount]).toEqual(['absorption', 1801]);
		const row = (await findSpectrumById(r.items[0].id))!;
		expect([row.y_unit, row.x_unit_original]).toEqual(['absorbance', 'nm']);
	});
	it('solar-am0-micrometres-w-per-m2-per-um.csv: two emission spectra in W m⁻² nm⁻¹; E-490 max 2.144 at 450.5 nm', async () => {
		const r = await uploadPath('member', external('csv-variety/solar-am0-micrometres-w-per-m2-per-um.csv'));
		expect(r.items).toHaveLength(2);
		expect(r.items[0].lambdaMaxNm).toBeCloseTo(450.5, 6);
		expect(r.items[0].valueAtMax).toBeCloseTo(2.144, 9);
		expect(r.items.every((s) => s.kind === 'emission')).toBe(true);
	});
	it('optical-constants-n-k-not-a-spectrum.csv: 415 with the reason, nothing written', async () => {
		const before = await rowCounts();
		const e = await apiFailure(uploadPath('member', external('csv-variety/optical-constants-n-k-not-a-spectrum.csv')));
		expect(e.status).toBe(415);
		expect(e.message).toMatch(/^optical-constants-n-k-not-a-spectrum\.csv: the columns "n" and "k" are optical constants/);
		expect(e.message.match(/optical-constants-n-k-not-a-spectrum\.csv/g)).toHaveLength(1); // the file name once
		expect(await rowCounts()).toEqual(before);
	});
	it('every refractive-index YAML of ../shared/external/materials: 415 optical constants naming the DATA line, nothing written', async () => {
		// MANIFEST.md: refractiveindex.info database files (tabulated n, k and dispersion formulas), not spectra —
		// read as a table, four of them used to pass for "absorbance" curves
		const before = await rowCounts();
		const dir = external('materials');
		const files = readdirSync(dir).filter((f) => f.endsWith('.yml'));
		expect(files.length).toBeGreaterThanOrEqual(13);
		for (const f of files) {
			const e = await apiFailure(uploadPath('member', path.join(dir, f)));
			expect(e.status, f).toBe(415);
			expect(e.message, f).toMatch(/a refractive-index data file \(YAML, DATA of type "(tabulated (nk|n|k)|formula \d)".*\): optical constants .*add the material as a wall from its n, k data/);
			const dataLine = readFileSync(path.join(dir, f), 'utf8').split('\n').findIndex((l) => /^DATA\s*:/.test(l)) + 1;
			expect(e.extra.line, f).toBe(dataLine);
		}
		expect(await rowCounts()).toEqual(before);
	});
	it('absorbance-comma-control.txt: 821 points, max 0.2349 at 441.5 nm', async () => {
		const r = await uploadPath('member', external('csv-variety/absorbance-comma-control.txt'));
		expect([r.items[0].pointCount, r.items[0].lambdaMaxNm, r.items[0].valueAtMax]).toEqual([821, 441.5, 0.2349]);
	});
});

describe('a kinetics table is stored as a time series', () => {
	it('35 rows under a row of 911 wavelengths → 35 spectra with block_time_s in seconds and the row label, in file order', async () => {
		const wl = Array.from({ length: 911 }, (_, i) => 190 + i);
		const rows = [['Time (min)', ...wl].join(',')];
		for (let k = 0; k < 35; k++) rows.push([k / 2, ...wl.map((nm) => (0.5 * Math.exp(-k / 10) * Math.exp(-(((nm - 450) / 30) ** 2) / 2) + 0.01).toFixed(5))].join(','));
		const r = await upload('member', `dye-fade-${run}.csv`, rows.join('\n'), { name: `Dye fade ${run}` });
		expect(r.items).toHaveLength(35);
		const stored = await db()('spectra').whereIn('id', r.items.map((s) => s.id)).orderBy('block_index').select('block_index', 'block_label', 'block_time_s', 'name', 'kind');
		expect(stored.map((s) => s.block_time_s)).toEqual(Array.from({ length: 35 }, (_, k) => k * 30));
		expect(stored.map((s) => s.block_index)).toEqual(Array.from({ length: 35 }, (_, k) => k));
		expect(stored[3]).toMatchObject({ block_label: 't = 1.5 min', kind: 'absorption', name: `Dye fade ${run} — t = 1.5 min` });
	});
});

describe('kinds and refusals', () => {
	it('%R is stored as reflectance (never absorbance)', async () => {
		const text = ['Wavelength (nm),%R', ...Array.from({ length: 50 }, (_, i) => `${400 + 4 * i},${(20 + i).toFixed(1)}`)].join('\n');
		const r = await upload('member', `pigment-${run}.csv`, text);
		expect(r.items[0].kind).toBe('reflectance');
		const row = (await findSpectrumById(r.items[0].id))!;
		expect(row.y_unit).toBe('reflectance');
	});
	it('%T without a header is refused with 422 naming the column and line; the preview still shows the table', async () => {
		const text = Array.from({ length: 20 }, (_, i) => `${400 + 5 * i},${(30 + 3 * i).toFixed(1)}`).join('\n');
		const before = await rowCounts();
		const e = await apiFailure(upload('member', `filter-${run}.csv`, text));
		expect(e.status).toBe(422);
		expect(e.message).toMatch(/column 2: values up to 87 \(line 20\) cannot be absorbance/);
		expect(e.extra.line).toBe(20);
		expect(await rowCounts()).toEqual(before);
		const p = await apiFailure(upload('member', `filter-${run}.csv`, text, {}, true));
		expect((p.extra.table as { layout: string }).layout).toBe('columns');
		const ok = await upload('member', `filter-${run}.csv`, text, { yUnit: 'transmittance-percent' });
		expect(ok.items[0].kind).toBe('transmission');
	});
	it('a time–concentration table is 415 with the reason', async () => {
		const e = await apiFailure(upload('member', `decay-${run}.csv`, 'Time (s),Concentration (mM)\n0,1.0\n10,0.8\n20,0.6\n30,0.5\n40,0.4\n50,0.3\n'));
		expect(e.status).toBe(415);
		expect(e.message).toContain('time table, not an optical spectrum');
	});
});

describe('refractive-index database YAML → wall material', () => {
	const add = (file: string, name: string) => {
		const fd = new FormData();
		fd.append('file', new File([readFileSync(external(`materials/${file}`))], file));
		fd.append('name', `${name} ${run}`);
		fd.append('thicknessMm', '1');
		return addWallMaterialFromOpticalConstants(localsOf('member'), fd);
	};
	it('borosilicate 3.3 float sheet (Sellmeier n, tabulated k): the internal transmission of 1 mm given in MANIFEST.md', async () => {
		const m = await add('borosilicate-3.3-float-sheet-nk.yml', 'Borosilicate 3.3 sheet (YAML)');
		// MANIFEST.md: n(589.3) = 1.47143
		expect(m.refractiveIndex).toBeCloseTo(1.47143, 4);
		const stored = (await getWallMaterial(m.id, [groupA]))!;
		const R = ((m.refractiveIndex - 1) / (m.refractiveIndex + 1)) ** 2;
		// MANIFEST.md: internal T(1 mm) 0.148 at 254 nm, 0.894 at 300 nm, 0.9986 at 365 nm; the wall adds (1 − R)² for the two faces
		for (const [nm, internal] of [[254, 0.148], [300, 0.894], [365, 0.9986]]) expect(wallTransmission(stored.model, 1, nm) / (1 - R) ** 2).toBeCloseTo(internal, 2);
		expect(m.warnings).toEqual([]);
		await db()('wall_materials').where({ id: m.id }).delete();
	});
	it('n only (fused silica, Malitson) is 422 naming the file: a wall needs k; negative k (alumina) is refused; nothing is written', async () => {
		const before = Number((await db()('wall_materials').count({ n: '*' }))[0].n);
		const noK = await apiFailure(add('fused-silica-n-malitson-1965.yml', 'Fused silica n only'));
		expect([noK.status, noK.extra.field]).toEqual([422, 'file']);
		expect(noK.message).toMatch(/refractive index n only, no extinction coefficient k/);
		const negative = await apiFailure(add('alumina-querry-negative-k-trap.yml', 'Alumina negative k'));
		expect(negative.status).toBeGreaterThanOrEqual(400);
		expect(negative.message).toMatch(/k = -?[\d.e-]+ at .* nm is negative/);
		expect(Number((await db()('wall_materials').count({ n: '*' }))[0].n)).toBe(before);
	});
	it('a model whose UV k is far too high for a bulk window is added with the plausibility warning (MANIFEST.md: a trap)', async () => {
		const m = await add('silica-franta-25c-not-a-window.yml', 'Silica model (not a window)');
		expect(m.warnings.map((w) => w.code)).toContain('implausible_window');
		await db()('wall_materials').where({ id: m.id }).delete();
	});
});

describe('n, k table → wall material', () => {
	it('adds a tabulated-k wall in the caller’s group; 1 mm at 250 nm transmits (1 − R)²·exp(−4πkd/λ)', async () => {
		const fd = new FormData();
		fd.append('file', new File([readFileSync(external('csv-variety/optical-constants-n-k-not-a-spectrum.csv'))], 'soda-lime-nk.csv'));
		fd.append('name', `Soda-lime sheet ${run}`);
		fd.append('thicknessMm', '2');
		const m = await addWallMaterialFromOpticalConstants(localsOf('member'), fd);
		expect(m.groupId).toBe(groupA);
		expect(m.points).toBe(146);
		const stored = (await getWallMaterial(m.id, [groupA]))!;
		expect(stored.model.model).toBe('k');
		// file line 2: 0.25 µm, k = 5.97e-6: exp(−4π·5.97e-6·1e6/250) = 0.7408; (1 − R)² with n at 589.3 nm (≈1.52): R ≈ 0.0426
		const n = m.refractiveIndex;
		const expected = (1 - ((n - 1) / (n + 1)) ** 2) ** 2 * Math.exp((-4 * Math.PI * 5.97e-6 * 1e6) / 250);
		expect(wallTransmission(stored.model, 1, 250)).toBeCloseTo(expected, 6);
		await db()('wall_materials').where({ id: m.id }).delete();
	});
	it('bad thickness is 422 naming the field, and nothing is written', async () => {
		const fd = new FormData();
		fd.append('file', new File([readFileSync(external('csv-variety/optical-constants-n-k-not-a-spectrum.csv'))], 'nk.csv'));
		fd.append('name', 'x');
		fd.append('thicknessMm', '-1');
		const before = Number((await db()('wall_materials').count({ n: '*' }))[0].n);
		const e = await apiFailure(addWallMaterialFromOpticalConstants(localsOf('member'), fd));
		expect([e.status, e.extra.field]).toEqual([422, 'thicknessMm']);
		expect(Number((await db()('wall_materials').count({ n: '*' }))[0].n)).toBe(before);
	});
});
