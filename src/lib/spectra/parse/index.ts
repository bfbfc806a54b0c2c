/**
 * Entry point for uploads: detects JCAMP-DX (`##TITLE` / `##JCAMP`) or delimited text, refuses
 * binary or unknown content with `unsupported_format` (HTTP 415 in API.md), applies the caller's
 * kind/unit choices and never throws (a bug becomes an `internal_error` issue).
 */
import type { ParseIssue, RawSpectrum, Result, SpectrumKind, XUnit, YUnit } from '../types';
import { parseDelimited } from './csv';
import { parseJcamp } from './jcamp';
import { binarySignature } from './fileSignature';
import { DEFAULT_PARSE_LIMITS, type ParseLimits } from './parseLimits';
import { checkParsedSpectra } from './validate';

export interface ParseFileOptions {
	kind?: SpectrumKind;
	xUnit?: XUnit;
	yUnit?: YUnit;
	/** 0-based file columns to import as y (delimited text only). */
	columns?: number[];
	/** Copied into each spectrum's metadata (the caller's value wins over the file's). */
	concentrationM?: number;
	pathCm?: number;
	/** Points and spectra one file may hold (default 2 M points, 500 spectra; see parseLimits.ts). */
	limits?: ParseLimits;
	/** Delimited text only: one spectrum per column or per row (default: detected; see csvLayout.ts). */
	layout?: 'columns' | 'rows';
}

const unsupported = (message: string): Result<RawSpectrum[]> => ({ ok: false, issues: [{ severity: 'error', code: 'unsupported_format', message }] });

/**
 * Decodes bytes as UTF-8, falling back to windows-1252 (older instrument exports write µ, ° in it). UTF-16 text
 * (some Windows instrument software writes it) is recognised by its byte-order mark, or by every second byte
 * being NUL in an ASCII-range file.
 */
export function decodeText(bytes: Uint8Array): string | undefined {
	const utf16 = utf16Encoding(bytes);
	if (utf16) {
		try {
			return new TextDecoder(utf16, { fatal: true }).decode(bytes).replace(/^\uFEFF/, '');
		} catch {
			return undefined;
		}
	}
	let controls = 0;
	for (let i = 0; i < bytes.length; i++) {
		const b = bytes[i];
		if (b === 0) return undefined;
		if (b < 32 && b !== 9 && b !== 10 && b !== 13 && b !== 12) controls++;
	}
	if (controls > bytes.length * 0.01) return undefined;
	try {
		return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
	} catch {
		return new TextDecoder('windows-1252').decode(bytes);
	}
}

/** 'utf-16le' / 'utf-16be' when the bytes are UTF-16 text, else undefined. */
function utf16Encoding(bytes: Uint8Array): 'utf-16le' | 'utf-16be' | undefined {
	if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return 'utf-16le';
	if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return 'utf-16be';
	const n = Math.min(bytes.length - (bytes.length % 2), 512);
	if (n < 8) return undefined;
	let evenZero = 0, oddZero = 0;
	for (let i = 0; i < n; i += 2) {
		if (bytes[i] === 0) evenZero++;
		if (bytes[i + 1] === 0) oddZero++;
	}
	if (oddZero === n / 2 && evenZero === 0) return 'utf-16le';
	if (evenZero === n / 2 && oddZero === 0) return 'utf-16be';
	return undefined;
}

/**
 * The refusal for a refractive-index database file (YAML: a top-level `DATA:` list whose entries have
 * `type: tabulated nk|n|k` or `type: formula N`), or null. Such a file holds optical constants, not
 * a spectrum; read as a table its numbers would pass for an "absorbance" curve.
 */
export function refractiveIndexYaml(text: string): ParseIssue | null {
	const head = text.slice(0, 1 << 16);
	const data = /^DATA\s*:/m.exec(head);
	if (!data) return null;
	const types = [...head.slice(data.index).matchAll(/^\s*-?\s*type\s*:\s*(tabulated\s+(?:nk|n|k)|formula\s+\d+)\s*$/gim)].map((m) => `"${m[1].replace(/\s+/g, ' ')}"`);
	if (!types.length) return null;
	const line = head.slice(0, data.index).split('\n').length;
	return {
		severity: 'error',
		code: 'optical_constants_table',
		message: `a refractive-index data file (YAML, DATA of type ${types.join(' and ')}): optical constants (refractive index n, extinction coefficient k), not a spectrum; add the material as a wall from its n, k data instead`,
		line
	};
}

/**
 * Parses an uploaded spectrum file.
 * @param bytes - file content; filename - used in messages only (content decides the format)
 * @param options - the caller's choices, which override what the file says
 */
export function parseSpectrumFile(bytes: Uint8Array, filename: string, options: ParseFileOptions = {}): Result<RawSpectrum[]> {
	try {
		if (!bytes.length) return unsupported(`the file is empty`);
		const sig = binarySignature(bytes);
		if (sig) return unsupported(`this is ${sig}, not text; upload JCAMP-DX or delimited text (CSV, semicolon, tab, spaces)`);
		const text = decodeText(bytes);
		if (text === undefined) return unsupported(`binary content; upload JCAMP-DX or delimited text (CSV, semicolon, tab, spaces)`);
		const isJcamp = /^\s*##\s*(TITLE|JCAMP)/im.test(text.slice(0, 4096));
		if (!isJcamp) {
			const nk = refractiveIndexYaml(text);
			if (nk) return { ok: false, issues: [nk] };
		}
		const units = { kind: options.kind, xUnit: options.xUnit, yUnit: options.yUnit };
		const limits = options.limits ?? DEFAULT_PARSE_LIMITS;
		const r = checkParsedSpectra(isJcamp ? parseJcamp(text, units, limits) : parseDelimited(text, { ...units, columns: options.columns, layout: options.layout, filename, concentrationM: options.concentrationM, pathCm: options.pathCm }), limits);
		if (!r.ok) {
			// the reader's own reason (not a table, not an optical spectrum, optical constants) is kept; the API envelope adds the file name once
			if (!isJcamp && r.issues.some((i) => i.code === 'unsupported_format')) return unsupported(`neither JCAMP-DX nor a table of numbers: ${r.issues[0].message}`);
			return r;
		}
		for (const s of r.value) {
			if (options.concentrationM !== undefined) s.metadata.concentrationM = options.concentrationM;
			if (options.pathCm !== undefined) s.metadata.pathCm = options.pathCm;
		}
		return r;
	} catch (e) {
		return { ok: false, issues: [{ severity: 'error', code: 'internal_error', message: `${filename}: ${(e as Error)?.message ?? e}` }] };
	}
}
