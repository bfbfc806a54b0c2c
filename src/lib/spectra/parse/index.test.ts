/**
 * parseSpectrumFile: format detection, refusal of binary content, and fuzzing with fast-check on random
 * bytes and on truncated / mutated copies of the shared third-party files (origins in MANIFEST.md):
 * it must never throw and never return a non-finite point.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readExternal } from '../__fixtures__/external';
import { normaliseSpectrum } from '../normalise';
import { parseSpectrumFile } from './index';

const enc = new TextEncoder();

function checkNeverBad(bytes: Uint8Array) {
	const r = parseSpectrumFile(bytes, 'fuzz');
	if (!r.ok) {
		expect(r.issues.length).toBeGreaterThan(0);
		return;
	}
	for (const s of r.value) {
		expect(s.x.length).toBe(s.y.length);
		for (let i = 0; i < s.x.length; i++) expect(Number.isFinite(s.x[i]) && Number.isFinite(s.y[i])).toBe(true);
		const n = normaliseSpectrum(s);
		if (n.ok) for (let i = 0; i < n.value.x.length; i++) expect(Number.isNaN(n.value.x[i]) || Number.isNaN(n.value.y[i])).toBe(false);
	}
}

describe('parseSpectrumFile', () => {
	it('detects JCAMP-DX by ##TITLE and delimited text otherwise', () => {
		const j = parseSpectrumFile(readExternal('jcamp/cobalt-aquation-kinetics-5-blocks.jdx'), 'a.jdx');
		expect(j.ok && j.value.length).toBe(5);
		const c = parseSpectrumFile(readExternal('transmission/glass-petri-dish.csv'), 'b.txt');
		expect(c.ok && c.value[0].kind).toBe('transmission');
	});
	it('refuses binary and unknown content with unsupported_format (415)', () => {
		const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
		for (const bytes of [png, new Uint8Array(0), enc.encode('just some words\nand more words\n')]) {
			const r = parseSpectrumFile(bytes, 'x.bin');
			expect(r.ok).toBe(false);
			if (!r.ok) expect(r.issues[0].code).toBe('unsupported_format');
		}
	});
	it('caller options win over the file: kind, y unit, concentration and path', () => {
		const r = parseSpectrumFile(readExternal('emission/uva-blacklight-350nm-tube-digitised.csv'), 'b.csv', { kind: 'emission', yUnit: 'relative' });
		expect(r.ok && r.value[0].kind).toBe('emission');
		const a = parseSpectrumFile(enc.encode('nm,A\n300,0.1\n301,0.2\n302,0.3\n303,0.2\n304,0.1\n'), 'a.csv', { concentrationM: 1e-4, pathCm: 0.5 });
		expect(a.ok && a.value[0].metadata).toMatchObject({ concentrationM: 1e-4, pathCm: 0.5 });
	});
	it('reads windows-1252 text (µ in a header) without refusing it', () => {
		const bytes = new Uint8Array([...enc.encode('wavelength (nm),'), 0xb5, ...enc.encode('A\n300,1\n301,2\n302,3\n303,2\n304,1\n')]);
		expect(parseSpectrumFile(bytes, 'l1.csv').ok).toBe(true);
	});
});

describe('fuzz (fast-check)', () => {
	const sources = ['jcamp/uv-mislabelled-as-infrared-1-per-cm.jdx', 'jcamp/cobalt-aquation-kinetics-5-blocks.jdx', 'emission/uva-blacklight-350nm-tube-digitised.csv', 'emission/led-405nm-spectrometer-raw-counts.txt'].map(readExternal);
	it('random bytes never throw', () => {
		fc.assert(fc.property(fc.uint8Array({ maxLength: 2000 }), (b) => checkNeverBad(b)), { numRuns: 300 });
	});
	it('random text never throws', () => {
		fc.assert(fc.property(fc.string({ maxLength: 2000 }), (t) => checkNeverBad(enc.encode(t))), { numRuns: 300 });
	});
	it('truncated real files never throw and never give non-finite points', () => {
		fc.assert(fc.property(fc.integer({ min: 0, max: sources.length - 1 }), fc.double({ min: 0, max: 1, noNaN: true }), (k, f) => checkNeverBad(sources[k].slice(0, Math.floor(sources[k].length * f)))), { numRuns: 100 });
	});
	it('mutated real files (bytes replaced) never throw and never give non-finite points', () => {
		fc.assert(
			fc.property(fc.integer({ min: 0, max: sources.length - 1 }), fc.array(fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.integer({ min: 32, max: 126 })), { minLength: 1, maxLength: 20 }), (k, muts) => {
				const b = sources[k].slice();
				for (const [p, v] of muts) b[Math.floor(p * (b.length - 1))] = v;
				checkNeverBad(b);
			}),
			{ numRuns: 100 }
		);
	});
});

describe('text encodings written by instrument software', () => {
	it('reads UTF-16 (little-endian with a byte-order mark) tab-separated exports', () => {
		// invented values; UTF-16 LE with BOM is what some Windows instrument software writes (common practice)
		const text = '\uFEFFWavelength (nm)\tAbsorbance\r\n300\t0.1\r\n301\t0.2\r\n302\t0.3\r\n303\t0.2\r\n304\t0.1\r\n';
		const bytes = new Uint8Array(text.length * 2);
		for (let i = 0; i < text.length; i++) {
			bytes[2 * i] = text.charCodeAt(i) & 0xff;
			bytes[2 * i + 1] = text.charCodeAt(i) >> 8;
		}
		const r = parseSpectrumFile(bytes, 'utf16.txt');
		expect(r.ok).toBe(true);
		if (r.ok) expect(Array.from(r.value[0].y)).toEqual([0.1, 0.2, 0.3, 0.2, 0.1]);
	});
});
