/**
 * Hand-written delimited-text fixtures (invented data, written for these tests): delimiters, decimal
 * comma, BOM, quoted headers, preambles, unit hints and the refusals with line numbers.
 */
import { describe, expect, it } from 'vitest';
import { parseDelimited } from './csv';
import { inspectDelimited } from './csvInspect';

const ok = (r: ReturnType<typeof parseDelimited>) => {
	if (!r.ok) throw new Error(JSON.stringify(r.issues));
	return r;
};
const rows = (sep: string, dec = '.') => [300, 301, 302, 303, 304, 305].map((x, i) => `${x}${sep}${(0.1 * (i + 1)).toFixed(2).replace('.', dec)}`).join('\n');

describe('parseDelimited on invented fixtures', () => {
	it('semicolon + decimal comma + BOM + quoted header naming Abs', () => {
		const r = ok(parseDelimited(`\ufeff"Wavelength (nm)";"Abs"\n${rows(';', ',')}\n`));
		expect(r.value[0].yUnit).toBe('absorbance');
		expect(r.value[0].xUnit).toBe('nm');
		expect(r.value[0].y[2]).toBeCloseTo(0.3, 12);
	});
	it('tab separated with a %T header, descending x, E-notation', () => {
		const r = ok(parseDelimited('nm\t%T\n' + [[500, '9.1E1'], [450, '5.0E1'], [400, '1.0e1'], [350, '1E0'], [300, '0']].map((p) => p.join('\t')).join('\n')));
		const s = r.value[0];
		expect(s.kind).toBe('transmission');
		expect(s.yUnit).toBe('transmittance-percent');
		expect(Array.from(s.y)).toEqual([91, 50, 10, 1, 0]);
	});
	it('instrument preamble and a marker line before the data; W m-2 nm-1 and counts hints', () => {
		const pre = 'Instrument export\nDate: 2026-01-01\nOwner: invented photochemistry group\n>>>>> data <<<<<\n';
		const r = ok(parseDelimited(`${pre}wavelength,irradiance W m-2 nm-1,counts\n300,0.1,10\n301,0.2,20\n302,0.3,30\n303,0.2,20\n304,0.1,10\n`));
		expect(r.value.map((s) => s.yUnit)).toEqual(['W/m2/nm', 'counts']);
		expect(r.value[0].lines![0]).toBe(6);
		expect(r.value[0].metadata.owner).toBe('invented photochemistry group');
	});
	it('columns picks one y column; an out-of-range column is refused', () => {
		const t = 'nm,a,b,c\n' + [1, 2, 3, 4, 5].map((i) => `${300 + i},${i / 10},${(2 * i) / 10},${(3 * i) / 10}`).join('\n');
		expect(ok(parseDelimited(t, { columns: [3] })).value.map((s) => s.label)).toEqual(['c']);
		expect(parseDelimited(t, { columns: [7] }).ok).toBe(false);
	});
	it('log ε header is read as log-epsilon', () => {
		expect(ok(parseDelimited(`nm,log epsilon\n${rows(',')}`)).value[0].yUnit).toBe('log-epsilon');
	});
	it('NaN in the data is refused with its 1-based line number', () => {
		const r = parseDelimited('nm,A\n300,0.1\n301,0.2\n302,NaN\n303,0.4\n304,0.5\n305,0.6\n');
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'not_a_number', line: 4 });
	});
	it('negative %T is refused with its line number', () => {
		const r = parseDelimited('nm,%T\n300,1\n301,-0.5\n302,3\n303,4\n304,5\n');
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'negative_transmittance', line: 3 });
	});
	it('slightly negative %T (instrument noise above −0.2 %T) is read as 0 with a warning naming the line', () => {
		// common practice: spectrophotometers report small negative %T where a sample blocks completely
		const r = parseDelimited('nm,%T\n300,-0.05\n301,-0.1\n302,3\n303,4\n304,5\n');
		expect(r.ok).toBe(true);
		if (r.ok) {
			expect(r.value[0].y[0]).toBe(0);
			expect(r.warnings.find((w) => w.code === 'negative_transmittance_noise')).toMatchObject({ line: 2 });
		}
	});
	it('fewer than 5 points is refused', () => {
		const r = parseDelimited('nm,A\n300,0.1\n301,0.2\n302,0.3\n');
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues[0].code).toBe('too_few_points');
	});
	it('duplicate x with conflicting y is refused naming both lines; identical duplicates merge with a warning', () => {
		const bad = parseDelimited('nm,A\n300,0.1\n301,0.2\n301,0.25\n302,0.3\n303,0.4\n304,0.5\n');
		expect(bad.ok).toBe(false);
		if (!bad.ok) expect(bad.issues[0]).toMatchObject({ code: 'duplicate_x_conflict', line: 4 });
		const good = ok(parseDelimited('nm,A\n300,0.1\n301,0.2\n301,0.2\n302,0.3\n303,0.4\n304,0.5\n'));
		expect(good.value[0].x.length).toBe(5);
		expect(good.warnings.some((w) => w.code === 'duplicate_x_merged' && w.line === 4)).toBe(true);
	});
	it('x ≤ 0 cannot be a wavelength', () => {
		const r = parseDelimited('nm,A\n0,0.1\n301,0.2\n302,0.3\n303,0.4\n304,0.5\n');
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'x_not_positive', line: 2 });
	});
});

describe('inspectDelimited', () => {
	it('reports delimiter, decimal separator, header, first rows and column guesses', () => {
		const r = inspectDelimited(`Run 3 of invented catalyst B\n"Wavelength (nm)";"Transmittance (%)"\n${rows(';', ',')}`);
		if (!r.ok) throw new Error('preview failed');
		expect(r.value).toMatchObject({ delimiter: ';', decimalSeparator: ',', headerLine: 2, dataStartLine: 3, dataRowCount: 6 });
		expect(r.value.header).toEqual(['Wavelength (nm)', 'Transmittance (%)']);
		expect(r.value.firstRows[0]).toEqual(['300', '0,10']);
		expect(r.value.columns[0]).toMatchObject({ role: 'x', xUnit: 'nm' });
		expect(r.value.columns[1]).toMatchObject({ role: 'y', yUnit: 'transmittance-percent', kind: 'transmission' });
		expect(r.value.preamble).toEqual(['Run 3 of invented catalyst B']);
	});
});

describe('instrument exports with one x/y pair per sample', () => {
	it('pairs each y column with the wavelength column to its left and names it after the sample', () => {
		// common practice: double-beam instrument software writes "Sample,,Sample," over "Wavelength (nm),Abs,…" pairs,
		// samples of different lengths, and a method log after a blank line (invented values here)
		const text = [
			'Enone 1 mM,,Enone 2 mM,',
			'Wavelength (nm),Abs,Wavelength (nm),Abs',
			'400,0.10,400,0.20',
			'399,0.11,399,0.22',
			'398,0.12,398,0.24',
			'397,0.13,397,0.26',
			'396,0.14,396,0.28',
			'395,0.15,,',
			'394,0.16,,',
			'',
			'Method Log',
			'Scan rate,600 nm/min'
		].join('\r\n');
		const r = parseDelimited(text);
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect(r.value.map((s) => s.label)).toEqual(['Enone 1 mM', 'Enone 2 mM']);
		expect(r.value.map((s) => s.x.length)).toEqual([7, 5]);
		expect(Array.from(r.value[1].y)).toEqual([0.2, 0.22, 0.24, 0.26, 0.28]);
		expect(r.value.every((s) => s.kind === 'absorption' && s.xUnit === 'nm')).toBe(true);
	});
});

describe('photon-energy axes', () => {
	it('reads an x column in eV as λ = hc/E (not 1.5–4 as micrometres); absorbance needs no Jacobian', () => {
		const r = ok(parseDelimited('Energy (eV),Abs\n2.0,0.1\n2.5,0.2\n3.0,0.4\n3.5,0.2\n4.0,0.1\n'));
		const s = r.value[0];
		expect(s.xUnit).toBe('nm');
		// hc/e = 1239.841984 eV nm (CODATA 2018): 2.0 eV ↔ 619.92 nm, 4.0 eV ↔ 309.96 nm
		expect(s.x[0]).toBeCloseTo(619.921, 3);
		expect(s.x[4]).toBeCloseTo(309.96, 2);
		expect(Array.from(s.y)).toEqual([0.1, 0.2, 0.4, 0.2, 0.1]);
	});
	it('an emission density per eV gains the Jacobian hc/λ² when moved to per nm', () => {
		const r = ok(parseDelimited('Energy (eV),Emission (W m-2 eV-1)\n2.0,1\n2.5,2\n3.0,3\n3.5,2\n4.0,1\n'));
		const s = r.value[0];
		// I_λ = I_E·hc/λ² (change of variable); at 2.0 eV: 1239.841984/619.920992² = 3.2262e-3 per nm
		expect(s.y[0]).toBeCloseTo(1239.841984 / 619.920992 ** 2, 8);
	});
});
