/**
 * JCAMP-DX reader (JCAMP-DX 4.24 / 5.x, McDonald & Wilks, Appl. Spectrosc. 42, 151, 1988).
 * Every leaf block of a LINK file becomes its own spectrum; blocks that are not spectra
 * (VARIANCE, standard deviation) are dropped with a warning. `(XY..XY)` tables
 * (`##XYPOINTS`, `##PEAK TABLE`, `##XYDATA=(XY..XY)`) are read here with line numbers;
 * `(X++(Y..Y))` data (AFFN, SQZ/DIF/DUP) are decoded by jcampconverter.
 */
import type { ParseIssue, RawSpectrum, Result, SpectrumKind } from '../types';
import { parseXUnit, parseYUnit } from '../units';
import { splitJcampBlocks, type JcampBlock } from './jcampBlocks';
import { readJcampMetadata } from './jcampMetadata';
import { readXyTable } from './jcampTable';
import { readXyData, type XyDataPoints } from './jcampXyData';
import { splitLines, stripBom } from './numbers';
import { resolveUnits, type ReadOptions } from './resolveUnits';
import { validatePoints } from './validate';

const num = (v: string | undefined) => (v === undefined || v.trim() === '' ? undefined : Number(v));

function kindOfDataType(dataType: string): SpectrumKind | undefined {
	const s = dataType.toUpperCase();
	if (/EMISSION|FLUORESCENCE|LUMINESCENCE/.test(s)) return 'emission';
	if (/TRANSMI/.test(s)) return 'transmission';
	if (/UV|VIS|ABSORPTION/.test(s)) return 'absorption';
	return undefined;
}

/** Reads one leaf block; returns issues (errors refuse this block) and the spectrum when valid. */
function readBlock(lines: string[], b: JcampBlock, index: number, nBlocks: number, options: ReadOptions): { spectrum?: RawSpectrum; issues: ParseIssue[] } {
	const block = nBlocks > 1 ? index : undefined;
	const what = nBlocks > 1 ? `block ${index + 1} ("${b.ldr.get('TITLE') ?? ''}")` : 'spectrum';
	const issues: ParseIssue[] = [];
	const yLabel = b.ldr.get('YUNITS');
	const yGuess = parseYUnit(yLabel);
	if (yGuess?.notSpectrum) {
		issues.push({ severity: 'warning', code: 'block_not_spectrum', message: `${what}: y is ${yLabel}, not a spectrum; not imported`, line: b.start + 1, block });
		return { issues };
	}
	const dataType = b.ldr.get('DATATYPE') ?? '';
	if (/NMR|MASS/i.test(dataType)) {
		issues.push({ severity: 'warning', code: 'block_not_uv_vis', message: `${what}: data type ${dataType} is not a UV–vis spectrum; not imported`, line: b.start + 1, block });
		return { issues };
	}
	const key = ['XYPOINTS', 'PEAKTABLE', 'XYDATA'].find((k) => b.ldr.has(k));
	if (!key) {
		issues.push({ severity: 'warning', code: 'block_without_data', message: `${what}: no XYDATA, XYPOINTS or PEAK TABLE; skipped`, line: b.start + 1, block });
		return { issues };
	}
	const dataLine = b.ldrLine.get(key)!;
	const xFactor = num(b.ldr.get('XFACTOR')) ?? 1;
	const yFactor = num(b.ldr.get('YFACTOR')) ?? 1;
	const nPoints = num(b.ldr.get('NPOINTS'));
	const table = key !== 'XYDATA' || /\(\s*XY\s*\.\.\s*XY\s*\)/i.test(b.ldr.get(key)!);
	const pts = table ? readXyTable(lines, dataLine + 1, xFactor, yFactor, block) : readXyData(lines, b.start, b.end, dataLine, nPoints, xFactor, block);
	for (const m of table ? [] : (pts as XyDataPoints).logs) issues.push({ severity: 'warning', code: 'jcamp_log', message: `${what}: ${m}`, block });
	if (table && nPoints !== undefined && key !== 'PEAKTABLE' && pts.x.length !== nPoints)
		issues.push({ severity: 'warning', code: 'point_count_mismatch', message: `${what}: NPOINTS says ${nPoints}, the table has ${pts.x.length} points`, line: dataLine + 1, block });
	issues.push(...pts.issues);
	if (pts.issues.some((i) => i.severity === 'error')) return { issues };

	const xLabel = b.ldr.get('XUNITS');
	const declaredKind = b.ldr.get('$KIND');
	const fileKind = declaredKind === 'absorption' || declaredKind === 'transmission' || declaredKind === 'emission' ? declaredKind : kindOfDataType(dataType);
	const units = resolveUnits(pts.x, pts.y, parseXUnit(xLabel), yGuess, fileKind, options, { what, block });
	issues.push(...units.warnings);
	if (/INFRARED|RAMAN/i.test(dataType) && !options.kind)
		issues.push({ severity: 'warning', code: 'data_type_mismatch', message: `${what}: the file says DATA TYPE=${dataType}; read as UV–vis ${units.kind}`, line: (b.ldrLine.get('DATATYPE') ?? b.start) + 1, block });
	const v = validatePoints({ x: pts.x, y: pts.y, lines: pts.lines, yUnit: units.yUnit, what, block });
	issues.push(...v.issues);
	if (!v.value) return { issues };
	const metadata = readJcampMetadata(b.ldr, b.parent);
	return {
		issues,
		spectrum: { label: metadata.title ?? `block ${index + 1}`, index, x: v.value.x, y: v.value.y, lines: v.value.lines, xUnit: units.xUnit, yUnit: units.yUnit, kind: units.kind, metadata, xUnitLabel: xLabel, yUnitLabel: yLabel }
	};
}

/**
 * Parses JCAMP-DX text into one RawSpectrum per spectral block. Never throws.
 * @param options - kind / xUnit / yUnit chosen by the user; they override the file
 * @returns ok with spectra and warnings; not ok when no block could be read (all issues, line-numbered)
 */
export function parseJcamp(text: string, options: ReadOptions = {}): Result<RawSpectrum[]> {
	try {
		const lines = splitLines(stripBom(text));
		const blocks = splitJcampBlocks(lines);
		if (!blocks.length) return { ok: false, issues: [{ severity: 'error', code: 'unsupported_format', message: 'no JCAMP-DX block (##TITLE=) found' }] };
		const issues: ParseIssue[] = [];
		const declared = blocks[0].parent?.get('BLOCKS');
		if (declared !== undefined && Number(declared) !== blocks.length)
			issues.push({ severity: 'warning', code: 'block_count_mismatch', message: `the LINK header says BLOCKS=${declared}; the file has ${blocks.length} blocks` });
		const spectra: RawSpectrum[] = [];
		blocks.forEach((b, i) => {
			const r = readBlock(lines, b, i, blocks.length, options);
			issues.push(...r.issues);
			if (r.spectrum) spectra.push(r.spectrum);
		});
		const errors = issues.filter((i) => i.severity === 'error');
		if (errors.length || !spectra.length)
			return { ok: false, issues: issues.length ? issues : [{ severity: 'error', code: 'no_spectrum', message: 'the file holds no spectrum' }] };
		spectra.forEach((s, k) => (s.index = k));
		return { ok: true, value: spectra, warnings: issues };
	} catch (e) {
		return { ok: false, issues: [{ severity: 'error', code: 'internal_error', message: `JCAMP-DX reader failed: ${(e as Error)?.message ?? e}` }] };
	}
}
