/**
 * Importer for the refractive-index database YAML format (refractiveindex.info, CC0):
 * `DATA` blocks of type `tabulated nk`, `tabulated n`, `tabulated k` and dispersion
 * `formula 1/2/3/5/6`; wavelengths in the file are µm, the functions returned take nm.
 * Formula definitions: the database's own documentation of its YAML format ("formula 1" =
 * Sellmeier with squared poles, "formula 2" = Sellmeier-2, "formula 3" = polynomial in n²,
 * "formula 5" = Cauchy, "formula 6" = gases).
 */
import { parseDocument, isMap, isSeq, isScalar, type Node } from 'yaml';
import { xyInterpolateLinear } from 'ml-spectra-processing';
import type { ParseIssue, Result } from '../spectra/types';

export interface OpticalConstants {
	/** Real refractive index at a wavelength in nm; outside `nRangeNm` the nearest end value. */
	n: (wavelengthNm: number) => number;
	/** Extinction coefficient at a wavelength in nm; 0 when the file has no k; clamped outside `kRangeNm`. */
	k: (wavelengthNm: number) => number;
	nRangeNm: [number, number] | null;
	kRangeNm: [number, number] | null;
	/** Tabulated k (nm, ascending) when the file has one. */
	kTable: { wavelengthNm: number[]; k: number[] } | null;
	/** The file's REFERENCES text with HTML tags removed. */
	references: string;
}

export interface RefractiveIndexYamlOptions {
	/** Slab thickness for the window plausibility check, mm (default 1). */
	plausibilityThicknessMm?: number;
	/** Internal transmittance below which the material is flagged `implausible_window` (default 0.05). */
	minInternalTransmittance?: number;
	/** Wavelengths checked (nm) when inside the k range (default 365 and 550). */
	plausibilityWavelengthsNm?: number[];
}

type Table = { x: number[]; y: number[] };
/** Negative k is refused unless 4π|k|·(1 mm)/λ is below this (noise around zero). */
const NEGATIVE_K_NOISE = 1e-3;
const issue = (code: string, message: string, line?: number): ParseIssue => ({ severity: 'error', code, message, line });

function lineOf(text: string, offset: number): number {
	let line = 1;
	for (let i = 0; i < offset && i < text.length; i++) if (text.charCodeAt(i) === 10) line++;
	return line;
}

/** Reads the rows of a block scalar `data: |` with their 1-based line numbers. */
function readRows(text: string, node: Node, columns: number, issues: ParseIssue[]): number[][] {
	const range = node.range ?? [0, 0, 0];
	const startLine = lineOf(text, range[0]);
	const lines = text.slice(range[0], range[1]).split('\n');
	const rows: number[][] = [];
	for (let i = 1; i < lines.length; i++) {
		const raw = lines[i].trim();
		if (raw === '' || raw.startsWith('#')) continue;
		const cells = raw.split(/\s+/).map(Number);
		if (cells.length < columns || cells.some((v) => !Number.isFinite(v))) {
			issues.push(issue('bad_row', `line ${startLine + i}: expected ${columns} numbers, got "${raw}"`, startLine + i));
			continue;
		}
		rows.push([...cells.slice(0, columns), startLine + i]);
	}
	return rows;
}

function dispersion(formula: number, c: number[]): ((um: number) => number) | null {
	const sum = (f: (ci: number, cj: number, l: number) => number) => (l: number) => {
		let s = 0;
		for (let i = 1; i + 1 < c.length; i += 2) s += f(c[i], c[i + 1], l);
		return s;
	};
	switch (formula) {
		case 1: { const s = sum((a, b, l) => (a * l * l) / (l * l - b * b)); return (l) => Math.sqrt(1 + c[0] + s(l)); }
		case 2: { const s = sum((a, b, l) => (a * l * l) / (l * l - b)); return (l) => Math.sqrt(1 + c[0] + s(l)); }
		case 3: { const s = sum((a, b, l) => a * l ** b); return (l) => Math.sqrt(c[0] + s(l)); }
		case 5: { const s = sum((a, b, l) => a * l ** b); return (l) => c[0] + s(l); }
		case 6: { const s = sum((a, b, l) => a / (b - l ** -2)); return (l) => 1 + c[0] + s(l); }
		default: return null;
	}
}

function tableFn(t: Table): (nm: number) => number {
	const lo = t.x[0];
	const hi = t.x[t.x.length - 1];
	return (nm) => xyInterpolateLinear({ x: t.x, y: t.y }, [Math.min(hi, Math.max(lo, nm))])[0];
}

function sortTable(rows: number[][], col: number): Table {
	const sorted = [...rows].sort((a, b) => a[0] - b[0]);
	return { x: sorted.map((r) => r[0] * 1000), y: sorted.map((r) => r[col]) };
}

/**
 * Parses one refractiveindex.info YAML file. Refuses negative k (issue `negative_k` naming the
 * wavelength and line), except values so small that a 1 mm slab would gain < 0.1 % transmittance,
 * which are set to 0 with a `negative_k_noise` warning, and warns `implausible_window` when a 1 mm slab would transmit < 5 %
 * internally at 365 or 550 nm (T = exp(−4πk·d/λ), MANIFEST.md convention).
 */
export function parseRefractiveIndexYaml(text: string, options: RefractiveIndexYamlOptions = {}): Result<OpticalConstants> {
	const { plausibilityThicknessMm = 1, minInternalTransmittance = 0.05, plausibilityWavelengthsNm = [365, 550] } = options;
	const issues: ParseIssue[] = [];
	const warnings: ParseIssue[] = [];
	const doc = parseDocument(text);
	if (doc.errors.length > 0) {
		return { ok: false, issues: doc.errors.map((e) => issue('yaml_syntax', e.message, e.linePos?.[0]?.line)) };
	}
	const data = isMap(doc.contents) ? doc.contents.get('DATA', true) : undefined;
	if (!isSeq(data) || data.items.length === 0) return { ok: false, issues: [issue('no_data', 'the file has no DATA list')] };

	let nFn = null as ((nm: number) => number) | null;
	let nRange = null as [number, number] | null;
	let kTable = null as Table | null;
	for (let b = 0; b < data.items.length; b++) {
		const block = data.items[b];
		if (!isMap(block)) { issues.push(issue('bad_block', `DATA block ${b + 1} is not a mapping`)); continue; }
		const type = String(block.get('type') ?? '');
		const dataNode = block.get('data', true);
		const tabulated = /^tabulated (nk|n|k)$/.exec(type);
		const formula = /^formula (\d+)$/.exec(type);
		if (tabulated && isScalar(dataNode)) {
			const kind = tabulated[1];
			const rows = readRows(text, dataNode as Node, kind === 'nk' ? 3 : 2, issues);
			if (rows.length === 0) { issues.push(issue('empty_block', `DATA block ${b + 1} (${type}) has no rows`)); continue; }
			for (const r of rows) if (r[0] <= 0) issues.push(issue('bad_wavelength', `line ${r[r.length - 1]}: wavelength ${r[0]} µm is not positive`, r[r.length - 1]));
			const kCol = kind === 'nk' ? 2 : kind === 'k' ? 1 : -1;
			if (kCol > 0) {
				const noise: number[] = [];
				for (const r of rows) {
					if (r[kCol] >= 0) continue;
					const line = r[r.length - 1];
					// |k| so small that 1 mm would gain < 0.1 % transmittance: measurement noise around 0.
					if ((4 * Math.PI * -r[kCol] * 1e6) / (r[0] * 1000) < NEGATIVE_K_NOISE) {
						noise.push(line);
						r[kCol] = 0;
					} else issues.push(issue('negative_k', `line ${line}: k = ${r[kCol]} at ${(r[0] * 1000).toFixed(1)} nm is negative (it would give T > 1)`, line));
				}
				if (noise.length > 0) {
					warnings.push({ severity: 'warning', code: 'negative_k_noise', message: `${noise.length} slightly negative k values (lines ${noise[0]}–${noise[noise.length - 1]}) set to 0`, line: noise[0] });
				}
				if (kTable) warnings.push({ ...issue('duplicate_k', `DATA block ${b + 1}: a second k source is ignored`), severity: 'warning' });
				else kTable = sortTable(rows, kCol);
			}
			if (kind !== 'k') {
				if (nFn) warnings.push({ ...issue('duplicate_n', `DATA block ${b + 1}: a second n source is ignored`), severity: 'warning' });
				else {
					const t = sortTable(rows, 1);
					nFn = tableFn(t);
					nRange = [t.x[0], t.x[t.x.length - 1]];
				}
			}
		} else if (formula) {
			const coefficients = String(block.get('coefficients') ?? '').trim().split(/\s+/).map(Number);
			const range = String(block.get('wavelength_range') ?? '').trim().split(/\s+/).map(Number);
			const f = dispersion(Number(formula[1]), coefficients);
			if (!f) { issues.push(issue('unsupported_formula', `DATA block ${b + 1}: ${type} is not supported`)); continue; }
			if (coefficients.some((c) => !Number.isFinite(c)) || range.length !== 2 || range.some((r) => !(r > 0))) {
				issues.push(issue('bad_formula', `DATA block ${b + 1}: coefficients or wavelength_range unreadable`));
				continue;
			}
			if (nFn) { warnings.push({ ...issue('duplicate_n', `DATA block ${b + 1}: a second n source is ignored`), severity: 'warning' }); continue; }
			const [lo, hi] = [range[0] * 1000, range[1] * 1000];
			nFn = (nm) => f(Math.min(hi, Math.max(lo, nm)) / 1000);
			nRange = [lo, hi];
		} else {
			issues.push(issue('unsupported_block', `DATA block ${b + 1}: type "${type}" is not supported`));
		}
	}
	if (issues.length > 0) return { ok: false, issues };
	if (!nFn && !kTable) return { ok: false, issues: [issue('no_data', 'the file has neither n nor k data')] };

	const kt = kTable as Table | null;
	const k = kt ? tableFn(kt) : () => 0;
	const kRangeNm: [number, number] | null = kt ? [kt.x[0], kt.x[kt.x.length - 1]] : null;
	if (kRangeNm) {
		for (const wl of plausibilityWavelengthsNm) {
			if (wl < kRangeNm[0] || wl > kRangeNm[1]) continue;
			const t = Math.exp((-4 * Math.PI * k(wl) * plausibilityThicknessMm * 1e6) / wl);
			if (t < minInternalTransmittance) {
				warnings.push({ severity: 'warning', code: 'implausible_window', message: `internal T of ${plausibilityThicknessMm} mm at ${wl} nm would be ${t.toPrecision(2)}: k is far too high for a bulk window (thin-film or model data?)` });
			}
		}
	}
	const refs = isMap(doc.contents) ? String(doc.contents.get('REFERENCES') ?? '') : '';
	return {
		ok: true,
		warnings,
		value: {
			n: nFn ?? (() => Number.NaN),
			k,
			nRangeNm: nRange,
			kRangeNm,
			kTable: kt ? { wavelengthNm: kt.x, k: kt.y } : null,
			references: refs.replace(/<[^>]*>/g, '').replace(/\s+/g, ' ').trim()
		}
	};
}
