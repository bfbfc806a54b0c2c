/**
 * CSV export of a normalised spectrum: `# key: value` metadata lines, a header, then x,y rows with
 * the shortest exact decimal of each double (so a re-import gives the same numbers).
 */
import type { NormalisedSpectrum, SpectrumFileMetadata } from '../types';
import { CSV_Y_HEADERS } from './labels';

const clean = (v: string | number) => String(v).replace(/[\r\n]+/g, ' ');

/** Writes the spectrum as comma-separated text (LF line ends, '.' decimals). */
export function exportCsv(spec: NormalisedSpectrum, metadata: SpectrumFileMetadata = {}): string {
	const out: string[] = [];
	for (const [k, v] of Object.entries(metadata)) if (v !== undefined && v !== '' && !/^(kind|yunit|xunit)$/i.test(k)) out.push(`# ${k}: ${clean(v)}`);
	out.push(`# kind: ${spec.kind}`, `# yUnit: ${spec.yUnit}`, '# xUnit: nm');
	out.push(`wavelength (nm),${CSV_Y_HEADERS[spec.yUnit]}`);
	for (let i = 0; i < spec.x.length; i++) out.push(`${spec.x[i]},${spec.y[i]}`);
	return out.join('\n') + '\n';
}
