/**
 * Hand-written JCAMP-DX fixtures (invented data, written for these tests) covering the variants
 * of JCAMP-DX 4.24 (McDonald & Wilks, Appl. Spectrosc. 42, 151, 1988) that the reader must accept or refuse.
 */
import { describe, expect, it } from 'vitest';
import { parseJcamp } from './jcamp';

const head = (extra: string) => `##TITLE=invented dye A\n##JCAMP-DX=4.24\n##DATA TYPE=UV/VIS SPECTRUM\n${extra}`;
const okValue = (r: ReturnType<typeof parseJcamp>) => {
	if (!r.ok) throw new Error(JSON.stringify(r.issues));
	return r;
};

describe('parseJcamp on invented fixtures', () => {
	it('##XYPOINTS=(XY..XY), which jcampconverter 12 leaves empty, is read with factors', () => {
		const text = head('##XUNITS=NANOMETERS\n##YUNITS=ABSORBANCE\n##XFACTOR=1\n##YFACTOR=0.001\n##NPOINTS=6\n##XYPOINTS=(XY..XY)\n300, 100\n301, 200\n302, 300\n303, 400\n304, 500\n305, 600\n##END=\n');
		const r = okValue(parseJcamp(text));
		expect(Array.from(r.value[0].x)).toEqual([300, 301, 302, 303, 304, 305]);
		expect(r.value[0].y[5]).toBeCloseTo(0.6, 12);
		expect(r.value[0].lines![0]).toBe(10); // 1-based line of "300, 100"
	});
	it('##PEAK TABLE=(XY..XY) with several pairs per line and ";" separators', () => {
		const r = okValue(parseJcamp(head('##XUNITS=nm\n##YUNITS=A\n##PEAK TABLE=(XY..XY)\n250,0.1; 260,0.4; 270,0.9\n280,0.5 290,0.2\n##END=')));
		expect(Array.from(r.value[0].x)).toEqual([250, 260, 270, 280, 290]);
		expect(Array.from(r.value[0].y)).toEqual([0.1, 0.4, 0.9, 0.5, 0.2]);
	});
	it('µm x units (MICROMETERS), CRLF, "## LABEL = value" with spaces, log ε y, CAS, solvent, path, concentration', () => {
		const text = ['## TITLE = invented azo dye', '## JCAMP-DX = 5.01', '## DATA TYPE = UV/VIS SPECTRUM', '## CAS REGISTRY NO = 0000-00-0', '## SOLVENT NAME = acetonitrile', '## PATH LENGTH = 10 mm', '## CONCENTRATIONS = 25 µM', '## XUNITS = MICROMETERS', '## YUNITS = LOG(EPSILON)', '## XYDATA = (XY..XY)', '0.30 3.1', '0.31 3.5', '0.32 4.0', '0.33 4.2', '0.34 3.9', '## END ='].join('\r\n');
		const r = okValue(parseJcamp(text));
		const s = r.value[0];
		expect(s.xUnit).toBe('um');
		expect(s.yUnit).toBe('log-epsilon');
		expect(s.metadata).toMatchObject({ title: 'invented azo dye', cas: '0000-00-0', solvent: 'acetonitrile', pathCm: 1 });
		expect(s.metadata.concentrationM).toBeCloseTo(25e-6, 15);
	});
	it('%T y units read as transmission percent; a BLOCKS count that lies gives a warning', () => {
		const block = (t: string) => `##TITLE=${t}\n##JCAMP-DX=4.24\n##DATA TYPE=UV/VIS SPECTRUM\n##XUNITS=nm\n##YUNITS=%T\n##XYDATA=(XY..XY)\n300 10\n310 20\n320 40\n330 60\n340 80\n##END=\n`;
		const text = `##TITLE=invented link\n##DATA TYPE=LINK\n##BLOCKS=3\n${block('sheet 1')}${block('sheet 2')}##END=\n`;
		const r = okValue(parseJcamp(text));
		expect(r.value).toHaveLength(2);
		expect(r.value[1].kind).toBe('transmission');
		expect(r.value[1].yUnit).toBe('transmittance-percent');
		expect(r.warnings.some((w) => w.code === 'block_count_mismatch')).toBe(true);
	});
	it('AFFN (X++(Y..Y)) with a stray "NaN" is refused with its line number', () => {
		const text = head('##XUNITS=nm\n##YUNITS=ABSORBANCE\n##NPOINTS=12\n##FIRSTX=300\n##LASTX=311\n##DELTAX=1\n##XYDATA=(X++(Y..Y))\n300 1 2 3 4\n304 5 NaN 7 8\n308 9 10 11 12\n##END=');
		const r = parseJcamp(text);
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'not_a_number', line: 12 });
	});
	it('compressed data that decode to fewer points than NPOINTS: a warning with the numbers (x from each line)', () => {
		const text = head('##XUNITS=nm\n##YUNITS=ABSORBANCE\n##NPOINTS=20\n##FIRSTX=300\n##LASTX=319\n##DELTAX=1\n##XYDATA=(X++(Y..Y))\n300A0J0J0J0J0\n304E0J0J0J0J0\n##END=');
		const r = okValue(parseJcamp(text));
		expect(r.warnings.find((i) => i.code === 'point_count_mismatch')?.message).toMatch(/NPOINTS says 20; the data decode to 9 points/);
		// A0 = 10, J0 = +10 …; the second line repeats 50 as its Y check (JCAMP-DX 4.24 DIF rule).
		expect(Array.from(r.value[0].x)).toEqual([300, 301, 302, 303, 304, 305, 306, 307, 308]);
		expect(Array.from(r.value[0].y)).toEqual([10, 20, 30, 40, 50, 60, 70, 80, 90]);
	});
	it('negative %T is refused with its line', () => {
		const r = parseJcamp(head('##XUNITS=nm\n##YUNITS=TRANSMITTANCE (%)\n##XYPOINTS=(XY..XY)\n300 10\n301 -2\n302 30\n303 40\n304 50\n##END='));
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'negative_transmittance', line: 8 });
	});
	it('fewer than 5 points is refused', () => {
		const r = parseJcamp(head('##XUNITS=nm\n##YUNITS=ABSORBANCE\n##XYPOINTS=(XY..XY)\n300 1\n301 2\n##END='));
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues[0].code).toBe('too_few_points');
	});
	it('garbage without ##TITLE is not JCAMP', () => {
		const r = parseJcamp('hello\nworld');
		expect(r.ok).toBe(false);
	});
});
