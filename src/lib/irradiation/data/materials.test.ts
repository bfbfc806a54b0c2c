import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseRefractiveIndexYaml } from '../refractiveIndexYaml';
import { fresnelReflectance, wallTransmission } from '../walls';
import { WALL_MATERIALS, findWallMaterial } from './materials';

describe('wall material data', () => {
	it('has unique slug ids, a source, a status, n and a typical thickness', () => {
		expect(new Set(WALL_MATERIALS.map((m) => m.id)).size).toBe(WALL_MATERIALS.length);
		for (const m of WALL_MATERIALS) {
			expect(m.id).toMatch(/^[a-z0-9.-]+$/);
			expect(m.source.length).toBeGreaterThan(10);
			expect(m.n).toBeGreaterThan(1.2);
			expect(m.typicalThicknessMm).toBeGreaterThan(0);
			expect(m.definition.n).toBe(m.n);
		}
		for (const id of ['fused-silica-uv-grade', 'borosilicate-3.3-sheet', 'borosilicate-3.3-tubing', 'soda-lime-window', 'sapphire', 'pmma-standard', 'pmma-uv-transmitting', 'polycarbonate', 'polystyrene', 'fep', 'pfa']) {
			expect(findWallMaterial(id), id).toBeDefined();
		}
	});

	it('names no brand from the source file paths (product rule: generic names only)', () => {
		// The forbidden names are read from ../shared/external/MANIFEST.md (vendor folders and file names of the
		// data origins) so that this repository never spells them out.
		const manifest = fs.readFileSync(path.resolve(process.cwd(), '../shared/external/MANIFEST.md'), 'utf8');
		const names = new Set<string>();
		for (const m of manifest.matchAll(/specs\/([\w-]+)\/\w+\/([\w.-]+)\.yml/g)) {
			names.add(m[1].toLowerCase());
			if (!m[2].includes('_')) names.add(m[2].toLowerCase().replace(/\d+$/, ''));
		}
		for (const m of manifest.matchAll(/data-raw[\w-]*\/([A-Z][A-Za-z]+)\//g)) if (!/^Petri/.test(m[1])) names.add(m[1].toLowerCase());
		for (const m of manifest.matchAll(/_lamps\/([A-Z][\w]*-[A-Z][a-z]+)_/g)) names.add(m[1].toLowerCase());
		expect(names.size).toBeGreaterThanOrEqual(6);
		const dir = path.resolve(process.cwd(), 'src/lib/irradiation');
		const files = ['data/materials.ts', 'data/materialTables.ts', 'data/solvents.ts', 'mercuryLines.ts', 'lampModels/lineSources.ts', 'lampModels/broadband.ts', 'refractiveIndexYaml.ts', 'cautions.ts'];
		const text = files.map((f) => fs.readFileSync(path.join(dir, f), 'utf8')).join('\n').toLowerCase();
		for (const name of names) expect(text.includes(name), 'a brand name from the source paths').toBe(false);
	});

	it('the generated k tables reproduce the source YAML within 0.005 in internal T', () => {
		// Source files: refractiveindex.info database (CC0) copies in ../shared/external/materials (MANIFEST.md).
		const cases: [string, string, number, number][] = [
			['soda-lime-slide', 'soda-lime-slide-kamptner-2024.yml', 1, 300],
			['soda-lime-slide', 'soda-lime-slide-kamptner-2024.yml', 1, 254],
			['fused-silica-uv-grade', 'fused-silica-uv-grade-nk.yml', 1, 254],
			['soda-lime-window', 'soda-lime-window-clear-rubin-1985.yml', 1, 365],
			['borosilicate-3.3-tubing', 'borosilicate-3.3-lab-tubing-k.yml', 2, 300],
			['borosilicate-3.3-sheet', 'borosilicate-3.3-float-sheet-nk.yml', 2, 285.5]
		];
		for (const [id, file, d, nm] of cases) {
			const r = parseRefractiveIndexYaml(fs.readFileSync(path.resolve(process.cwd(), '../shared/external/materials', file), 'utf8'));
			if (!r.ok) throw new Error(file);
			const expected = Math.exp((-4 * Math.PI * r.value.k(nm) * d * 1e6) / nm);
			const m = findWallMaterial(id)!;
			const internal = wallTransmission(m.definition, d, nm) / (1 - fresnelReflectance(m.n)) ** 2;
			expect(Math.abs(internal - expected), `${id} ${nm}`).toBeLessThan(0.005);
		}
	});

	it('n values: MANIFEST check values at 589.3 nm', () => {
		// MANIFEST.md: UV-grade silica 1.45848, sapphire 1.76808, PMMA 1.49052, PC 1.58458, PS 1.59145.
		const expected: Record<string, number> = { 'fused-silica-uv-grade': 1.45848, sapphire: 1.76808, 'pmma-standard': 1.49052, polycarbonate: 1.58458, polystyrene: 1.59145 };
		for (const [id, n] of Object.entries(expected)) expect(Math.abs(findWallMaterial(id)!.n - n), id).toBeLessThan(1e-4);
	});
});
