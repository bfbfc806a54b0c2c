/**
 * JCAMP-DX 4.24 export (McDonald & Wilks, Appl. Spectrosc. 42, 151, 1988). A spectrum on a uniform x grid is
 * written as `##XYDATA=(X++(Y..Y))`: ordinates as AFFN integers scaled by YFACTOR (14 significant digits of the
 * largest |y|, exact in a double), each line starting with its abscissa, lines ≤ 80 characters; FIRSTX, LASTX,
 * DELTAX, FIRSTY, LASTY (the first and last ordinates, as the standard defines them), MINY, MAXY, XFACTOR, YFACTOR and
 * NPOINTS describe exactly what is written. A spectrum on an irregular grid (a digitised curve, an array
 * spectrometer) cannot be (X++(Y..Y)) and is written as `##XYPOINTS=(XY..XY)`, still continuous data, never a peak
 * table. Several spectra become one LINK file with a block per spectrum.
 */
import type { NormalisedSpectrum, SpectrumFileMetadata } from '../types';
import { JCAMP_DATA_TYPE, JCAMP_Y_UNITS } from './labels';

const text = (v: unknown) => (v === undefined || v === null ? undefined : String(v).replace(/[\r\n]+/g, ' ').replace(/\$\$/g, '$ $').trim());

/** Shortest decimal that reads back as the same double, without an exponent (JCAMP AFFN readers differ on E). */
export function plainDecimal(v: number): string {
	if (!Number.isFinite(v)) throw new RangeError(`cannot write ${v} in a JCAMP-DX file`);
	const s = String(v);
	if (!/e/i.test(s)) return s;
	const [mant, expPart] = s.split(/e/i);
	const exp = Number(expPart);
	const neg = mant.startsWith('-');
	const digits = mant.replace(/^-/, '').replace('.', '');
	const point = mant.replace(/^-/, '').indexOf('.') < 0 ? mant.replace(/^-/, '').length : mant.replace(/^-/, '').indexOf('.');
	const at = point + exp;
	const body = at <= 0 ? `0.${'0'.repeat(-at)}${digits}` : at >= digits.length ? digits + '0'.repeat(at - digits.length) : `${digits.slice(0, at)}.${digits.slice(at)}`;
	return (neg ? '-' : '') + body;
}

/** Relative tolerance for a grid to count as uniform (x_i within 1e-7 steps of FIRSTX + i·DELTAX). */
const UNIFORM_TOL = 1e-7;

/** True when x is equally spaced (within UNIFORM_TOL of a step). */
export function isUniform(x: ArrayLike<number>): boolean {
	const n = x.length;
	if (n < 3) return n > 0;
	const dx = (x[n - 1] - x[0]) / (n - 1);
	if (!(Math.abs(dx) > 0)) return false;
	for (let i = 1; i < n - 1; i++) if (Math.abs(x[i] - (x[0] + i * dx)) > UNIFORM_TOL * Math.abs(dx)) return false;
	return true;
}

/** The labelled data records of the header (title, units, metadata), without data. */
function headerRecords(spec: NormalisedSpectrum, metadata: SpectrumFileMetadata, extra: [string, string | undefined][] = []): string[] {
	const out: string[] = [];
	const add = (label: string, v: unknown) => {
		const t = text(v);
		if (t !== undefined && t !== '') out.push(`##${label}=${t}`);
	};
	add('TITLE', text(metadata.title) || 'spectrum');
	out.push('##JCAMP-DX=4.24');
	add('DATA TYPE', JCAMP_DATA_TYPE[spec.kind]);
	for (const [k, v] of extra) add(k, v);
	add('ORIGIN', text(metadata.origin) || 'Windowsill');
	add('OWNER', text(metadata.owner) || '');
	if (!out.some((l) => l.startsWith('##OWNER='))) out.push('##OWNER=');
	add('DATE', metadata.date);
	add('CAS REGISTRY NO', metadata.cas);
	add('SOLVENT NAME', metadata.solvent);
	add('CONCENTRATIONS', metadata.concentrationM === undefined ? undefined : `${plainDecimal(metadata.concentrationM)} M`);
	add('PATH LENGTH', metadata.pathCm === undefined ? undefined : `${plainDecimal(metadata.pathCm)} cm`);
	add('$KIND', spec.kind);
	add('XUNITS', 'NANOMETERS');
	add('YUNITS', JCAMP_Y_UNITS[spec.yUnit]);
	return out;
}

/** YFACTOR: a power of ten that scales max |y| to at most 10^14 (integers exact in a double; 0 data → 1). */
function yFactorFor(y: ArrayLike<number>): number {
	let max = 0;
	for (let i = 0; i < y.length; i++) max = Math.max(max, Math.abs(y[i]));
	if (!(max > 0)) return 1;
	return 10 ** (Math.floor(Math.log10(max)) - 13);
}

/** Factor as written in the file (reads back as the same double through Number()). */
const factorText = (f: number) => (f === 1 ? '1' : f.toExponential().replace('e', 'E'));

/** The data records of one spectrum (from the ##XUNITS-dependent records to the last data line). */
function dataRecords(spec: NormalisedSpectrum): string[] {
	const n = spec.x.length;
	if (!n) throw new RangeError('a spectrum without points cannot be exported');
	const out: string[] = [];
	let minY = Infinity, maxY = -Infinity;
	for (let i = 0; i < n; i++) {
		if (!Number.isFinite(spec.x[i]) || !Number.isFinite(spec.y[i])) throw new RangeError(`point ${i + 1} is not finite`);
		minY = Math.min(minY, spec.y[i]);
		maxY = Math.max(maxY, spec.y[i]);
	}
	const firstX = spec.x[0], lastX = spec.x[n - 1];
	const common = [`##FIRSTX=${plainDecimal(firstX)}`, `##LASTX=${plainDecimal(lastX)}`, `##MINX=${plainDecimal(Math.min(firstX, lastX))}`, `##MAXX=${plainDecimal(Math.max(firstX, lastX))}`];
	if (!isUniform(spec.x)) {
		out.push(...common, '##XFACTOR=1', '##YFACTOR=1', `##FIRSTY=${plainDecimal(spec.y[0])}`, `##LASTY=${plainDecimal(spec.y[n - 1])}`, `##MINY=${plainDecimal(minY)}`, `##MAXY=${plainDecimal(maxY)}`, `##NPOINTS=${n}`);
		out.push('##XYPOINTS=(XY..XY)');
		for (let i = 0; i < n; i++) out.push(`${plainDecimal(spec.x[i])}, ${plainDecimal(spec.y[i])}`);
		return out;
	}
	const yf = yFactorFor(spec.y);
	const ints = Array.from(spec.y, (v) => Math.round(v / yf));
	// FIRSTY/LASTY/MINY/MAXY state what a reader gets back: the written integers times YFACTOR.
	const back = (k: number) => plainDecimal(Number((k * yf).toPrecision(15)));
	const dx = n > 1 ? (lastX - firstX) / (n - 1) : 0;
	out.push(...common, n > 1 ? `##DELTAX=${plainDecimal(dx)}` : '##DELTAX=0', '##XFACTOR=1', `##YFACTOR=${factorText(yf)}`);
	out.push(`##FIRSTY=${back(ints[0])}`, `##LASTY=${back(ints[n - 1])}`, `##MINY=${back(Math.min(...ints))}`, `##MAXY=${back(Math.max(...ints))}`, `##NPOINTS=${n}`);
	out.push('##XYDATA=(X++(Y..Y))');
	let line = '';
	for (let i = 0; i < n; i++) {
		const t = String(ints[i]);
		if (line && line.length + 1 + t.length > 80) {
			out.push(line);
			line = '';
		}
		line = line ? `${line} ${t}` : `${plainDecimal(firstX + i * dx)} ${t}`;
	}
	if (line) out.push(line);
	return out;
}

/** Writes one spectrum with its metadata (title, owner, origin, CAS, solvent, concentration, path, date). */
export function exportJcamp(spec: NormalisedSpectrum, metadata: SpectrumFileMetadata = {}): string {
	return [...headerRecords(spec, metadata), ...dataRecords(spec), '##END='].join('\n') + '\n';
}

/**
 * Writes several spectra as one LINK file (JCAMP-DX 4.24 §6): a LINK block naming the count, then one block per
 * spectrum with ##BLOCK_ID 1…n.
 * @param title - the file's title (the LINK block's ##TITLE)
 */
export function exportJcampLink(items: { spec: NormalisedSpectrum; metadata?: SpectrumFileMetadata }[], title: string): string {
	if (!items.length) throw new RangeError('a LINK file needs at least one spectrum');
	const out = [`##TITLE=${text(title) || 'spectra'}`, '##JCAMP-DX=4.24', '##DATA TYPE=LINK', `##BLOCKS=${items.length}`, '##ORIGIN=Windowsill', '##OWNER='];
	items.forEach(({ spec, metadata = {} }, i) => {
		const head = headerRecords(spec, metadata, [['BLOCK_ID', String(i + 1)]]);
		out.push(...head, ...dataRecords(spec), '##END=');
	});
	out.push('##END=');
	return out.join('\n') + '\n';
}
