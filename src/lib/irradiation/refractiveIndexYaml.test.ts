import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseRefractiveIndexYaml, type OpticalConstants } from './refractiveIndexYaml';

// Files: refractiveindex.info database (CC0) copies in ../shared/external/materials; check values from its MANIFEST.md.
const read = (file: string) => fs.readFileSync(path.resolve(process.cwd(), '../shared/external/materials', file), 'utf8');
function load(file: string): OpticalConstants {
	const r = parseRefractiveIndexYaml(read(file));
	if (!r.ok) throw new Error(r.issues.map((i) => i.message).join('; '));
	return r.value;
}
/** Internal transmittance of a slab: T = exp(−4πk·d/λ) (MANIFEST convention). */
const internalT = (m: OpticalConstants, dMm: number, nm: number) => Math.exp((-4 * Math.PI * m.k(nm) * dMm * 1e6) / nm);

describe('parseRefractiveIndexYaml against MANIFEST check values', () => {
	it('fused silica, Malitson 1965 Sellmeier (formula 1)', () => {
		const m = load('fused-silica-n-malitson-1965.yml');
		expect(m.n(589.3)).toBeCloseTo(1.4584, 4);
		expect(Math.abs(m.n(365.0) - 1.47454)).toBeLessThan(1e-4);
		expect(Math.abs(m.n(253.7) - 1.50549)).toBeLessThan(1e-4);
		expect(m.kRangeNm).toBeNull();
		expect(m.references).toMatch(/Malitson/);
	});

	it('UV-grade fused silica (tabulated n + tabulated k)', () => {
		const r = parseRefractiveIndexYaml(read('fused-silica-uv-grade-nk.yml'));
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect(Math.abs(r.value.n(589.3) - 1.45848)).toBeLessThan(1e-4);
		expect(Math.abs(internalT(r.value, 1, 254) - 0.9988)).toBeLessThan(0.005);
		expect(Math.abs(internalT(r.value, 1, 365) - 0.9999)).toBeLessThan(0.005);
		// The file holds a few k ≈ −1e-9 (noise around zero): set to 0 with a warning, not refused.
		expect(r.warnings.map((w) => w.code)).toContain('negative_k_noise');
	});

	it('soda-lime slide, Kamptner 2024 (tabulated nk)', () => {
		const m = load('soda-lime-slide-kamptner-2024.yml');
		expect(Math.abs(m.n(589.3) - 1.52222)).toBeLessThan(1e-4);
		expect(Math.abs(internalT(m, 1, 300) - 0.554)).toBeLessThan(0.005);
		expect(Math.abs(internalT(m, 1, 254) - 0.0033)).toBeLessThan(0.005);
	});

	it('soda-lime window, Rubin 1985 (formula 5 + tabulated k)', () => {
		const m = load('soda-lime-window-clear-rubin-1985.yml');
		expect(Math.abs(m.n(589.3) - 1.52331)).toBeLessThan(1e-4);
		expect(Math.abs(internalT(m, 1, 365) - 0.984)).toBeLessThan(0.005);
	});

	it.each([
		['borosilicate-crown-optical-nk.yml', 1.51673], ['sapphire-ordinary-n-malitson-1962.yml', 1.76808], ['pmma-n-szczurowski.yml', 1.49052],
		['polycarbonate-n-sultanova.yml', 1.58458], ['polystyrene-n-sultanova.yml', 1.59145], ['borosilicate-3.3-float-sheet-nk.yml', 1.47143]
	])('%s: n(589.3 nm) = %f', (file, n) => {
		expect(Math.abs(load(file).n(589.3) - n)).toBeLessThan(1e-4);
	});

	it('sapphire n(253.7 nm) = 1.84216 and borosilicate crown T(1 mm, 300 nm) = 0.887', () => {
		expect(Math.abs(load('sapphire-ordinary-n-malitson-1962.yml').n(253.7) - 1.84216)).toBeLessThan(1e-4);
		expect(Math.abs(internalT(load('borosilicate-crown-optical-nk.yml'), 1, 300) - 0.887)).toBeLessThan(0.005);
	});

	it('refuses negative k (alumina trap file), naming wavelength and line', () => {
		const r = parseRefractiveIndexYaml(read('alumina-querry-negative-k-trap.yml'));
		expect(r.ok).toBe(false);
		if (r.ok) return;
		expect(r.issues[0].code).toBe('negative_k');
		expect(r.issues[0].message).toMatch(/210\.0 nm/);
		expect(r.issues[0].line).toBe(14);
		// MANIFEST: k(250) = −0.016 must be rejected.
		expect(r.issues.some((i) => /250\.0 nm/.test(i.message))).toBe(true);
	});

	it('flags the Franta silica model as implausible for a window (T(1 mm, 365) = 0.0088)', () => {
		const r = parseRefractiveIndexYaml(read('silica-franta-25c-not-a-window.yml'));
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect(r.warnings.map((w) => w.code)).toContain('implausible_window');
		expect(Math.abs(internalT(r.value, 1, 365) - 0.0088)).toBeLessThan(0.005);
	});

	it('returns issues, never throws, for broken input', () => {
		expect(parseRefractiveIndexYaml('DATA: [').ok).toBe(false);
		const bad = parseRefractiveIndexYaml('DATA:\n  - type: tabulated nk\n    data: |\n        0.3 1.5 x\n');
		expect(bad.ok).toBe(false);
		if (!bad.ok) expect(bad.issues[0].line).toBe(4);
		const unknown = parseRefractiveIndexYaml('DATA:\n  - type: formula 9\n    coefficients: 1 2\n    wavelength_range: 0.3 1\n');
		expect(unknown.ok).toBe(false);
	});
});
