/**
 * Delimited-text exports as people have them: every file in ../shared/external/csv-variety/ with the outcome its
 * MANIFEST.md row asks for (values there were read independently, file by file), plus invented inputs for the
 * physical refusals (422) and the non-optical tables (415).
 */
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { deriveSpectrum } from '../derive';
import { normaliseSpectrum } from '../normalise';
import { norm, parseExternal, readExternal } from '../__fixtures__/external';
import { parseSpectrumFile } from './index';
import { inspectDelimited } from './csvInspect';
import { parseDelimited } from './csv';

const maxOf = (s: { x: ArrayLike<number>; y: ArrayLike<number> }) => {
	let k = 0;
	for (let i = 1; i < s.y.length; i++) if (s.y[i] > s.y[k]) k = i;
	return { x: s.x[k], y: s.y[k] };
};
const enc = (t: string) => new TextEncoder().encode(t);

describe('csv-variety/absorbance-key-value-header.txt (wright-group/WrightTools, JASCO dataset, MIT)', () => {
	const r = parseExternal('csv-variety/absorbance-key-value-header.txt');
	it('MANIFEST: 1 spectrum, 1801 points 2500 → 700 nm; the header’s XUNITS/YUNITS win: absorption/absorbance', () => {
		expect(r.value).toHaveLength(1);
		const s = r.value[0];
		expect(s.kind).toBe('absorption');
		expect(s.yUnit).toBe('absorbance');
		expect(s.xUnit).toBe('nm');
		expect(s.x.length).toBe(1801);
		expect(s.x[0]).toBe(2500);
		expect(s.x[1800]).toBe(700);
		expect(r.warnings.some((w) => w.code === 'y_unit_assumed' || w.code === 'x_unit_assumed')).toBe(false);
	});
	it('MANIFEST: absorbance 0.108–1.581 (header MINY 0.10755, MAXY 1.58144)', () => {
		const s = norm(r.value[0]);
		expect(Math.min(...s.y)).toBeCloseTo(0.10755, 5);
		expect(Math.max(...s.y)).toBeCloseTo(1.58144, 5);
	});
});

describe('csv-variety/irradiance-space-delimited-72-spectra.txt (aphalo/photobiologySun, HU_Robson data, GPL ≥ 2)', () => {
	const r = parseExternal('csv-variety/irradiance-space-delimited-72-spectra.txt');
	it('MANIFEST: space-delimited, quoted header: 72 spectra × 1425 points, 250.22–899.86 nm', () => {
		expect(r.value).toHaveLength(72);
		expect(r.value.every((s) => s.x.length === 1425 && s.x[0] === 250.22 && s.x[1424] === 899.86)).toBe(true);
		expect(r.value[0].label).toBe('BPf1sun00000');
		expect(r.value[71].label).toBe('BPf1sun00071');
	});
	it('MANIFEST: first column max 0.6475 at 535.79 nm; every column the same kind (emission, W m⁻² nm⁻¹)', () => {
		const m = maxOf(norm(r.value[0]));
		expect(m.x).toBe(535.79);
		expect(m.y).toBeCloseTo(0.6475, 4);
		expect(new Set(r.value.map((s) => `${s.kind}/${s.yUnit}`))).toEqual(new Set(['emission/W/m2/nm']));
	});
	it('the preview reports the whitespace delimiter and one spectrum per column', () => {
		const t = inspectDelimited(new TextDecoder().decode(readExternal('csv-variety/irradiance-space-delimited-72-spectra.txt')));
		expect(t.ok && t.value.delimiter).toBe(' ');
		expect(t.ok && t.value.layout).toBe('columns');
	});
});

describe('csv-variety/solar-am0-micrometres-w-per-m2-per-um.csv (aphalo/photobiologySun, ASTM E-490 reference data)', () => {
	const r = parseExternal('csv-variety/solar-am0-micrometres-w-per-m2-per-um.csv');
	it('MANIFEST: two spectra; the repeated axis columns are axes and the W m⁻² nm⁻¹ column repeats the W m⁻² µm⁻¹ one', () => {
		expect(r.value.map((s) => s.column)).toEqual([1, 4]);
		expect(r.warnings.some((w) => /column 4 .*axis of column 3/.test(w.message))).toBe(true);
		expect(r.warnings.some((w) => /column 6 .*spectrum of column 5 again/.test(w.message))).toBe(true);
	});
	it('MANIFEST: x in nm = 1000 × µm; E-490 peak 2144 W m⁻² µm⁻¹ = 2.144 W m⁻² nm⁻¹ at 450.5 nm', () => {
		const s = norm(r.value[0]);
		expect(s.yUnit).toBe('W/m2/nm');
		expect(s.x[0]).toBeCloseTo(119.5, 9);
		const m = maxOf(s);
		expect(m.x).toBeCloseTo(450.5, 9);
		expect(m.y).toBeCloseTo(2.144, 9);
	});
	it('the far-IR tail past 100 µm (300, 400, 1000 µm …) is dropped with a warning naming its lines', () => {
		const w = r.warnings.find((w) => w.code === 'x_tail_dropped');
		expect(w?.message).toMatch(/lines \d+–\d+/);
		expect(Math.max(...norm(r.value[0]).x)).toBeLessThanOrEqual(100_000);
	});
	it('the second spectrum (Wehrli, W m⁻² µm⁻¹ on the nm/µm axes) is stored per nm: 0.005 W m⁻² nm⁻¹ at 199.5 nm (file column 6)', () => {
		const s = norm(r.value[1]);
		expect(s.x[0]).toBeCloseTo(199.5, 9);
		expect(s.y[0]).toBeCloseTo(0.005, 12);
	});
});

describe('csv-variety/optical-constants-n-k-not-a-spectrum.csv (Arghantyr/LSPR-glass-transmittance, MIT)', () => {
	it('MANIFEST: not a spectrum — refused as optical constants (HTTP 415), never two "absorbance" spectra', () => {
		const r = parseSpectrumFile(readExternal('csv-variety/optical-constants-n-k-not-a-spectrum.csv'), 'n-k.csv');
		expect(r.ok).toBe(false);
		if (!r.ok) {
			expect(r.issues[0].code).toBe('optical_constants_table');
			expect(r.issues[0].message).toMatch(/"n" and "k"/);
			expect(r.issues[0].line).toBe(1);
		}
	});
});

describe('csv-variety/absorbance-comma-control.txt (wright-group/WrightTools, Shimadzu dataset, MIT)', () => {
	it('MANIFEST: headerless comma table, 821 points 340–750 nm, max 0.2349 at 441.5 nm', () => {
		const r = parseExternal('csv-variety/absorbance-comma-control.txt');
		expect(r.value).toHaveLength(1);
		const s = norm(r.value[0]);
		expect(s.x.length).toBe(821);
		expect([s.x[0], s.x[820]]).toEqual([340, 750]);
		const d = deriveSpectrum(s);
		expect(d.lambdaMaxNm).toBe(441.5);
		expect(d.valueAtMax).toBeCloseTo(0.2349, 4);
	});
});

describe('physically impossible values after unit conversion (HTTP 422, naming the column and the line)', () => {
	const grid = (f: (i: number) => string) => Array.from({ length: 8 }, (_, i) => f(i)).join('\n');
	it('%T without a header is not read as absorbance (values up to 99.6)', () => {
		// the %T of an invented filter, written without a header
		const r = parseDelimited(grid((i) => `${300 + 10 * i},${(12.5 * i + 12.1).toFixed(1)}`));
		expect(r.ok).toBe(false);
		if (!r.ok) {
			expect(r.issues[0]).toMatchObject({ code: 'implausible_absorbance', line: 8 });
			expect(r.issues[0].message).toMatch(/column 2.*look like %T/);
		}
	});
	it('detector counts without a unit and without a spectrometer header are not absorbance', () => {
		const r = parseDelimited('nm,S1\n' + grid((i) => `${400 + i},${20000 + 5000 * i}`));
		expect(!r.ok && r.issues[0].code).toBe('implausible_absorbance');
	});
	it('the caller saying which quantity it is resolves it (yUnit counts → emission)', () => {
		const r = parseDelimited('nm,S1\n' + grid((i) => `${400 + i},${20000 + 5000 * i}`), { yUnit: 'counts' });
		expect(r.ok && r.value[0].kind).toBe('emission');
	});
	it('a spectrometer header with absorbance-sized values is absorption; with counts-sized values, emission counts', () => {
		const head = 'Spectrometer: invented fibre unit FX-1\nIntegration Time (sec): 0.1\n>>>>>Begin Spectral Data<<<<<\n';
		const a = parseDelimited(head + grid((i) => `${400 + i}\t${(0.1 * i).toFixed(2)}`));
		expect(a.ok && a.value[0].kind).toBe('absorption');
		const c = parseDelimited(head + grid((i) => `${400 + i}\t${2000 + 100 * i}`));
		expect(c.ok && [c.value[0].kind, c.value[0].yUnit]).toEqual(['emission', 'counts']);
	});
	it('transmittance stated as a fraction above 1.05 is refused', () => {
		const r = parseDelimited('nm,T\n' + grid((i) => `${400 + i},${(1.0 + 0.02 * i).toFixed(2)}`));
		expect(!r.ok && r.issues[0].code).toBe('implausible_transmittance');
	});
	it('x of 1e-300 nm (or any x outside 100 nm – 100 µm after conversion) is refused with its line', () => {
		const r = parseDelimited('Wavelength (nm),Abs\n1e-300,0.1\n' + grid((i) => `${400 + i},0.${i + 1}`));
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'x_out_of_range', line: 2 });
		const um = parseDelimited('Wavelength (µm),Abs\n' + grid((i) => `${200 + i},0.${i + 1}`), { xUnit: 'um' });
		expect(!um.ok && um.issues[0].code).toBe('x_out_of_range');
	});
	it('a value that overflows a double (1e999) is refused as not finite, naming the line', () => {
		const r = parseDelimited('Wavelength (nm),W m-2 nm-1\n400,1\n401,2\n402,1e999\n403,2\n404,1\n405,2\n');
		expect(!r.ok && r.issues[0]).toMatchObject({ code: 'not_finite_after_conversion', line: 4 });
	});
	it('ε above 10⁶ M⁻¹ cm⁻¹, and an A/(c·l) that overflows, are refused naming the column', () => {
		const e = parseDelimited('nm,epsilon (M-1 cm-1)\n' + grid((i) => `${400 + i},${2e6 + i}`));
		expect(!e.ok && e.issues[0].code).toBe('implausible_epsilon');
		const r = parseSpectrumFile(enc('nm,Abs\n' + grid((i) => `${400 + i},0.${i + 1}`)), 'a.csv', { concentrationM: 1e-300, pathCm: 1e-300 });
		expect(!r.ok && r.issues[0].code).toBe('implausible_epsilon');
	});
});

describe('non-optical tables are refused with the reason (HTTP 415)', () => {
	it.each([
		['Time (s),Concentration (mM)', 'time'],
		['Temperature (°C),Abs', 'temperature'],
		['Potential (V vs SCE),Current (µA)', 'potential']
	])('%s → a %s table', (header, what) => {
		const r = parseSpectrumFile(enc(`${header}\n` + [1, 2, 3, 4, 5, 6].map((i) => `${i * 10},0.${i}`).join('\n')), 'table.csv');
		expect(r.ok).toBe(false);
		if (!r.ok) {
			expect(r.issues[0].code).toBe('not_optical_table');
			expect(r.issues[0].message).toContain(`${what} table`);
			expect(r.issues[0].line).toBe(1);
		}
	});
});

describe('reflectance is its own kind, never absorbance', () => {
	it('%R is stored as reflectance 0–1', () => {
		const r = parseDelimited('Wavelength (nm),%R\n' + [0, 1, 2, 3, 4, 5].map((i) => `${400 + 20 * i},${96 + i * 0.8}`).join('\n'));
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect([r.value[0].kind, r.value[0].yUnit]).toEqual(['reflectance', 'reflectance-percent']);
		const n = normaliseSpectrum(r.value[0]);
		expect(n.ok && [n.value.yUnit, n.value.y[0]]).toEqual(['reflectance', 0.96]);
	});
	it('asking for absorption on a reflectance column is refused by the normaliser (unit_kind_mismatch)', () => {
		const r = parseDelimited('nm,Reflectance\n' + [0, 1, 2, 3, 4, 5].map((i) => `${400 + 20 * i},0.${5 + i}`).join('\n'), { kind: 'absorption' });
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		const n = normaliseSpectrum(r.value[0]);
		expect(!n.ok && n.issues[0].code).toBe('unit_kind_mismatch');
	});
});

describe('axis and parameter columns are not spectra (offered unticked with the reason)', () => {
	it('a Wavenumbers [1/cm] column, constant concentration and path columns and an all-zero reference are skipped', () => {
		const rows = [0, 1, 2, 3, 4, 5, 6].map((i) => {
			const nm = 300 + 10 * i;
			return [nm, (1e7 / nm).toFixed(4), (0.2 + 0.05 * i).toFixed(3), '2.5e-5', '1', '0'].join(',');
		});
		const text = ['Wavelength (nm),Wavenumbers [1/cm],Abs,Concentration (M),Path (cm),Reference', ...rows].join('\n');
		const r = parseDelimited(text);
		expect(r.ok && r.value.map((s) => s.column)).toEqual([2]);
		const p = inspectDelimited(text);
		expect(p.ok && p.value.columns.map((c) => [c.role, c.ticked ?? null])).toEqual([['x', null], ['axis', false], ['y', true], ['skipped', false], ['skipped', false], ['skipped', false]]);
		expect(p.ok && p.value.columns[5].note).toMatch(/all values are 0/);
		// ticking a skipped column explicitly imports it
		expect(parseDelimited(text, { columns: [3] }).ok).toBe(true);
	});
});

describe('file name in messages appears once (the API envelope adds it)', () => {
	it('an empty file says so without the name', () => {
		const r = parseSpectrumFile(new Uint8Array(), path.basename('x.csv'));
		expect(!r.ok && r.issues[0].message).toBe('the file is empty');
	});
});

describe('the n, k table as a wall material (T = (1 − R)²·exp(−4πkd/λ), Born & Wolf; walls.ts)', () => {
	it('csv-variety/optical-constants-n-k-not-a-spectrum.csv: 146 wavelengths 250–1700 nm; 1 mm at 250 nm transmits 66.6 %', async () => {
		const { readOpticalConstantsTable } = await import('./csvOpticalConstants');
		const { wallTransmission } = await import('../../irradiation/walls');
		const r = readOpticalConstantsTable(new TextDecoder().decode(readExternal('csv-variety/optical-constants-n-k-not-a-spectrum.csv')));
		if (!r.ok) throw new Error(JSON.stringify(r.issues));
		expect(r.value.wavelengthNm.length).toBe(146);
		expect([r.value.wavelengthNm[0], r.value.wavelengthNm[145]]).toEqual([250, 1700]);
		// file line 2: 0.25 µm, n 1.589, k 5.97e-6 → R = (0.589/2.589)² = 0.05176; 4πkd/λ = 4π·5.97e-6·1e6 nm/250 nm = 0.3001;
		// with the file's n at 250 nm: T = (1 − 0.05176)²·e^−0.3001 = 0.6661 (hand calculation from the MANIFEST formula)
		const model = { model: 'k' as const, kTable: { wavelengthNm: r.value.wavelengthNm, k: r.value.k }, n: 1.589 };
		expect(wallTransmission(model, 1, 250)).toBeCloseTo(0.6661, 3);
		// n for the reflection loss: the table's n at 589.3 nm lies between its 580 and 590 nm rows
		expect(r.value.nForFresnel).toBeGreaterThan(1.5);
		expect(r.value.nForFresnel).toBeLessThan(1.53);
	});
});
