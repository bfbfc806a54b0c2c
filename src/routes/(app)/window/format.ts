/** Display helpers for the Window finder (pure). */

/** Photon flux in einstein s⁻¹ → "12.3 µmol s⁻¹" (or nmol for small values). */
export function fmtFlux(q: number | null | undefined): string {
	if (q === null || q === undefined || !Number.isFinite(q)) return '—';
	if (q === 0) return '0';
	return q >= 1e-7 ? `${(q * 1e6).toPrecision(3)} µmol s⁻¹` : `${(q * 1e9).toPrecision(3)} nmol s⁻¹`;
}

/** A fraction 0–1 → "71 %". */
export const fmtPct = (f: number | null | undefined) => (f === null || f === undefined || !Number.isFinite(f) ? '—' : `${(f * 100).toFixed(f < 0.1 ? 1 : 0)} %`);

/** Seconds → "45 s", "12 min", "3.4 h", "2.1 d". */
export function fmtDuration(s: number | null | undefined): string {
	if (s === null || s === undefined || !Number.isFinite(s)) return '—';
	if (s < 90) return `${s.toPrecision(2)} s`;
	if (s < 5400) return `${(s / 60).toPrecision(3)} min`;
	if (s < 172800) return `${(s / 3600).toPrecision(3)} h`;
	return `${(s / 86400).toPrecision(3)} d`;
}
