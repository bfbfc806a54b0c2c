/**
 * The bounded JCAMP-DX decoder: worked examples of every ASDF form from the JCAMP-DX 4.24 specification's tables
 * (McDonald & Wilks, Appl. Spectrosc. 42, 151, 1988; values decoded by hand from the character tables), and
 * expansion bombs refused while decoding (invented files written for these tests).
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumFile } from './index';
import { statusForIssues } from './issueStatus';
import { decodeAsdf, tokenizeAsdf } from './jcampAsdf';
import { parseJcamp } from './jcamp';
import { DEFAULT_PARSE_LIMITS, parseLimitsFromEnv } from './parseLimits';

const budget = (n = 1e6) => ({ remaining: n, cap: n });
const decode = (text: string, nPoints?: number, b = budget()) => decodeAsdf(text.split('\n'), 0, text.split('\n').length - 1, { nPoints, budget: b });
const enc = new TextEncoder();

describe('decodeAsdf: the forms of JCAMP-DX 4.24 §5.9', () => {
	// The specification's example ordinates 1000 1000 1000 1001 1002 1002 1002 1003 (one line each form).
	const expected = [1000, 1000, 1000, 1001, 1002, 1002, 1002, 1003];
	it.each([
		['AFFN', '1 1000 1000 1000 1001 1002 1002 1002 1003'],
		['PAC (sign as delimiter)', '1+1000+1000+1000+1001+1002+1002+1002+1003'],
		['SQZ', '1A000A000A000A001A002A002A002A003'],
		['DIF', '1A000%%JJ%%J'],
		['DIFDUP', '1A000%TJJ%TJ']
	])('%s', (_name, line) => {
		const r = decode(line);
		if (!r.ok) throw new Error(r.message);
		expect(r.y).toEqual(expected);
	});
	it('negative SQZ and DIF letters, and the Y check of a DIF line', () => {
		// a = −1, j = −1 (JCAMP-DX ASDF table): −1234, −1235, −1236; line 2 repeats −1236 as its check.
		const r = decode('1a234jj\n3a236J2');
		if (!r.ok) throw new Error(r.message);
		expect(r.y).toEqual([-1234, -1235, -1236, -1224]);
		expect(r.starts.map((s) => s.index)).toEqual([0, 2]);
	});
	it('a failed Y check is refused as damaged with its line', () => {
		const r = decode('1A000JJ\n3A999J');
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r).toMatchObject({ code: 'y_check_failed', line: 2 });
	});
	it('E-notation when no other compression letter is used; "e" is SQZ −5 in compressed data', () => {
		expect(tokenizeAsdf('399.36 4.6e-05 0.10971e-1', false)).toEqual([
			{ kind: 'abs', text: '399.36' }, { kind: 'abs', text: '4.6e-05' }, { kind: 'abs', text: '0.10971e-1' }
		]);
		const r = decode('1 4.6e-05 0.10971e-1 -1.5E+2');
		if (!r.ok) throw new Error(r.message);
		expect(r.y).toEqual([4.6e-5, 0.010971, -150]);
		const c = decode('1e5J1');
		if (!c.ok) throw new Error(c.message);
		expect(c.y).toEqual([-55, -44]);
	});
	it('`$$` comments anywhere, "?" missing values dropped with a warning', () => {
		const r = decode('1 10 20 $$ a note\n3 30 ? 50');
		if (!r.ok) throw new Error(r.message);
		expect(r.y.filter((v) => !Number.isNaN(v))).toEqual([10, 20, 30, 50]);
		expect(r.warnings[0]).toMatch(/1 missing value/);
	});
	it('a stray character is refused naming line and column', () => {
		const r = decode('1 10 20\n3 30 4#0');
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.message).toMatch(/line 2: unexpected character "#" at column 7/);
	});
});

describe('expansion bombs are refused while decoding', () => {
	const bomb = (extra = '##NPOINTS=101\n') =>
		`##TITLE=invented bomb\n##JCAMP-DX=4.24\n##DATA TYPE=UV/VIS SPECTRUM\n##XUNITS=NANOMETERS\n##YUNITS=ABSORBANCE\n##FIRSTX=300\n##LASTX=400\n${extra}##XYDATA=(X++(Y..Y))\n300A0S00000000\n##END=\n`;
	it('a DUP count of 10⁸ in a file of ~200 bytes: NPOINTS exceeded (422-class), naming the line, without allocating it', () => {
		const text = bomb();
		expect(text.length).toBeLessThan(260);
		const before = process.memoryUsage().heapUsed;
		const r = parseSpectrumFile(enc.encode(text), 'bomb.jdx');
		// 10⁸ doubles would be 800 MB; the refusal must come without them (generous bound for GC noise).
		expect(process.memoryUsage().heapUsed - before).toBeLessThan(64 * 1024 * 1024);
		expect(r.ok).toBe(false);
		if (r.ok) return;
		expect(r.issues[0]).toMatchObject({ code: 'npoints_exceeded', line: 10 });
		expect(statusForIssues(r.issues)).toBe(422);
	});
	it('without NPOINTS the global cap (2 M points per file) refuses it: 413-class', () => {
		const r = parseSpectrumFile(enc.encode(bomb('')), 'bomb.jdx');
		expect(r.ok).toBe(false);
		if (r.ok) return;
		expect(r.issues[0].code).toBe('too_many_points');
		expect(r.issues[0].message).toMatch(/line 9: .*2,000,000 points/);
		expect(statusForIssues(r.issues)).toBe(413);
	});
	it('the cap is configurable and counts over all blocks of a file', () => {
		const block = (t: string) => `##TITLE=${t}\n##JCAMP-DX=4.24\n##DATA TYPE=UV/VIS SPECTRUM\n##XUNITS=nm\n##YUNITS=ABSORBANCE\n##FIRSTX=300\n##LASTX=359\n##NPOINTS=60\n##XYDATA=(X++(Y..Y))\n300A0X0\n##END=\n`;
		const text = `##TITLE=invented link\n##DATA TYPE=LINK\n##BLOCKS=2\n${block('a')}${block('b')}##END=\n`;
		expect(parseJcamp(text).ok).toBe(true);
		const r = parseJcamp(text, {}, { maxPointsPerFile: 100, maxSpectraPerFile: 500 });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues.find((i) => i.severity === 'error')).toMatchObject({ code: 'too_many_points', block: 1 });
	});
	it('more than 500 spectra in one file: 413-class before any block is decoded', () => {
		const block = (i: number) => `##TITLE=b${i}\n##XUNITS=nm\n##YUNITS=A\n##XYPOINTS=(XY..XY)\n300 1\n##END=\n`;
		const text = `##TITLE=invented many\n##DATA TYPE=LINK\n${Array.from({ length: 501 }, (_, i) => block(i)).join('')}##END=\n`;
		const r = parseSpectrumFile(enc.encode(text), 'many.jdx');
		expect(r.ok).toBe(false);
		if (!r.ok) expect(statusForIssues(r.issues)).toBe(413);
	});
	it('limits from the environment: PARSE_MAX_POINTS, PARSE_MAX_SPECTRA (defaults 2 M, 500)', () => {
		expect(parseLimitsFromEnv({})).toEqual(DEFAULT_PARSE_LIMITS);
		expect(DEFAULT_PARSE_LIMITS).toEqual({ maxPointsPerFile: 2_000_000, maxSpectraPerFile: 500 });
		expect(parseLimitsFromEnv({ PARSE_MAX_POINTS: '5000', PARSE_MAX_SPECTRA: 'x' })).toEqual({ maxPointsPerFile: 5000, maxSpectraPerFile: 500 });
	});
});
