/**
 * Seeded mutations of real files for fuzz tests: byte flips, insertions of digits, compression letters, `$$`,
 * `##` records and huge repeat counts, deleted / duplicated / swapped spans, header values replaced by extreme ones,
 * truncation, binary signatures and NULs. Deterministic for a given seed (mulberry32 PRNG, public domain).
 */

export { prng } from '../../prng';

const enc = new TextEncoder();
const SNIPPETS = [
	'S00000000', 's99999999', 'Z9999999', '?', '$$', '$$ note', '##', '##END=', '##TITLE=x', '##NPOINTS=', '##NPOINTS=0', '##NPOINTS=-5', '##NPOINTS=1e9',
	'##XFACTOR=0', '##YFACTOR=1e308', '##YFACTOR=-1', '##XUNITS=1/CM', '##XUNITS=PPM', '##XUNITS=V', '##YUNITS=%T', '##YUNITS=LOG EPSILON',
	'##DATA TYPE=NMR SPECTRUM', '##DATA TYPE=LINK', '##XYDATA=(X++(Y..Y))', '##PEAK TABLE=(XY..XY)', '##FIRSTX=1e-300', '##LASTX=1e300',
	'1e308', '-1e308', '1e-300', 'NaN', 'Infinity', '-0', '0', '1.7976931348623157e308', '999999999999999999999', 'e', 'E+', '@', '%', 'j', 'J9',
	'\n', '\r\n', '\r', '\t', ',', ';', ' ', '-', '+', '.', '..', '"', '\u00b5', '\u03b5', '\ufeff', '\u0000', '\x89PNG\r\n\x1a\n', '%PDF-1.4\n', 'PK\x03\x04'
];
const HEADER = /^(##\s*[A-Z$ _/-]+=)(.*)$/m;

/** One random mutation of `src` (bytes). */
export function mutate(src: Uint8Array, rnd: () => number): Uint8Array {
	const pick = <T>(a: T[]) => a[Math.floor(rnd() * a.length)];
	const at = () => Math.floor(rnd() * (src.length + 1));
	const op = Math.floor(rnd() * 12);
	const cat = (...parts: Uint8Array[]) => {
		const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
		let k = 0;
		for (const p of parts) (out.set(p, k), (k += p.length));
		return out;
	};
	const i = at();
	const j = Math.min(src.length, i + 1 + Math.floor(rnd() * 200));
	switch (op) {
		case 0: {
			const out = src.slice();
			for (let n = 1 + Math.floor(rnd() * 4); n > 0 && out.length; n--) out[Math.floor(rnd() * out.length)] = Math.floor(rnd() * 256);
			return out;
		}
		case 1:
		case 2:
			return cat(src.subarray(0, i), enc.encode(pick(SNIPPETS)), src.subarray(i));
		case 3:
			return cat(src.subarray(0, i), src.subarray(j));
		case 4:
			return cat(src.subarray(0, j), src.subarray(i, j), src.subarray(j));
		case 5:
			return src.subarray(0, i);
		case 6: {
			// Replace a header value with an extreme one.
			const text = new TextDecoder().decode(src);
			const lines = text.split('\n');
			const idx = lines.map((l, k) => (HEADER.test(l) ? k : -1)).filter((k) => k >= 0);
			if (!idx.length) return cat(src.subarray(0, i), enc.encode(pick(SNIPPETS)), src.subarray(i));
			const k = pick(idx);
			lines[k] = lines[k].replace(HEADER, (_m, a) => a + pick(['0', '-1', '1e308', '1e-300', 'NaN', '', 'ABC', '99999999', '2.5', '  7 $$ c', '1/CM', 'NANOMETERS', 'TRANSMITTANCE']));
			return enc.encode(lines.join('\n'));
		}
		case 7: {
			// Replace a number in the data with an extreme one.
			const text = new TextDecoder().decode(src);
			const start = Math.floor(rnd() * text.length);
			const m = /\d+(\.\d+)?/.exec(text.slice(start));
			if (!m) return src;
			const p = start + m.index;
			return enc.encode(text.slice(0, p) + pick(['1e308', '-1e308', '1e-300', '0', '-0', '99999999999', 'S00000000', '-5']) + text.slice(p + m[0].length));
		}
		case 8: {
			// Swap two lines.
			const lines = new TextDecoder().decode(src).split('\n');
			const a = Math.floor(rnd() * lines.length), b = Math.floor(rnd() * lines.length);
			[lines[a], lines[b]] = [lines[b], lines[a]];
			return enc.encode(lines.join('\n'));
		}
		case 9:
			return cat(enc.encode(pick(['\x89PNG\r\n\x1a\n', '%PDF-1.7\n', 'PK\x03\x04', '\x1f\x8b\x08\x00', '\ufeff', '\u0000\u0000'])), src);
		case 10: {
			// Many copies of a span (block or line floods).
			const parts = [src.subarray(0, j)];
			for (let n = 2 + Math.floor(rnd() * 30); n > 0; n--) parts.push(src.subarray(i, j));
			parts.push(src.subarray(j));
			return cat(...parts);
		}
		default: {
			// Several mutations in a row.
			let out = src;
			for (let n = 2 + Math.floor(rnd() * 3); n > 0; n--) out = mutate(out, rnd);
			return out;
		}
	}
}

/** The first `maxBytes` of a file, cut at a line end (a smaller seed keeps thousands of runs fast). */
export function head(bytes: Uint8Array, maxBytes: number): Uint8Array {
	if (bytes.length <= maxBytes) return bytes;
	let k = maxBytes;
	while (k > 0 && bytes[k] !== 0x0a) k--;
	return bytes.subarray(0, k > 0 ? k + 1 : maxBytes);
}
