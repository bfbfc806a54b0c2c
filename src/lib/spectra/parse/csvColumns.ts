/**
 * Column roles and unit guesses for a delimited table, from header names and preamble lines.
 * Header names hint units/kind: `wavelength`, `nm`, `%T`, `Abs`, `W m-2 nm-1`, `counts`, ….
 */
import type { SpectrumFileMetadata, SpectrumKind, XUnit, YUnit } from '../types';
import { parseXUnit, parseYUnit, type YUnitGuess } from '../units';
import type { DelimitedTable } from './csvTable';
import { parseConcentrationM, parseLengthCm } from './jcampMetadata';

export interface ColumnGuess {
	/** 0-based column index in the file. */
	index: number;
	name: string;
	role: 'x' | 'y' | 'skipped';
	xUnit?: XUnit;
	yUnit?: YUnit;
	kind?: SpectrumKind;
	/** Why a column is skipped (e.g. a standard-deviation column). */
	note?: string;
	guess?: YUnitGuess;
	/** y columns: the x column they pair with (instrument exports with one x/y pair per sample). */
	xColumn?: number;
	/** y columns: a sample name written above the pair's x column in the row before the header. */
	sample?: string;
}

const Y_UNITS: YUnit[] = ['absorbance', 'epsilon', 'log-epsilon', 'transmittance', 'transmittance-percent', 'relative', 'W/nm', 'W/m2/nm', 'counts'];
const X_NAME = /wave|lambda|λ|^nm$|\bnm\b|^wl|^x$|cm-1|1\/cm|µm|um\)/i;
const X_AXIS = /^\s*(wave\s*length|wavelength|lambda|λ|wavenumber|nm|cm-1|1\/cm)\b/i;
const SPECTROMETER = /integration time|spectrometer|pixels|dark spectrum|boxcar|spectra averaged/i;

/** Hints from the preamble: `# key: value` lines (our CSV export), instrument headers, other header rows. */
export function readPreamble(t: DelimitedTable): { metadata: SpectrumFileMetadata; guess?: YUnitGuess; kind?: SpectrumKind; xUnit?: XUnit; yUnit?: YUnit } {
	const metadata: SpectrumFileMetadata = {};
	let guess: YUnitGuess | undefined;
	let kind: SpectrumKind | undefined;
	let xUnit: XUnit | undefined;
	let yUnit: YUnit | undefined;
	const end = t.headerRow >= 0 ? t.headerRow : t.dataStart;
	for (let i = 0; i < end; i++) {
		const line = t.rows[i].join(t.delimiter).replace(/^#\s*/, '').trim();
		if (!line) continue;
		const kv = /^([A-Za-z][\w ./-]{0,40}?)\s*[:=]\s*(.+)$/.exec(line);
		if (kv) {
			const key = kv[1].trim().toLowerCase().replace(/\s+/g, '');
			const value = kv[2].trim();
			if (key === 'kind' && /^(absorption|transmission|emission)$/.test(value)) kind = value as SpectrumKind;
			else if (key === 'yunit' && Y_UNITS.includes(value as YUnit)) yUnit = value as YUnit;
			else if (key === 'xunit') xUnit = parseXUnit(value);
			else if (key === 'concentrationm' || key === 'concentration') {
				const c = parseConcentrationM(value);
				if (c !== undefined) metadata.concentrationM = c;
			} else if (key === 'pathcm' || key === 'pathlength') {
				const l = parseLengthCm(value);
				if (l !== undefined) metadata.pathCm = l;
			} else if (['title', 'cas', 'solvent', 'origin', 'owner', 'date', 'instrument'].includes(key)) metadata[key] = value;
			else if (key === 'spectrometers') metadata.instrument = value;
		}
		if (!guess && SPECTROMETER.test(line)) guess = { yUnit: 'counts', kind: 'emission' };
		if (!guess && t.rows[i].length >= 2) guess = t.rows[i].slice(1).map((f) => parseYUnit(f)).find((g) => g && !g.notSpectrum);
	}
	return { metadata, guess, kind, xUnit, yUnit };
}

/**
 * Guesses the x column (a wavelength-like name, else column 0) and a role/unit for every column. Exports that
 * write one x/y pair per sample ("Wavelength (nm), Abs, Wavelength (nm), Abs" with the sample names in the row
 * above) get every wavelength-like column as an x column; each y column pairs with the nearest x column to its
 * left and takes the sample name written above that x column.
 */
export function guessColumns(t: DelimitedTable, fallback?: YUnitGuess): ColumnGuess[] {
	const header = t.headerRow >= 0 ? t.rows[t.headerRow] : [];
	const names = Array.from({ length: t.nColumns }, (_, i) => (header[i] ?? '').trim());
	const xIndex = Math.max(0, names.findIndex((n) => X_NAME.test(n)));
	// further x columns: only headers that name a wavelength axis outright and no y quantity
	const xs = new Set([xIndex, ...names.map((n, i) => (i > xIndex && X_AXIS.test(n) && !parseYUnit(n) ? i : -1)).filter((i) => i >= 0)]);
	const above = t.headerRow > 0 ? t.rows[t.headerRow - 1] : [];
	const sampleOf = (x: number) => (xs.size > 1 ? (above[x] ?? '').trim() || undefined : undefined);
	return names.map((name, index) => {
		if (xs.has(index)) return { index, name, role: 'x', xUnit: parseXUnit(name) };
		const g = parseYUnit(name);
		if (g?.notSpectrum) return { index, name, role: 'skipped', note: `"${name}" is not a spectrum (uncertainty column)` };
		let pair = xIndex;
		for (const x of xs) if (x < index && x > pair) pair = x;
		if (pair > index) pair = xIndex;
		const use = g ?? fallback;
		return { index, name, role: 'y', yUnit: use?.yUnit, kind: use?.kind, guess: use, xColumn: pair, sample: sampleOf(pair) };
	});
}
