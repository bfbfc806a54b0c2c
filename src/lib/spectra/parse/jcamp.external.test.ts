/**
 * JCAMP-DX files written outside this project (../shared/external/jcamp, see MANIFEST.md there).
 * Expected values: MANIFEST.md, computed there from the files by an independent script
 * (maxima = largest sample); tolerance ±1 sampling step for λ, ±0.0005 for absorbances quoted to 4 digits.
 */
import { describe, expect, it } from 'vitest';
import { deriveSpectrum } from '../derive';
import { norm, parseExternal, yAt } from '../__fixtures__/external';

describe('uv-vis-thf-link-absorbance-plus-variance.jdx (cheminfo/jcampconverter test data, uv.jdx)', () => {
	const r = parseExternal('jcamp/uv-vis-thf-link-absorbance-plus-variance.jdx');
	it('keeps the absorbance block and drops the VARIANCE block with a warning', () => {
		expect(r.value).toHaveLength(1);
		expect(r.value[0].yUnit).toBe('absorbance');
		expect(r.warnings.some((w) => w.code === 'block_not_spectrum' && w.block === 1)).toBe(true);
	});
	it('911 points 190–1100 nm, visible λmax 541 nm A 0.312, A(350) 0.231 (MANIFEST)', () => {
		const s = norm(r.value[0]);
		expect(s.x.length).toBe(911);
		expect(s.x[0]).toBe(190);
		expect(s.x[910]).toBe(1100);
		// "visible" λmax: search above the THF cut-off noise (< ~230 nm, MANIFEST), from 400 nm.
		const d = deriveSpectrum(s, { range: { fromNm: 400 } });
		expect(Math.abs(d.lambdaMaxNm! - 541)).toBeLessThanOrEqual(1);
		expect(d.valueAtMax!).toBeCloseTo(0.312, 3);
		expect(yAt(s, 350)).toBeCloseTo(0.231, 3);
	});
	it('reads title, origin and owner from the `## LABEL = value` records', () => {
		expect(r.value[0].metadata.title).toBe('marstoja_XY1b_1@C5_RT_1cm_THF');
		expect(r.value[0].metadata.owner).toBe('administrator');
		expect(r.value[0].metadata.origin).toBeTruthy();
	});
});

describe('uv-mislabelled-as-infrared-1-per-cm.jdx (cheminfo/jcampconverter test data, uv_ACD.jdx)', () => {
	const r = parseExternal('jcamp/uv-mislabelled-as-infrared-1-per-cm.jdx');
	it('is flagged units_contradict_data and read as nm, never as 15 000–47 600 nm', () => {
		const w = r.warnings.find((i) => i.code === 'units_contradict_data');
		expect(w).toBeDefined();
		expect(w!.message).toMatch(/cm⁻¹.*210–650.*Read as nm/);
		expect(r.value[0].xUnit).toBe('nm');
	});
	it('881 points 210–650 step 0.5, max 3.076 at 216.0–216.5 nm (MANIFEST; SQZ/DIF/DUP, YFACTOR 1e-8)', () => {
		const s = norm(r.value[0]);
		expect(s.x.length).toBe(881);
		expect(s.x[0]).toBe(210);
		expect(s.x[880]).toBe(650);
		// the file's own maximum (A 3.076 lies above the default 2.5 linear range, so read it with a 4.0 limit)
		const d = deriveSpectrum(s, { linearLimitAbsorbance: 4 });
		expect(d.lambdaMaxNm!).toBeGreaterThanOrEqual(216 - 0.5);
		expect(d.lambdaMaxNm!).toBeLessThanOrEqual(216.5 + 0.5);
		expect(d.valueAtMax!).toBeCloseTo(3.076, 3);
	});
});

describe('cobalt-aquation-kinetics-5-blocks.jdx (nzhagen/jcamp, blckpac1.jdx)', () => {
	const r = parseExternal('jcamp/cobalt-aquation-kinetics-5-blocks.jdx');
	// MANIFEST: d–d band maximum per block; A values to 4 decimals for t1 and t5.
	const bands = [614, 608, 606, 602, 596];
	it('5 blocks × 176 points, descending 700 → 350 nm in the file, ascending after normalising', () => {
		expect(r.value).toHaveLength(5);
		for (const raw of r.value) {
			expect(raw.x.length).toBe(176);
			expect(raw.x[0]).toBe(700);
			expect(raw.x[175]).toBe(350);
			expect(raw.xUnit).toBe('nm');
			expect(raw.yUnit).toBe('absorbance'); // YUNITS = A
		}
	});
	it.each(bands.map((b, i) => [i, b]))('block %i: d–d band maximum %i nm (±2 nm step)', (i, band) => {
		const s = norm(r.value[i]);
		// The d–d band sits on the rising UV edge: search 550–700 nm (the band region, common practice).
		const d = deriveSpectrum(s, { range: { fromNm: 550 } });
		expect(Math.abs(d.lambdaMaxNm! - band)).toBeLessThanOrEqual(2);
	});
	it('t1 A(614) 0.0632, t5 band A 0.0534, A(350) of t1 0.1934 (MANIFEST)', () => {
		expect(deriveSpectrum(norm(r.value[0]), { range: { fromNm: 550 } }).valueAtMax!).toBeCloseTo(0.0632, 3);
		expect(deriveSpectrum(norm(r.value[4]), { range: { fromNm: 550 } }).valueAtMax!).toBeCloseTo(0.0534, 3);
		expect(yAt(r.value[0], 350)).toBeCloseTo(0.1934, 3);
	});
});

describe('cobalt-aquation-kinetics-20-blocks.jdx (JSpecView test data, aquation20.jdx)', () => {
	const r = parseExternal('jcamp/cobalt-aquation-kinetics-20-blocks.jdx');
	// MANIFEST: band maxima t1…t8; the later blocks are dominated by the product band.
	const bands = [610, 608, 605, 606, 601, 599, 596, 594];
	it('20 blocks × 351 points (XUNITS "nanometers")', () => {
		expect(r.value).toHaveLength(20);
		for (const raw of r.value) {
			expect(raw.x.length).toBe(351);
			expect(raw.xUnit).toBe('nm');
		}
		// Names: the file title once (the LINK block's ##TITLE), then the block label without the repeated title.
		expect(r.value[0].metadata.title).toBe('Aquation of trans-[Co(en)2Cl2]+');
		expect(r.value[0].label).toBe('t1');
		expect(r.value[19].label).toBe('t20');
		expect(r.value[19].metadata.blockTitle).toMatch(/\(t20\)$/);
	});
	it.each(bands.map((b, i) => [i, b]))('block %i: band maximum %i nm (±1 nm step)', (i, band) => {
		// Reactant band region 570–700 nm: the growing product band (505 nm) tails into 560 nm by t8.
		const d = deriveSpectrum(norm(r.value[i]), { range: { fromNm: 570 } });
		expect(Math.abs(d.lambdaMaxNm! - band)).toBeLessThanOrEqual(1);
	});
	it('t1 band A 0.0636; t20 product band 505 nm A 0.1215; A(350) 0.2027 → 0.181 (MANIFEST)', () => {
		expect(deriveSpectrum(norm(r.value[0]), { range: { fromNm: 570 } }).valueAtMax!).toBeCloseTo(0.0636, 3);
		const t20 = deriveSpectrum(norm(r.value[19]), { range: { fromNm: 450 } });
		expect(Math.abs(t20.lambdaMaxNm! - 505)).toBeLessThanOrEqual(1);
		expect(t20.valueAtMax!).toBeCloseTo(0.1215, 3);
		expect(yAt(r.value[0], 350)).toBeCloseTo(0.2027, 3);
		expect(yAt(r.value[19], 350)).toBeCloseTo(0.181, 3);
	});
});
