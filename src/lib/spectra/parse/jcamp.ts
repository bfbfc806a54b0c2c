/**
 * JCAMP-DX reader (JCAMP-DX 4.24 / 5.x, McDonald & Wilks, Appl. Spectrosc. 42, 151, 1988).
 * Every leaf block of a LINK file becomes its own spectrum; blocks that are not spectra (VARIANCE, standard
 * deviation) are dropped with a warning. `(XY..XY)` tables (`##XYPOINTS`, `##PEAK TABLE`, `##XYDATA=(XY..XY)`) and
 * `(X++(Y..Y))` data in every AFFN/ASDF form are read here with line numbers, under a per-file point budget.
 * The header is believed: ##DATA TYPE and ##XUNITS that name a non-optical quantity (NMR, mass, current–voltage…)
 * refuse the block with what it is; infrared data stay on their wavenumber axis and are refused when they miss
 * the product's 190–1100 nm range.
 */
import type { ParseIssue, RawSpectrum, Result, SpectrumKind, XUnit } from '../types';
import { HC_EV_NM, parseYUnit } from '../units';
import { splitJcampBlocks, type JcampBlock } from './jcampBlocks';
import { classifyDataType, describeNmRange } from './jcampKind';
import { readJcampMetadata } from './jcampMetadata';
import { readXyTable } from './jcampTable';
import { readXyData, readXyHeader } from './jcampXyData';
import type { AsdfBudget } from './jcampAsdf';
import { splitLines, stripBom } from './numbers';
import { DEFAULT_PARSE_LIMITS, type ParseLimits } from './parseLimits';
import { resolveUnits, type ReadOptions } from './resolveUnits';
import { validatePoints } from './validate';
import { parseXAxisLabel } from './xUnitCheck';

/** The product's wavelength grid (PRODUCT.md: 190–1100 nm). */
export const GRID_NM: [number, number] = [190, 1100];

type BlockOut = { spectrum?: RawSpectrum; issues: ParseIssue[]; refusal?: ParseIssue };

/** The block's label under the file title: the block title without the file title it repeats. */
export function blockLabel(blockTitle: string | undefined, fileTitle: string | undefined, index: number): string {
	let t = (blockTitle ?? '').trim();
	const f = (fileTitle ?? '').trim();
	if (f && t.toLowerCase().startsWith(f.toLowerCase())) t = t.slice(f.length).trim().replace(/^[-–—:,;]\s*/, '');
	const bracketed = /^\((.*)\)$|^\[(.*)\]$/.exec(t);
	if (bracketed) t = (bracketed[1] ?? bracketed[2]).trim();
	return t || `block ${index + 1}`;
}

const toNm = (v: number, u: XUnit) => (u === 'nm' ? v : u === 'um' ? v * 1000 : 1e7 / v);

/** Reads one leaf block; `refusal` is an error that becomes a warning when other blocks of the file are spectra. */
function readBlock(lines: string[], b: JcampBlock, index: number, nBlocks: number, options: ReadOptions, budget: AsdfBudget, fileTitle: string | undefined): BlockOut {
	const block = nBlocks > 1 ? index : undefined;
	const what = nBlocks > 1 ? `block ${index + 1} ("${b.ldr.get('TITLE') ?? ''}")` : 'spectrum';
	const issues: ParseIssue[] = [];
	const lineOf = (key: string) => (b.ldrLine.get(key) ?? b.start) + 1;
	const yLabel = b.ldr.get('YUNITS');
	const xLabel = b.ldr.get('XUNITS');
	const yGuess = parseYUnit(yLabel);
	if (yGuess?.notSpectrum) {
		issues.push({ severity: 'warning', code: 'block_not_spectrum', message: `${what}: y is ${yLabel}, not a spectrum; not imported`, line: b.start + 1, block });
		return { issues };
	}
	const dataType = b.ldr.get('DATATYPE') ?? '';
	const dt = classifyDataType(dataType);
	const xAxis = parseXAxisLabel(xLabel);
	const notOptical = dt.notOptical ?? (xAxis && 'notOptical' in xAxis ? xAxis.notOptical : undefined);
	if (notOptical) {
		const said = [dataType && `DATA TYPE=${dataType}`, xLabel && `XUNITS=${xLabel}`, yLabel && `YUNITS=${yLabel}`].filter(Boolean).join(', ');
		const line = dt.notOptical ? lineOf('DATATYPE') : lineOf('XUNITS');
		return { issues, refusal: { severity: 'error', code: 'not_optical_spectrum', message: `${nBlocks > 1 ? `${what}: ` : 'this is '}${notOptical}, not an optical (UV–vis) spectrum (${said}); not imported`, line, block } };
	}
	const key = ['XYPOINTS', 'PEAKTABLE', 'XYDATA'].find((k) => b.ldr.has(k));
	if (!key) {
		issues.push({ severity: 'warning', code: 'block_without_data', message: `${what}: no XYDATA, XYPOINTS or PEAK TABLE; skipped`, line: b.start + 1, block });
		return { issues };
	}
	const dataLine = b.ldrLine.get(key)!;
	const { header, issues: headerIssues } = readXyHeader(b.ldr, b.ldrLine, block);
	issues.push(...headerIssues);
	if (headerIssues.some((i) => i.severity === 'error')) return { issues };
	const table = key !== 'XYDATA' || /\(\s*XY\s*\.\.\s*XY\s*\)/i.test(b.ldr.get(key)!);
	const pts = table ? readXyTable(lines, dataLine + 1, header.xFactor, header.yFactor, block, budget) : readXyData(lines, b.start, b.end, dataLine, header, budget, block);
	for (const m of table ? [] : (pts as ReturnType<typeof readXyData>).logs) issues.push({ severity: 'warning', code: 'jcamp_log', message: `${what}: ${m}`, block });
	if (table && header.nPoints !== undefined && key !== 'PEAKTABLE' && pts.x.length !== header.nPoints)
		issues.push({ severity: 'warning', code: 'point_count_mismatch', message: `${what}: NPOINTS says ${header.nPoints}, the table has ${pts.x.length} points`, line: dataLine + 1, block });
	issues.push(...pts.issues.map((i) => (i.severity === 'warning' ? { ...i, message: `${what}: ${i.message}` } : i)));
	if (pts.issues.some((i) => i.severity === 'error')) return { issues };

	// x axis: the header's unit, with ångström / nm⁻¹ factors and electronvolts converted to nm (λ = hc/E, CODATA 2018).
	let x = pts.x;
	let y = pts.y;
	let fileX: XUnit | undefined;
	if (xAxis && 'unit' in xAxis) {
		if (xAxis.unit === 'eV') {
			const bad = x.findIndex((e) => !(e > 0));
			if (bad >= 0) return { issues: [...issues, { severity: 'error', code: 'x_not_positive', message: `${what}: photon energy ${x[bad]} eV on line ${pts.lines[bad]} cannot be converted to a wavelength`, line: pts.lines[bad], block }] };
			x = x.map((e) => HC_EV_NM / e);
			fileX = 'nm';
			issues.push({ severity: 'warning', code: 'converted_from_ev', message: `${what}: x in eV converted to nm (λ = 1239.84/E)`, block });
		} else {
			if (xAxis.factor !== 1) x = x.map((v) => v * xAxis.factor);
			fileX = xAxis.unit;
		}
	} else if (xLabel && xLabel.trim() && !/arbitrary|^a\.?u\.?$/i.test(xLabel.trim()))
		issues.push({ severity: 'warning', code: 'x_unit_unknown', message: `${what}: XUNITS=${xLabel} is not a unit this reader knows`, line: lineOf('XUNITS'), block });
	const declaredKind = b.ldr.get('$KIND');
	const fileKind: SpectrumKind | undefined = declaredKind === 'absorption' || declaredKind === 'transmission' || declaredKind === 'emission' ? declaredKind : dt.kind;
	const units = resolveUnits(x, y, fileX, yGuess, fileKind, options, { what, block });
	issues.push(...units.warnings);
	if (xAxis && 'unit' in xAxis && xAxis.unit === 'eV' && units.kind === 'emission') {
		// A density per eV becomes one per nm: y_λ = y_E · |dE/dλ| = y_E · hc/λ².
		y = y.map((v, i) => (v * HC_EV_NM) / (x[i] * x[i]));
	}
	// Range: the product works on 190–1100 nm; a block with (almost) nothing there is refused with what it is.
	let minNm = Infinity, maxNm = -Infinity, inside = 0;
	for (const v of x) {
		const nm = toNm(v, units.xUnit);
		if (nm < minNm) minNm = nm;
		if (nm > maxNm) maxNm = nm;
		if (nm >= GRID_NM[0] && nm <= GRID_NM[1]) inside++;
	}
	if (inside < 2 && minNm <= maxNm) {
		const lo = num4(Math.min(...x)), hi = num4(Math.max(...x));
		const message = fileX || options.xUnit
			? `${nBlocks > 1 ? `${what}: ` : ''}${dt.name}, ${units.xUnit === 'cm-1' ? `${lo}–${hi} cm⁻¹ = ` : ''}${describeNmRange(minNm, maxNm)}: outside ${GRID_NM[0]}–${GRID_NM[1]} nm; not imported`
			: `${nBlocks > 1 ? `${what}: ` : ''}${dt.name} without an x unit (no ##XUNITS) whose x runs ${lo}–${hi}: in nm, µm or cm⁻¹ none of it lies within ${GRID_NM[0]}–${GRID_NM[1]} nm; not imported`;
		return { issues, refusal: { severity: 'error', code: 'outside_optical_range', message, line: dataLine + 1, block } };
	}
	if (dt.infrared && !options.kind && units.xUnit !== 'cm-1')
		issues.push({ severity: 'warning', code: 'data_type_mismatch', message: `${what}: the file says DATA TYPE=${dataType}; read as UV–vis ${units.kind}`, line: lineOf('DATATYPE'), block });
	const v = validatePoints({ x, y, lines: pts.lines, yUnit: units.yUnit, what, block });
	issues.push(...v.issues);
	if (!v.value) return { issues };
	const metadata = readJcampMetadata(b.ldr, b.parent);
	let label = metadata.title ?? `block ${index + 1}`;
	if (nBlocks > 1) {
		label = blockLabel(b.ldr.get('TITLE'), fileTitle, index);
		if (metadata.title !== undefined) metadata.blockTitle = metadata.title;
		if (fileTitle) metadata.title = fileTitle;
	}
	return {
		issues,
		spectrum: { label, index, x: v.value.x, y: v.value.y, lines: v.value.lines, xUnit: units.xUnit, yUnit: units.yUnit, kind: units.kind, metadata, xUnitLabel: xLabel, yUnitLabel: yLabel }
	};
}

const num4 = (v: number) => String(Number(v.toPrecision(4)));

/** Counts `##TITLE=` records without building blocks (the spectra cap is checked before any block is read). */
function countTitles(lines: string[]): number {
	let n = 0;
	for (const l of lines) if (/^\s*##\s*TITLE\s*=/i.test(l)) n++;
	return n;
}

/**
 * Parses JCAMP-DX text into one RawSpectrum per spectral block. Never throws.
 * @param options - kind / xUnit / yUnit chosen by the user; they override the file
 * @param limits - points and spectra allowed per file (default 2 M points, 500 spectra)
 * @returns ok with spectra and warnings; not ok when no block could be read (all issues, line-numbered)
 */
export function parseJcamp(text: string, options: ReadOptions = {}, limits: ParseLimits = DEFAULT_PARSE_LIMITS): Result<RawSpectrum[]> {
	try {
		const lines = splitLines(stripBom(text));
		const titles = countTitles(lines);
		// A LINK file has one more ##TITLE than blocks; anything past that is over the cap.
		if (titles > limits.maxSpectraPerFile + 1)
			return { ok: false, issues: [{ severity: 'error', code: 'too_many_spectra', message: `the file holds ${titles} ##TITLE blocks; at most ${limits.maxSpectraPerFile} spectra are read from one file` }] };
		const blocks = splitJcampBlocks(lines);
		if (!blocks.length) return { ok: false, issues: [{ severity: 'error', code: 'unsupported_format', message: 'no JCAMP-DX block (##TITLE=) found' }] };
		if (blocks.length > limits.maxSpectraPerFile)
			return { ok: false, issues: [{ severity: 'error', code: 'too_many_spectra', message: `the file holds ${blocks.length} blocks; at most ${limits.maxSpectraPerFile} spectra are read from one file` }] };
		const issues: ParseIssue[] = [];
		const declared = blocks[0].parent?.get('BLOCKS');
		if (declared !== undefined && Number(declared) !== blocks.length)
			issues.push({ severity: 'warning', code: 'block_count_mismatch', message: `the LINK header says BLOCKS=${declared}; the file has ${blocks.length} blocks` });
		const fileTitle = blocks[0].parent?.get('TITLE') ?? (blocks.length > 1 ? commonTitle(blocks.map((b) => b.ldr.get('TITLE') ?? '')) : undefined);
		const budget: AsdfBudget = { remaining: limits.maxPointsPerFile, cap: limits.maxPointsPerFile };
		const spectra: RawSpectrum[] = [];
		const refusals: ParseIssue[] = [];
		for (let i = 0; i < blocks.length; i++) {
			const r = readBlock(lines, blocks[i], i, blocks.length, options, budget, fileTitle);
			issues.push(...r.issues);
			if (r.refusal) refusals.push(r.refusal);
			if (r.spectrum) spectra.push(r.spectrum);
			if (r.issues.some((e) => e.code === 'too_many_points')) break;
		}
		const errors = issues.filter((i) => i.severity === 'error');
		if (errors.length || !spectra.length) {
			const all = [...refusals, ...issues];
			return { ok: false, issues: all.length ? all : [{ severity: 'error', code: 'no_spectrum', message: 'the file holds no spectrum' }] };
		}
		for (const r of refusals) issues.push({ ...r, severity: 'warning' });
		spectra.forEach((s, k) => (s.index = k));
		return { ok: true, value: spectra, warnings: issues };
	} catch (e) {
		return { ok: false, issues: [{ severity: 'error', code: 'internal_error', message: `JCAMP-DX reader failed: ${(e as Error)?.message ?? e}` }] };
	}
}

/** The longest common leading text of block titles (multi-block files without a LINK title), trimmed. */
function commonTitle(titles: string[]): string | undefined {
	let p = titles[0] ?? '';
	for (const t of titles) while (p && !t.startsWith(p)) p = p.slice(0, -1);
	p = p.replace(/[\s(\[\-–—:,;]+$/, '').trim();
	return p.length >= 3 ? p : undefined;
}
