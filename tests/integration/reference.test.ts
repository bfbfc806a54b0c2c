/**
 * Reference data as seeded into MariaDB (seeds/02_reference.ts) and served by the services behind
 * /api/solvents and /api/materials/:id/transmission. Runs against the real test database.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '$lib/server/db';
import { listSolvents } from '$lib/server/db/solvents';
import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { searchSolvents } from '$lib/server/services/solventSearch';
import { parseThicknessMm, wallTransmissionCurve } from '$lib/server/services/wallTransmission';

afterAll(() => closeDb());

describe('seeded solvents', () => {
	it('holds at least 35 solvents, each with its cut-off, source and status', async () => {
		const all = await listSolvents();
		expect(all.length).toBeGreaterThanOrEqual(35);
		for (const s of all) {
			expect(s.cutoffNm).toBeGreaterThanOrEqual(185);
			expect(s.source.length).toBeGreaterThan(5);
			expect(['verified', 'from memory', 'common practice', 'estimate']).toContain(s.status);
		}
	});

	it('serves the handbook cut-offs', async () => {
		const byName = new Map((await listSolvents()).map((s) => [s.slug, s]));
		// Sadek, Illustrated Pocket Dictionary of Chromatography (Wiley 2004), entry "chloroform": 245 nm [verified in REFERENCE.md §1]
		expect(byName.get('chloroform')).toMatchObject({ cutoffNm: 245, status: 'verified' });
		// Sadek 2004, entry "ethyl ether": 215 nm [verified]
		expect(byName.get('diethyl-ether')?.cutoffNm).toBe(215);
		// Merck Index monograph: spectro-grade THF cut-off 220 nm [verified]
		expect(byName.get('tetrahydrofuran')?.cutoffNm).toBe(220);
		// common practice (supplier guide, ±5 nm): acetonitrile ≈ 190 nm, acetone ≈ 330 nm
		expect(Math.abs(byName.get('acetonitrile')!.cutoffNm - 190)).toBeLessThanOrEqual(5);
		expect(Math.abs(byName.get('acetone')!.cutoffNm - 330)).toBeLessThanOrEqual(5);
	});

	it('finds acetonitrile by typing "aceto", and by its abbreviation', async () => {
		const all = await listSolvents();
		expect(searchSolvents(all, 'aceto').map((s) => s.slug)).toContain('acetonitrile');
		expect(searchSolvents(all, 'MeCN')[0].slug).toBe('acetonitrile');
	});
});

describe('seeded wall materials', () => {
	it('covers the materials a photochemist uses, each with a source', async () => {
		const slugs = (await listWallMaterials()).map((m) => m.slug);
		for (const want of ['fused-silica-uv-grade', 'fused-quartz-ordinary', 'borosilicate-3.3-sheet', 'borosilicate-3.3-tubing', 'borosilicate-crown', 'soda-lime-window', 'sapphire', 'pmma-standard', 'pmma-uv-transmitting', 'polycarbonate', 'polystyrene', 'fep', 'pfa']) {
			expect(slugs).toContain(want);
		}
	});

	it('2.0 mm borosilicate 3.3 tubing: T(300 nm) from the k table with Fresnel loss, 10 % cut-off near 290 nm', async () => {
		const tubing = (await listWallMaterials()).find((m) => m.slug === 'borosilicate-3.3-tubing')!;
		const curve = wallTransmissionCurve(tubing, parseThicknessMm('2', tubing));
		const t300 = curve.y[curve.x.indexOf(300)];
		// REFERENCE.md §2.3 [computed from the dataset k]: internal T(2 mm, 300 nm) = 0.30; two air faces with
		// n ≈ 1.47 lose (1 − R)² ≈ 0.928 (§2.1) → total ≈ 0.28
		expect(t300).toBeGreaterThan(0.25);
		expect(t300).toBeLessThan(0.31);
		// REFERENCE.md §2.3: λ(T_int = 10 %) = 291 nm for 2 mm tubing; with Fresnel loss the total crosses 10 % a little later
		expect(curve.cutoff10Nm!).toBeGreaterThan(288);
		expect(curve.cutoff10Nm!).toBeLessThan(297);
	});

	it('refuses a thickness that is not a positive number', async () => {
		const any = (await listWallMaterials())[0];
		expect(() => parseThicknessMm('abc', any)).toThrow(/thicknessMm/);
		expect(() => parseThicknessMm('-1', any)).toThrow(/thicknessMm/);
	});
});
