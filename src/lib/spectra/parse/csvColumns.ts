/**
 * Preamble and column roles of a delimited table (columns-as-spectra layout).
 *
 * Preamble: `# key: value` lines (our CSV export), key–value blocks (`XUNITS<TAB>NANOMETERS`, `YUNITS = ABSORBANCE`),
 * instrument headers (integration time, pixels…) and marker lines. An instrument header only says *that* a
 * spectrometer wrote the file; whether the numbers are absorbance or counts is decided from the numbers.
 *
 * Columns: the x axis (a wavelength-like name, else column 1), further x columns of paired exports, repeated axis
 * columns (the same x in another unit: role 'axis'), y columns with the unit their header states, and columns that
 * are not spectra (uncertainties, constants, all zeros, the same spectrum again in another unit: role 'skipped',
 * offered unticked with the reason).
 */
import type { SpectrumFileMetadata, SpectrumKind, XUnit, YUnit } from '../types';
import { parseXUnit, parseYUnit } from '../units';
import type { DelimitedTable } from './csvTable';
import { isAxisName, KIND_OF_Y, toNm, X_UNIT_NAMES, xUnitOfHeader, yUnitOfHeader, type HeaderXUnit, type HeaderYUnit } from './csvUnits';
import { parseConcentrationM, parseLengthCm } from './jcampMetadata';
import { parseNumberField } from './numbers';

export interface ColumnGuess {
	/** 0-based column index in the file. */
	index: number;
	name: string;
	/** x: an axis y columns pair with; axis: the same axis again in another unit; skipped: offered unticked with `note`. */
	role: 'x' | 'axis' | 'y' | 'skipped';
	/** x columns: the unit as the reader uses it (Å and eV are converted to nm). */
	xUnit?: XUnit;
	/** x columns: the unit the header states, when it states one. */
	headerXUnit?: HeaderXUnit;
	yUnit?: YUnit;
	kind?: SpectrumKind;
	/** Why a column is skipped or is an axis. */
	note?: string;
	guess?: HeaderYUnit;
	/** y columns: the x column they pair with (instrument exports with one x/y pair per sample). */
	xColumn?: number;
	/** y columns: a sample name written above the pair's x column in the row before the header. */
	sample?: string;
	/** The column is ticked for import by default. */
	ticked?: boolean;
}

export interface Preamble {
	metadata: SpectrumFileMetadata;
	guess?: HeaderYUnit;
	kind?: SpectrumKind;
	xUnit?: HeaderXUnit;
	yUnit?: YUnit;
	/** A spectrometer header block is present (integration time, pixels, averaging…). */
	instrumentHeader: boolean;
	/** Key–value lines read (for the preview). */
	keyValues: { key: string; value: string; line: number }[];
}

const API_Y_UNITS: YUnit[] = ['absorbance', 'epsilon', 'log-epsilon', 'transmittance', 'transmittance-percent', 'reflectance', 'reflectance-percent', 'relative', 'W/nm', 'W/m2/nm', 'umol/s/nm', 'umol/m2/s/nm', 'counts'];
const SPECTROMETER = /integration time|spectrometer|pixels|dark spectrum|boxcar|spectra averaged|scans to average/i;
const normKey = (k: string) => k.toLowerCase().replace(/^#+/, '').replace(/[^a-z0-9]/g, '');

/** Reads the lines above the header (or above the data when there is no header). */
export function readPreamble(t: DelimitedTable): Preamble {
	const pre: Preamble = { metadata: {}, instrumentHeader: false, keyValues: [] };
	const end = t.headerRow >= 0 ? t.headerRow : t.dataStart;
	for (let i = 0; i < end; i++) {
		const fields = t.rows[i];
		const line = fields.join(t.delimiter === ' ' ? ' ' : t.delimiter).replace(/^#\s*/, '').trim();
		if (!line) continue;
		let key: string | undefined;
		let value: string | undefined;
		const kv = /^([A-Za-z][\w ./-]{0,40}?)(?:\s*[:=]\s*|\t+)(.*)$/.exec(line);
		if (kv) [key, value] = [kv[1], kv[2]];
		else if (t.delimiter !== ' ' && fields.length >= 2 && /^[A-Za-z#]/.test(fields[0].trim())) [key, value] = [fields[0], fields.slice(1).join(' ')];
		else if (t.delimiter === ' ' && /^[A-Z][A-Z /_-]{1,40}$/.test(fields[0] ?? '') && fields.length === 2) [key, value] = [fields[0], fields[1]];
		if (key !== undefined && value !== undefined) {
			value = value.trim();
			const k = normKey(key);
			if (value) pre.keyValues.push({ key: key.trim(), value, line: i + 1 });
			if (!value) {
				/* empty key (TITLE<TAB>) */
			} else if (k === 'kind' && /^(absorption|transmission|emission|reflectance)$/.test(value)) pre.kind = value as SpectrumKind;
			else if (['yunit', 'yunits', 'yaxis', 'yaxisunit', 'ordinate', 'ordinateunit'].includes(k)) {
				if (API_Y_UNITS.includes(value as YUnit)) pre.yUnit = value as YUnit;
				else {
					const g = yUnitOfHeader(value);
					if (g && !g.notSpectrum) pre.guess = g;
				}
			} else if (['xunit', 'xunits', 'xaxis', 'xaxisunit', 'abscissa', 'abscissaunit'].includes(k)) pre.xUnit = xUnitOfHeader(value) ?? parseXUnit(value);
			else if (k === 'concentrationm' || k === 'concentration') {
				const c = parseConcentrationM(value);
				if (c !== undefined) pre.metadata.concentrationM = c;
			} else if (k === 'pathcm' || k === 'pathlength') {
				const l = parseLengthCm(value);
				if (l !== undefined) pre.metadata.pathCm = l;
			} else if (['title', 'cas', 'solvent', 'origin', 'owner', 'date', 'instrument'].includes(k)) pre.metadata[k] = value;
			else if (k === 'spectrometers' || k === 'spectrometerdatasystem' || k === 'spectrometer') pre.metadata.instrument = value;
		}
		if (SPECTROMETER.test(line)) pre.instrumentHeader = true;
		// a row of column names above the header (e.g. "Wavelength.,W.m2" over "Wavelength(nm),W/m2")
		if (!pre.guess && t.delimiter !== ' ' && fields.length >= 2 && fields.length <= t.nColumns) {
			const g = fields.slice(1).map((f) => yUnitOfHeader(f)).find((g) => g && !g.notSpectrum);
			if (g) pre.guess = g;
		}
	}
	return pre;
}

/** Numbers of one column over the data rows (NaN where blank or not a number). */
export function columnValues(t: DelimitedTable, c: number): Float64Array {
	const out = new Float64Array(t.dataEnd - t.dataStart + 1);
	for (let i = t.dataStart, k = 0; i <= t.dataEnd; i++, k++) out[k] = parseNumberField(t.rows[i]?.[c] ?? '', t.decimalComma);
	return out;
}

/** The x unit that fits the numbers when the header does not say (nm, µm, cm⁻¹ ranges of UV–vis–NIR). */
function unitFromRange(v: Float64Array): HeaderXUnit {
	let min = Infinity, max = -Infinity;
	for (const x of v) if (Number.isFinite(x)) { if (x < min) min = x; if (x > max) max = x; }
	if (min >= 100 && max <= 5000) return 'nm';
	if (min >= 0.1 && max <= 5) return 'um';
	if (min >= 2000 && max <= 100000) return 'cm-1';
	return 'nm';
}

/** True when `b` is the axis `a` again (same wavelengths within 0.1 % after unit conversion). */
function sameAxis(a: Float64Array, ua: HeaderXUnit, b: Float64Array, ub: HeaderXUnit): boolean {
	let n = 0;
	for (let i = 0; i < a.length; i++) {
		if (!Number.isFinite(a[i]) || !Number.isFinite(b[i])) {
			if (Number.isFinite(a[i]) !== Number.isFinite(b[i])) return false;
			continue;
		}
		const x = toNm(a[i], ua), y = toNm(b[i], ub);
		if (!(Math.abs(x - y) <= 1e-3 * Math.abs(x) + 1e-6)) return false;
		n++;
	}
	return n >= 3;
}

const READER_X: Record<HeaderXUnit, XUnit> = { nm: 'nm', um: 'um', 'cm-1': 'cm-1', angstrom: 'nm', ev: 'nm' };

/**
 * Guesses the role and unit of every column (columns-as-spectra layout).
 * @param fallback - y unit for columns whose header says nothing (the preamble's, or the other columns' consensus)
 */
export function guessColumns(t: DelimitedTable, fallback?: HeaderYUnit, pre?: Preamble): ColumnGuess[] {
	const header = t.headerRow >= 0 ? t.rows[t.headerRow] : [];
	const names = Array.from({ length: t.nColumns }, (_, i) => (header[i] ?? '').trim());
	const values = names.map((_, i) => columnValues(t, i));
	const named = names.map((n) => (n && isAxisName(n) && !yClaims(n)) || (!!n && !!xUnitOfHeader(n) && !yUnitOfHeader(n) && !/\d{3}/.test(n)));
	let xIndex = named.findIndex(Boolean);
	if (xIndex < 0) xIndex = 0;
	const unitOf = (i: number): HeaderXUnit => xUnitOfHeader(names[i]) ?? (i === xIndex ? pre?.xUnit : undefined) ?? unitFromRange(values[i]);
	const xs: number[] = [xIndex];
	const axisOf = new Map<number, number>();
	for (let i = 0; i < names.length; i++) {
		if (i === xIndex) continue;
		const candidate = named[i];
		// an axis again in another unit, named or not (nm next to µm, wavenumber next to wavelength)
		const units: HeaderXUnit[] = candidate && xUnitOfHeader(names[i]) ? [unitOf(i)] : ['nm', 'um', 'cm-1', 'angstrom', 'ev'];
		const repeat = xs.find((x) => units.some((u) => sameAxis(values[x], unitOf(x), values[i], u)));
		if (repeat !== undefined && (candidate || !yUnitOfHeader(names[i]))) axisOf.set(i, repeat);
		else if (candidate && i > xIndex) xs.push(i);
	}
	const above = t.headerRow > 0 ? t.rows[t.headerRow - 1] : [];
	const sampleOf = (x: number) => (xs.length > 1 ? (above[x] ?? '').trim() || undefined : undefined);
	const cols = names.map((name, index): ColumnGuess => {
		if (xs.includes(index)) {
			const u = unitOf(index);
			return { index, name, role: 'x', xUnit: READER_X[u], headerXUnit: xUnitOfHeader(name) ?? (index === xIndex ? pre?.xUnit : undefined) };
		}
		const rep = axisOf.get(index);
		if (rep !== undefined) return { index, name, role: 'axis', note: `the axis of column ${rep + 1} again${xUnitOfHeader(name) ? ` in ${X_UNIT_NAMES[xUnitOfHeader(name)!]}` : ''}, not a spectrum`, ticked: false };
		const g = yUnitOfHeader(name);
		if (g?.notSpectrum) return { index, name, role: 'skipped', note: `"${name}" is not a spectrum (uncertainty column)`, ticked: false };
		let pair = xIndex;
		for (const x of xs) if (x < index && x > pair) pair = x;
		if (pair > index) pair = xIndex;
		const use = g ?? fallback;
		const flat = flatNote(values[index], t.decimalComma);
		if (flat) return { index, name, role: 'skipped', note: flat, yUnit: use?.yUnit, kind: use?.kind, guess: use, xColumn: pair, sample: sampleOf(pair), ticked: false };
		return { index, name, role: 'y', yUnit: use?.yUnit, kind: use ? KIND_OF_Y[use.yUnit] : undefined, guess: use, xColumn: pair, sample: sampleOf(pair), ticked: true };
	});
	markRepeatedSpectra(cols, values);
	return cols;
}

/**
 * The same spectrum twice in two units (W m⁻² µm⁻¹ and W m⁻² nm⁻¹ on one axis): the later column is skipped.
 * Equal when every value agrees within 1 % after scaling (the two columns are usually rounded differently).
 */
function markRepeatedSpectra(cols: ColumnGuess[], values: Float64Array[]) {
	const ys = cols.filter((c) => c.role === 'y' && c.guess);
	for (let j = 1; j < ys.length; j++) {
		const b = ys[j];
		const a = ys.slice(0, j).find((a) => a.role === 'y' && a.xColumn === b.xColumn && a.guess!.yUnit === b.guess!.yUnit && a.guess!.scale !== b.guess!.scale && equalScaled(values[a.index], a.guess!.scale, values[b.index], b.guess!.scale));
		if (a) Object.assign(b, { role: 'skipped', ticked: false, note: `the spectrum of column ${a.index + 1} again in another unit, not a second spectrum` });
	}
}

function equalScaled(a: Float64Array, sa: number, b: Float64Array, sb: number): boolean {
	let n = 0;
	for (let i = 0; i < a.length; i++) {
		const x = a[i] * sa, y = b[i] * sb;
		if (!Number.isFinite(x) || !Number.isFinite(y)) {
			if (Number.isFinite(x) !== Number.isFinite(y)) return false;
			continue;
		}
		if (Math.abs(x - y) > 0.01 * Math.max(Math.abs(x), Math.abs(y)) + 1e-12) return false;
		n++;
	}
	return n >= 3;
}

/** A header that names a y quantity as well as an axis word ("Absorbance at wavelength") is a y column. */
function yClaims(n: string) {
	const g = yUnitOfHeader(n);
	return !!g && !g.notSpectrum && !/^\s*(wave|lambda|λ|nm)/i.test(n);
}

/** "all values are 0" / "the same value on every line" for columns that carry no spectrum. */
function flatNote(v: Float64Array, decimalComma: boolean): string | undefined {
	let first: number | undefined;
	let count = 0;
	for (const x of v) {
		if (!Number.isFinite(x)) continue;
		count++;
		if (first === undefined) first = x;
		else if (x !== first) return undefined;
	}
	if (first === undefined || count < 2) return undefined;
	if (first === 0) return 'all values are 0 (an empty or reference channel), not a spectrum';
	const shown = Math.abs(first) < 1e-3 ? first.toExponential() : String(first);
	return `the same value ${decimalComma ? shown.replace('.', ',') : shown} on every line (a parameter such as a concentration or path length), not a spectrum`;
}

/** Consensus y unit of the columns whose headers state one (undefined when none or when they disagree). */
export function columnConsensus(cols: ColumnGuess[]): HeaderYUnit | undefined {
	const ys = cols.filter((c) => c.role === 'y');
	const stated = ys.filter((c) => c.name && yUnitOfHeader(c.name) && !yUnitOfHeader(c.name)!.notSpectrum).map((c) => yUnitOfHeader(c.name)!);
	// at least half of the y columns state one unit and none states another (one %T column among four "A …" ones says nothing about them)
	if (!stated.length || stated.length * 2 < ys.length) return undefined;
	return stated.every((g) => g.yUnit === stated[0].yUnit && g.scale === stated[0].scale) ? stated[0] : undefined;
}

export { parseYUnit };
