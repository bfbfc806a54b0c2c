/**
 * A kinetics export (one row per time point under a row of wavelengths) becomes a time series: one spectrum per
 * row, in file order, each with its time in seconds (RawSpectrum.timeS → spectra.block_time_s) and the row's label.
 * The table is invented (an invented photoreaction: a band at 420 nm decaying as exp(−t/τ), τ = 300 s, and a product
 * band at 330 nm growing in); the check is that the reader returns exactly what was written.
 */
import { describe, expect, it } from 'vitest';
import { normaliseSpectrum } from '../normalise';
import { parseSpectrumFile } from './index';

const wavelengths = Array.from({ length: 911 }, (_, i) => 190 + i); // 190–1100 nm, the 911 columns of such exports
const times = Array.from({ length: 35 }, (_, k) => 30 * k); // 0–1020 s
const band = (nm: number, centre: number, width: number) => Math.exp(-(((nm - centre) / width) ** 2) / 2);
const absorbance = (t: number, nm: number) => +(0.9 * Math.exp(-t / 300) * band(nm, 420, 25) + 0.6 * (1 - Math.exp(-t / 300)) * band(nm, 330, 20) + 0.02).toFixed(5);

function kineticsTable(corner: string, d: string, timeOf: (t: number) => string) {
	return [[corner, ...wavelengths].join(d), ...times.map((t) => [timeOf(t), ...wavelengths.map((nm) => absorbance(t, nm))].join(d))].join('\r\n');
}

describe('kinetics table → time series', () => {
	it('35 spectra (not 911), times kept in seconds in file order, each an absorption spectrum over 190–1100 nm', () => {
		const r = parseSpectrumFile(new TextEncoder().encode(kineticsTable('Time (s)', ',', String)), 'run-07-kinetics.csv');
		if (!r.ok) throw new Error(JSON.stringify(r.issues.slice(0, 3)));
		expect(r.value).toHaveLength(35);
		expect(r.value.map((s) => s.timeS)).toEqual(times);
		expect(r.value.map((s) => s.index)).toEqual(times.map((_, k) => k));
		expect(r.value[2].label).toBe('t = 60 s');
		expect(r.value[2].blockLabel).toBe('60');
		const s = r.value[10];
		expect([s.kind, s.yUnit, s.x.length, s.x[0], s.x[910]]).toEqual(['absorption', 'absorbance', 911, 190, 1100]);
		// what was written is what is read (the 420 nm band at t = 300 s is 0.9·e⁻¹ + the product's tail + 0.02)
		const n = normaliseSpectrum(s);
		expect(n.ok && n.value.y[420 - 190]).toBe(absorbance(300, 420));
		expect(r.warnings.some((w) => w.code === 'layout_rows')).toBe(true);
	});
	it('minutes in the corner cell become seconds; labels with their own unit ("5 min") too', () => {
		const a = parseSpectrumFile(new TextEncoder().encode(kineticsTable('t / min', '\t', (t) => String(t / 60))), 'k.txt');
		expect(a.ok && a.value.map((s) => s.timeS).slice(0, 3)).toEqual([0, 30, 60]);
		const b = parseSpectrumFile(new TextEncoder().encode(kineticsTable('', ';', (t) => `${t / 60} min`)), 'k.txt');
		expect(b.ok && b.value.map((s) => s.timeS)[4]).toBeCloseTo(120, 9);
	});
	it('a space-delimited export without a corner cell is read the same way (times assumed seconds, with a warning)', () => {
		const text = kineticsTable('', ' ', String).replace(/^ /, '');
		const r = parseSpectrumFile(new TextEncoder().encode(text), 'k.txt');
		if (!r.ok) throw new Error(JSON.stringify(r.issues.slice(0, 3)));
		expect(r.value).toHaveLength(35);
		expect(r.value[34].timeS).toBe(1020);
		expect(r.warnings.some((w) => w.code === 'time_unit_assumed')).toBe(true);
	});
	it('the caller may force one spectrum per column instead (then the times are the x axis and are refused as non-optical)', () => {
		const r = parseSpectrumFile(new TextEncoder().encode(kineticsTable('Time (s)', ',', String)), 'k.csv', { layout: 'columns' });
		expect(!r.ok && r.issues[0].code).toBe('not_optical_table');
	});
});
