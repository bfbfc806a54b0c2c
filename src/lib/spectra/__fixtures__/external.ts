/** Test helper: reads the shared third-party data files (never copied into the repo). */
import fs from 'node:fs';
import path from 'node:path';
import { normaliseSpectrum } from '../normalise';
import { parseSpectrumFile, type ParseFileOptions } from '../parse/index';
import type { NormalisedSpectrum, RawSpectrum, Result } from '../types';

/** ../shared/external from the checkout; a worktree one level deeper (wt/NAME) finds it two levels up. */
const externalRoot = [process.env.WINDOWSILL_EXTERNAL_DIR, '../shared/external', '../../shared/external']
	.filter((p): p is string => !!p)
	.map((p) => path.resolve(process.cwd(), p))
	.find((p) => fs.existsSync(p)) ?? path.resolve(process.cwd(), '../shared/external');
export const externalPath = (rel: string) => path.resolve(externalRoot, rel);
export const readExternal = (rel: string) => new Uint8Array(fs.readFileSync(externalPath(rel)));

/** Parses a shared file and fails the test with its issues when it does not parse. */
export function parseExternal(rel: string, options?: ParseFileOptions): Extract<Result<RawSpectrum[]>, { ok: true }> {
	const r = parseSpectrumFile(readExternal(rel), path.basename(rel), options);
	if (!r.ok) throw new Error(`${rel}: ${JSON.stringify(r.issues.slice(0, 5))}`);
	return r;
}

/** Normalises and fails the test on error. */
export function norm(raw: RawSpectrum, opts?: { concentrationM?: number; pathCm?: number }): NormalisedSpectrum {
	const r = normaliseSpectrum(raw, opts);
	if (!r.ok) throw new Error(JSON.stringify(r.issues));
	return r.value;
}

/** y at the sample whose x equals wavelengthNm (within 1e-6), else NaN. */
export function yAt(s: { x: ArrayLike<number>; y: ArrayLike<number> }, wavelengthNm: number): number {
	for (let i = 0; i < s.x.length; i++) if (Math.abs(s.x[i] - wavelengthNm) < 1e-6) return s.y[i];
	return NaN;
}
