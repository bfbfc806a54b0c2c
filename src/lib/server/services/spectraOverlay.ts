/**
 * Overlay of several spectra on one x: uPlot needs one ascending x for all series, so every spectrum
 * is resampled onto a shared 1 nm grid over the union of their ranges (null outside each one's range).
 */
import { resampleToGrid } from '../../spectra/resample';
import type { SpectrumRow } from '../db/spectra';
import { normalisedOf } from './spectraExport';

/** `{ x, series: [{ id, label, y, yUnit, kind }] }` on a 1 nm grid. */
export function overlayOf(rows: SpectrumRow[]) {
	if (!rows.length) return { x: [] as number[], series: [] as { id: number; label: string; y: (number | null)[]; yUnit: string; kind: string }[] };
	const specs = rows.map((r) => ({ row: r, s: normalisedOf(r) }));
	const from = Math.floor(Math.min(...specs.map((p) => p.s.x[0])));
	const to = Math.ceil(Math.max(...specs.map((p) => p.s.x[p.s.x.length - 1])));
	const x = Array.from({ length: to - from + 1 }, (_, i) => from + i);
	const series = specs.map(({ row, s }) => ({
		id: row.id,
		label: row.name,
		yUnit: s.yUnit,
		kind: s.kind,
		y: Array.from(resampleToGrid(s.x, s.y, from, to, 1), (v) => (Number.isFinite(v) ? v : null))
	}));
	return { x, series };
}
