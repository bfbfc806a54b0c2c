/**
 * Points and files of a stored spectrum: GET …/data (normalised nm points, optionally resampled to a
 * step), …/export?format=csv|jcamp (through the core's exporters, so a re-import gives the same data)
 * and the original file.
 */
import { exportCsv } from '../../spectra/export/csv';
import { exportJcamp } from '../../spectra/export/jcamp';
import { resampleToGrid } from '../../spectra/resample';
import type { NormalisedSpectrum, SpectrumFileMetadata } from '../../spectra/types';
import { ApiError } from '../http';
import type { SpectrumRow } from '../db/spectra';
import { bufferToFloat64 } from '../db/spectraBlobs';

/** The stored normalised spectrum. */
export function normalisedOf(row: SpectrumRow): NormalisedSpectrum {
	return { kind: row.kind, x: bufferToFloat64(row.x_nm), y: bufferToFloat64(row.y_normalised), yUnit: row.y_unit as NormalisedSpectrum['yUnit'] };
}

/**
 * `{ x, y, yUnit }` in nm. With `step` (nm, 0.1–50) the points are resampled linearly onto a
 * uniform grid from the first whole step inside the data.
 */
export function spectrumData(row: SpectrumRow, stepParam: string | null) {
	const s = normalisedOf(row);
	if (stepParam === null || stepParam === '') return { x: Array.from(s.x), y: Array.from(s.y), yUnit: s.yUnit, kind: s.kind };
	const step = Number(stepParam);
	if (!Number.isFinite(step) || step < 0.1 || step > 50) throw new ApiError(400, 'invalid', 'step: a number of nm between 0.1 and 50', { field: 'step' });
	const from = Math.ceil(s.x[0] / step) * step;
	const to = Math.floor(s.x[s.x.length - 1] / step) * step;
	if (to < from) return { x: [], y: [], yUnit: s.yUnit, kind: s.kind };
	const y = resampleToGrid(s.x, s.y, from, to, step);
	return { x: Array.from(y, (_, i) => +(from + i * step).toFixed(6)), y: Array.from(y), yUnit: s.yUnit, kind: s.kind };
}

function metadataOf(row: SpectrumRow): SpectrumFileMetadata {
	const m: SpectrumFileMetadata = { title: row.name, owner: row.owner_name ?? undefined, origin: `Windowsill spectrum ${row.id}` };
	if (row.cas) m.cas = row.cas;
	if (row.solvent) m.solvent = row.solvent;
	if (row.concentration_m != null) m.concentrationM = row.concentration_m;
	if (row.path_cm != null) m.pathCm = row.path_cm;
	m.date = new Date(row.updated_at).toISOString().slice(0, 10);
	return m;
}

const safeName = (s: string) => s.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80) || 'spectrum';

/** The export file: body, MIME type and a download file name. @throws 400 for another format */
export function exportSpectrum(row: SpectrumRow, format: string | null) {
	const s = normalisedOf(row);
	const base = `${safeName(row.name)}-${row.id}`;
	if (format === 'csv' || format === null || format === '') return { body: exportCsv(s, metadataOf(row)), type: 'text/csv; charset=utf-8', filename: `${base}.csv` };
	if (format === 'jcamp' || format === 'jdx') return { body: exportJcamp(s, metadataOf(row)), type: 'chemical/x-jcamp-dx; charset=utf-8', filename: `${base}.jdx` };
	if (format === 'original') return { body: new Uint8Array(row.file_bytes ?? new Uint8Array()), type: 'application/octet-stream', filename: row.file_name };
	throw new ApiError(400, 'invalid', 'format: one of csv, jcamp, original', { field: 'format' });
}
