/**
 * Round trips of generated delimited layouts through the reader (fast-check, seeded): what is written is what is read.
 * The generated tables are invented; the unit relations checked are definitions (1 µm = 1000 nm; a density per µm is
 * 1000 × the density per nm; ν̃/cm⁻¹ = 10⁷/(λ/nm); %R/100 = R).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { normaliseSpectrum } from '../normalise';
import type { RawSpectrum, Result } from '../types';
import { parseDelimited } from './csv';
import { inspectDelimited } from './csvInspect';

const RUNS = { numRuns: 40, seed: 20261203 };
const ok = (r: Result<RawSpectrum[]>) => {
	if (!r.ok) throw new Error(JSON.stringify(r.issues.slice(0, 3)));
	return r.value;
};
/** Values with at most 4 decimals, never all equal (a flat column is not a spectrum). */
const yValues = (n: number, max = 2.5) => fc.array(fc.integer({ min: 0, max: Math.round(max * 10000) }), { minLength: n, maxLength: n }).filter((a) => new Set(a).size > 1).map((a) => a.map((v) => v / 10000));
const grid = fc.record({ start: fc.integer({ min: 200, max: 600 }), step: fc.constantFrom(0.5, 1, 2, 5), n: fc.integer({ min: 10, max: 40 }) }).map(({ start, step, n }) => Array.from({ length: n }, (_, i) => start + i * step));
const join = (fields: (string | number)[], d: string) => fields.map(String).join(d === ' ' ? ' '.repeat(1 + (fields.length % 3)) : d);

describe('rows-as-spectra (a kinetics table: a header row of wavelengths, one time per row)', () => {
	it('becomes one spectrum per row with its time in seconds, in file order', () => {
		fc.assert(
			fc.property(
				grid,
				fc.uniqueArray(fc.integer({ min: 0, max: 5000 }), { minLength: 2, maxLength: 8 }).map((a) => a.sort((p, q) => p - q)),
				fc.constantFrom<[string, number]>(['s', 1], ['min', 60], ['ms', 1e-3], ['h', 3600]),
				fc.constantFrom(',', ';', '\t', ' '),
				fc.integer({ min: 0, max: 1e6 }),
				(xs, times, [unit, perS], d, seed) => {
					const ys = times.map((_, k) => xs.map((_, j) => ((seed + 7919 * (j + 1) * (k + 3)) % 25000) / 10000));
					const corner = d === ' ' ? `"Time (${unit})"` : `Time (${unit})`;
					const text = [join([corner, ...xs], d), ...times.map((t, k) => join([t, ...ys[k]], d))].join('\n');
					const out = ok(parseDelimited(text));
					expect(out).toHaveLength(times.length);
					out.forEach((s, k) => {
						expect(Array.from(s.x)).toEqual(xs);
						expect(Array.from(s.y)).toEqual(ys[k]);
						expect(s.timeS).toBeCloseTo(times[k] * perS, 9);
						expect(s.index).toBe(k);
					});
					expect(inspectDelimited(text).ok && (inspectDelimited(text) as { value: { layout: string } }).value.layout).toBe('rows');
				}
			),
			RUNS
		);
	});
	it('an empty corner cell: rows still win when the header row is the longer axis; times read as seconds with a warning', () => {
		fc.assert(
			fc.property(grid, fc.integer({ min: 2, max: 6 }), fc.constantFrom(',', '\t', ' '), (xs, k, d) => {
				const text = [(d === ' ' ? '' : d) + xs.join(d === ' ' ? '  ' : d), ...Array.from({ length: k }, (_, r) => join([30 * r, ...xs.map((_, j) => ((j * (r + 1)) % 17) / 10)], d))].join('\n');
				const r = parseDelimited(text);
				const out = ok(r);
				expect(out.map((s) => s.timeS)).toEqual(Array.from({ length: k }, (_, i) => 30 * i));
				expect(r.ok && r.warnings.some((w) => w.code === 'time_unit_assumed')).toBe(true);
			}),
			RUNS
		);
	});
});

describe('whitespace-delimited columns with quoted headers', () => {
	it('any run of spaces (or tabs) separates fields; quoted names keep their spaces', () => {
		fc.assert(
			fc.property(grid, fc.integer({ min: 1, max: 4 }), fc.integer({ min: 0, max: 1e6 }), (xs, m, seed) => {
				const cols = Array.from({ length: m }, (_, c) => xs.map((_, j) => ((seed + 104729 * (j + 1) * (c + 1)) % 20000) / 10000));
				const names = cols.map((_, c) => `"Sample ${c + 1} Abs"`);
				const pad = (i: number) => (i % 2 ? ' \t ' : '   ');
				const text = [`"Wavelength (nm)"${pad(0)}${names.join(pad(1))}`, ...xs.map((x, j) => [x, ...cols.map((c) => c[j])].join(pad(j)))].join('\n');
				const out = ok(parseDelimited(text));
				expect(out.map((s) => s.label)).toEqual(names.map((n) => n.slice(1, -1)));
				out.forEach((s, c) => {
					expect(Array.from(s.x)).toEqual(xs);
					expect(Array.from(s.y)).toEqual(cols[c]);
					expect(s.yUnit).toBe('absorbance');
				});
			}),
			RUNS
		);
	});
});

describe('key–value header blocks', () => {
	const X: [string, 'nm' | 'um', number][] = [['NANOMETERS', 'nm', 1], ['MICROMETERS', 'um', 1e-3]];
	const Y: [string, string, string][] = [['ABSORBANCE', 'absorbance', 'absorption'], ['TRANSMITTANCE', 'transmittance', 'transmission'], ['%T', 'transmittance-percent', 'transmission']];
	it('XUNITS / YUNITS (tab, colon or equals) decide the units; other keys are metadata', () => {
		fc.assert(
			fc.property(grid, fc.constantFrom(...X), fc.constantFrom(...Y), fc.constantFrom('\t', ': ', ' = '), fc.constantFrom('\t', ','), (xs, [xw, xu, f], [yw, yu, kind], sep, d) => {
				const ys = xs.map((_, j) => (yu === 'transmittance-percent' ? 40 + (j % 50) : 0.1 + (j % 7) / 10));
				const text = [`TITLE${sep}invented dye batch 7`, `ORIGIN${sep}invented lab`, `XUNITS${sep}${xw}`, `YUNITS${sep}${yw}`, `NPOINTS${sep}${xs.length}`, 'XYDATA', ...xs.map((x, j) => `${+(x * f).toPrecision(10)}${d}${ys[j]}`)].join('\r\n');
				const [s] = ok(parseDelimited(text));
				expect([s.xUnit, s.yUnit, s.kind]).toEqual([xu, yu, kind]);
				expect(s.metadata.title).toBe('invented dye batch 7');
				const n = normaliseSpectrum(s);
				expect(n.ok && Array.from(n.value.x).map((v) => +v.toPrecision(9))).toEqual(xs);
			}),
			RUNS
		);
	});
});

describe('µm axis with a density per µm', () => {
	it('x × 1000 → nm and W m⁻² µm⁻¹ × 10⁻³ → W m⁻² nm⁻¹', () => {
		fc.assert(
			fc.property(fc.integer({ min: 30, max: 150 }), fc.integer({ min: 8, max: 40 }), yValues(40, 2500), (start, n, ys) => {
				const xs = Array.from({ length: n }, (_, i) => (start + i) / 100);
				const text = ['Wavelength (µm),Irradiance (W m-2 µm-1)', ...xs.map((x, i) => `${x},${ys[i]}`)].join('\n');
				const v = ys.slice(0, n);
				fc.pre(new Set(v).size > 1);
				const [s] = ok(parseDelimited(text));
				expect(s.xUnit).toBe('um');
				const norm = normaliseSpectrum(s);
				if (!norm.ok) throw new Error(JSON.stringify(norm.issues));
				expect(norm.value.yUnit).toBe('W/m2/nm');
				norm.value.x.forEach((x, i) => expect(x).toBeCloseTo(xs[i] * 1000, 9));
				norm.value.y.forEach((y, i) => expect(y).toBeCloseTo(v[i] / 1000, 12));
			}),
			RUNS
		);
	});
});

describe('%R', () => {
	it('reads as reflectance and stores R = %R/100', () => {
		fc.assert(
			fc.property(grid, fc.constantFrom('%R', 'R (%)', 'Reflectance (%)'), (xs, name) => {
				const ys = xs.map((_, j) => 5 + ((j * 37) % 90));
				const [s] = ok(parseDelimited([`Wavelength (nm),${name}`, ...xs.map((x, j) => `${x},${ys[j]}`)].join('\n')));
				expect(s.kind).toBe('reflectance');
				const n = normaliseSpectrum(s);
				expect(n.ok && Array.from(n.value.y)).toEqual(ys.map((v) => v / 100));
			}),
			RUNS
		);
	});
});

describe('axis repeats', () => {
	it('the same axis in nm, µm and cm⁻¹ gives axes, not spectra; every y column is read against the first axis', () => {
		fc.assert(
			fc.property(grid, fc.shuffledSubarray(['um', 'cm-1', 'nm2'], { minLength: 1 }), fc.integer({ min: 1, max: 3 }), (xs, extra, m) => {
				const axisCols = extra.map((u) => ({ name: u === 'um' ? 'Wavelength (µm)' : u === 'cm-1' ? 'Wavenumber (cm-1)' : 'lambda nm', v: xs.map((x) => (u === 'um' ? x / 1000 : u === 'cm-1' ? +(1e7 / x).toFixed(4) : x)) }));
				const ys = Array.from({ length: m }, (_, c) => xs.map((_, j) => ((j + 1) * (c + 2)) % 11 / 10 + 0.05));
				const header = ['Wavelength (nm)', ...axisCols.map((a) => a.name), ...ys.map((_, c) => `Abs ${c + 1}`)];
				const text = [header.join(','), ...xs.map((x, j) => [x, ...axisCols.map((a) => a.v[j]), ...ys.map((y) => y[j])].join(','))].join('\n');
				const out = ok(parseDelimited(text));
				expect(out.map((s) => s.column)).toEqual(ys.map((_, c) => 1 + axisCols.length + c));
				out.forEach((s, c) => {
					expect(Array.from(s.x)).toEqual(xs);
					expect(Array.from(s.y)).toEqual(ys[c]);
				});
				const p = inspectDelimited(text);
				expect(p.ok && p.value.columns.slice(1, 1 + axisCols.length).every((c) => c.role === 'axis' && c.ticked === false)).toBe(true);
			}),
			RUNS
		);
	});
});
