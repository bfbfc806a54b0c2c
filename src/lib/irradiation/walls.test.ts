import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { findWallMaterial } from './data/materials';
import { edgeModelParameters } from './materialEdgeModel';
import { fresnelReflectance, transmissionCutoffNm, wallCutoffsNm, wallTransmission, wallTransmissionOnGrid, type MeasuredMaterial } from './walls';

const material = (id: string) => {
	const m = findWallMaterial(id);
	if (!m) throw new Error(id);
	return m.definition;
};

describe('Fresnel reflectance R = ((n − 1)/(n + 1))²', () => {
	// Reference table §2.1 [computed]: R(fused silica, n 1.458) = 3.47 %, (1 − R)² = 93.2 %; R(sapphire 1.768) = 7.70 %.
	it('matches the computed values', () => {
		expect(fresnelReflectance(1.458)).toBeCloseTo(0.0347, 4);
		expect((1 - fresnelReflectance(1.458)) ** 2).toBeCloseTo(0.932, 3);
		expect(fresnelReflectance(1.768)).toBeCloseTo(0.077, 3);
		// water/material (n 1.333): fused silica 0.20 %.
		expect(fresnelReflectance(1.458, 1.333)).toBeCloseTo(0.002, 3);
	});
});

describe('measured curve rescaled to another thickness', () => {
	// File: aphalo/photobiologyFilters data-raw/Petri_dishes/glass_nn.csv (GPL test data, read only here);
	// MANIFEST: %T(300) = 9.01. Thickness not stated: d₀ = 2 mm assumed, n = 1.52 assumed.
	const csv = fs.readFileSync(path.resolve(process.cwd(), '../shared/external/transmission/glass-petri-dish.csv'), 'utf8');
	const rows = csv.trim().split(/\r?\n/).slice(1).map((l) => l.split(',').map(Number));
	const dish: MeasuredMaterial = { model: 'measured', wavelengthNm: rows.map((r) => r[0]), transmittance: rows.map((r) => r[1] / 100), thicknessMm: 2, n: 1.52 };

	it('reads T₀(300) = 0.0901', () => {
		expect(wallTransmission(dish, 2, 300)).toBeCloseTo(0.0901, 4);
	});

	it('follows Beer–Lambert on the internal part with the Fresnel factor (hand calculation)', () => {
		// By hand, with the file's T₀(300) = 0.0900611: R = (0.52/2.52)² = 0.042580; F = (1 − R)² = 0.916653;
		// internal T₀ = 0.0900611/F = 0.098250; at 4 mm: F·0.098250² = 0.0088485; at 1 mm: F·√0.098250 = 0.28732.
		expect(Math.abs(wallTransmission(dish, 4, 300) - 0.0088485)).toBeLessThan(1e-6);
		expect(Math.abs(wallTransmission(dish, 1, 300) - 0.28732)).toBeLessThan(1e-5);
	});
});

describe('k-table walls: T = (1 − R)²·exp(−4πk·d/λ)', () => {
	it('soda-lime slide, 1 mm: Fresnel × MANIFEST internal T(300 nm) = 0.554', () => {
		// MANIFEST (soda-lime-slide-kamptner-2024.yml): internal T(1 mm, 300) = 0.554; n = 1.52222.
		const f = (1 - fresnelReflectance(1.52222)) ** 2;
		expect(Math.abs(wallTransmission(material('soda-lime-slide'), 1, 300) - 0.554 * f)).toBeLessThan(0.005);
	});

	it('common practice: borosilicate 3.3 tubing of 1.5–2.5 mm blocks < 10 % below ≈ 275–280 nm and passes 365 nm > 85 %', () => {
		for (const d of [1.5, 2, 2.5]) {
			expect(wallTransmission(material('borosilicate-3.3-tubing'), d, 275)).toBeLessThan(0.1);
			expect(wallTransmission(material('borosilicate-3.3-tubing'), d, 254)).toBeLessThan(0.01);
			expect(wallTransmission(material('borosilicate-3.3-tubing'), d, 365)).toBeGreaterThan(0.85);
		}
	});

	it('borosilicate 3.3 float sheet, 3.3 mm: cut-offs near the computed 275 / 292 nm (internal)', () => {
		// Reference table §2.3 [computed, internal T]: λ(10 %) = 275, λ(50 %) = 292 nm; Fresnel loss moves them up ≈ 1 nm.
		const c = wallCutoffsNm(material('borosilicate-3.3-sheet'), 3.3);
		expect(Math.abs((c.cutoff10Nm ?? 0) - 275)).toBeLessThan(2);
		expect(Math.abs((c.cutoff50Nm ?? 0) - 292)).toBeLessThan(2);
	});

	it('vector form equals the scalar form', () => {
		const grid = wallTransmissionOnGrid(material('borosilicate-3.3-sheet'), 2, 250, 0.5, 101);
		for (let i = 0; i < grid.length; i += 10) expect(grid[i]).toBeCloseTo(wallTransmission(material('borosilicate-3.3-sheet'), 2, 250 + i * 0.5), 12);
	});

	it('refuses bad thickness with a RangeError naming the field', () => {
		expect(() => wallTransmission(material('soda-lime-slide'), -1, 300)).toThrow(/thicknessMm/);
	});
});

describe('edge model and cut-offs', () => {
	it('reproduces its own 10 % / 50 % edges at the stated thickness and moves them with thickness', () => {
		// Definition check (model construction): T(λ10, d₀) = 0.1, T(λ50, d₀) = 0.5.
		const pmma = material('pmma-standard');
		expect(wallTransmission(pmma, 3, 375)).toBeCloseTo(0.1, 6);
		expect(wallTransmission(pmma, 3, 390)).toBeCloseTo(0.5, 6);
		expect(wallCutoffsNm(pmma, 6).cutoff50Nm!).toBeGreaterThan(390);
		expect(wallTransmission(pmma, 3, 700)).toBeCloseTo((1 - fresnelReflectance(pmma.n)) ** 2, 4);
	});

	it('rejects an impossible edge', () => {
		expect(() => edgeModelParameters({ model: 'edge', edge10Nm: 300, edge50Nm: 290, atThicknessMm: 1, n: 1.5 })).toThrow(/edge50Nm/);
	});

	it('transmissionCutoffNm interpolates linearly and reports never/always', () => {
		expect(transmissionCutoffNm([300, 310, 320], [0, 0.2, 0.9], 0.1)).toBeCloseTo(305, 10);
		expect(transmissionCutoffNm([300, 310], [0.5, 0.05], 0.1)).toBeNull();
		expect(transmissionCutoffNm([300, 310], [0.5, 0.6], 0.1)).toBe(300);
	});
});
