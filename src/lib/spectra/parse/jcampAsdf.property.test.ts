/**
 * Property tests (fast-check, seeded) of the JCAMP-DX decoder: ordinates written by an encoder written here from
 * the JCAMP-DX 4.24 ASDF character tables (McDonald & Wilks, Appl. Spectrosc. 42, 151, 1988) — AFFN with blanks or
 * commas, PAC (the sign as delimiter), E-notation, SQZ, DIF with Y checks, DIFDUP and SQZDUP — on random line
 * breaks with `$$` comments, must decode back to exactly the same values and abscissa positions.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decodeAsdf } from './jcampAsdf';

const SQZ_POS = '@ABCDEFGHI', SQZ_NEG = 'abcdefghi', DIF_POS = '%JKLMNOPQR', DIF_NEG = 'jklmnopqr', DUP = 'STUVWXYZs';
const sqz = (v: number) => {
	const s = String(Math.abs(v));
	return (v < 0 ? SQZ_NEG[Number(s[0]) - 1] : SQZ_POS[Number(s[0])]) + s.slice(1);
};
const dif = (d: number) => {
	const s = String(Math.abs(d));
	return (d < 0 ? DIF_NEG[Number(s[0]) - 1] : DIF_POS[Number(s[0])]) + s.slice(1);
};
const dup = (n: number) => DUP[Number(String(n)[0]) - 1] + String(n).slice(1);

type Form = 'AFFN' | 'AFFN-comma' | 'PAC' | 'SQZ' | 'SQZDUP' | 'DIF' | 'DIFDUP';

/** Collapses runs of equal tokens into token + DUP count. */
function withDup(tokens: string[]): string[] {
	const out: string[] = [];
	for (let i = 0; i < tokens.length; ) {
		let j = i + 1;
		while (j < tokens.length && tokens[j] === tokens[i]) j++;
		out.push(tokens[i] + (j - i > 1 ? dup(j - i) : ''));
		i = j;
	}
	return out;
}

/** Writes integer ordinates in one form, `sizes` points per line; returns the lines and each line's x (= point index). */
function encode(y: number[], form: Form, sizes: number[], comments: boolean[]): string[] {
	const lines: string[] = [];
	let p = 0, k = 0, prevDif = false;
	while (p < y.length) {
		const n = Math.min(sizes[k % sizes.length], y.length - p);
		const note = comments[k % comments.length] ? ' $$ invented note' : '';
		k++;
		const chunk = y.slice(p, p + n);
		if (form === 'DIF' || form === 'DIFDUP') {
			// A line after a DIF line starts with the previous line's last value again (the Y check).
			const start = prevDif ? p - 1 : p;
			const vals = y.slice(start, p + n);
			const difs = vals.slice(1).map((v, i) => dif(v - vals[i]));
			lines.push(`${start}${sqz(vals[0])}${(form === 'DIFDUP' ? withDup(difs) : difs).join('')}${note}`);
			prevDif = difs.length > 0;
		} else if (form === 'SQZ' || form === 'SQZDUP') {
			const t = chunk.map(sqz);
			lines.push(`${p}${(form === 'SQZDUP' ? withDup(t) : t).join('')}${note}`);
		} else if (form === 'PAC') lines.push(`${p}${chunk.map((v) => (v < 0 ? String(v) : `+${v}`)).join('')}${note}`);
		else lines.push(`${p}${form === 'AFFN-comma' ? ',' : ' '}${chunk.join(form === 'AFFN-comma' ? ',' : ' ')}${note}`);
		p += n;
	}
	return lines;
}

const budget = () => ({ remaining: 1e7, cap: 1e7 });
const forms: Form[] = ['AFFN', 'AFFN-comma', 'PAC', 'SQZ', 'SQZDUP', 'DIF', 'DIFDUP'];
// Runs of repeated values make DUP appear; the values span several orders of magnitude and both signs.
const ordinates = fc.array(fc.oneof(fc.integer({ min: -2_000_000_000, max: 2_000_000_000 }), fc.integer({ min: -20, max: 20 }), fc.constant(0)), { minLength: 1, maxLength: 300 });

describe.each(forms)('decodeAsdf round trip: %s', (form) => {
	it('decodes the values and each line start exactly', () => {
		fc.assert(
			fc.property(ordinates, fc.array(fc.integer({ min: 1, max: 25 }), { minLength: 1, maxLength: 6 }), fc.array(fc.boolean(), { minLength: 1, maxLength: 4 }), (y, sizes, comments) => {
				const lines = encode(y, form, sizes, comments);
				const r = decodeAsdf(lines, 0, lines.length - 1, { budget: budget() });
				if (!r.ok) throw new Error(`${r.message}\n${lines.join('\n')}`);
				expect(r.y).toEqual(y);
				for (const s of r.starts) expect(s.x).toBe(s.index);
			}),
			{ numRuns: 150, seed: 17 }
		);
	});
});

describe('decodeAsdf: AFFN decimals and E-notation', () => {
	it('any finite double written with toString / toExponential, blank- or sign-separated, comes back', () => {
		const value = fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e300, max: 1e300 });
		fc.assert(
			fc.property(fc.array(value, { minLength: 1, maxLength: 60 }), fc.boolean(), fc.integer({ min: 1, max: 12 }), (y, signDelimited, size) => {
				const lines: string[] = [];
				for (let p = 0; p < y.length; p += size) {
					const chunk = y.slice(p, p + size).map((v, i) => ((p + i) % 2 ? v.toExponential() : String(v)));
					lines.push(`${p}${chunk.map((t) => (signDelimited && !t.startsWith('-') ? `+${t}` : ` ${t}`)).join(signDelimited ? '' : '')}`);
				}
				const r = decodeAsdf(lines, 0, lines.length - 1, { budget: budget() });
				if (!r.ok) throw new Error(`${r.message}\n${lines.join('\n')}`);
				expect(r.y).toEqual(y.map((v) => (v === 0 ? 0 : v))); // String(-0) is "0"
			}),
			{ numRuns: 300, seed: 23 }
		);
	});
	it('a DUP count never allocates past the budget, whatever the count', () => {
		fc.assert(
			fc.property(fc.integer({ min: 2, max: 2_000_000_000 }), fc.integer({ min: 1, max: 5000 }), (count, cap) => {
				const r = decodeAsdf([`1A0${dup(count)}`], 0, 0, { budget: { remaining: cap, cap } });
				if (count <= cap) expect(r.ok && r.y.length).toBe(count);
				else expect(!r.ok && r.code).toBe('too_many_points');
			}),
			{ numRuns: 300, seed: 29 }
		);
	});
});
