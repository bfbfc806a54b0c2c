/**
 * The report overlay's frame, shared by the HTML (SVG) and PDF reports: the wavelength stretch worth showing
 * (where anything is above 10⁻³, widened to 50 nm steps, within 200–900 nm), the absorbance axis maximum (the largest
 * absorbance shown, at most 3) and whether a curve goes above that axis — the caption then says so, so a clipped
 * curve is never read as a real plateau.
 */
import type { PlanReport } from './planReport';

export const OVERLAY_ABSORBANCE_CAP = 3;

export interface OverlayFrame {
	from: number;
	to: number;
	aMax: number;
	/** The largest absorbance in the shown stretch (may exceed aMax). */
	aPeak: number;
	clipped: boolean;
	/** Wavelength ticks (nm) and absorbance ticks. */
	nmTicks: number[];
	aTicks: number[];
}

export function overlayFrame(curves: NonNullable<PlanReport['curves']>): OverlayFrame {
	const x = curves.x;
	let lo = x.length - 1, hi = 0;
	for (const s of curves.series) for (let i = 0; i < x.length; i++) if (s.y[i] > 1e-3) { lo = Math.min(lo, i); hi = Math.max(hi, i); }
	const from = Math.max(x[0], Math.floor((x[Math.max(0, lo)] - 20) / 50) * 50, 200);
	const to = Math.min(x[x.length - 1], Math.ceil((x[Math.min(x.length - 1, hi)] + 20) / 50) * 50, 900);
	let aPeak = 0;
	for (const s of curves.series) if (s.kind === 'absorbance') for (let i = 0; i < x.length; i++) if (x[i] >= from && x[i] <= to && s.y[i] > aPeak) aPeak = s.y[i];
	const aMax = Math.min(OVERLAY_ABSORBANCE_CAP, Math.max(0.1, Math.ceil(aPeak * 10) / 10));
	const nmTicks: number[] = [];
	for (let v = Math.ceil(from / 50) * 50; v <= to; v += 50) nmTicks.push(v);
	return { from, to, aMax, aPeak, clipped: aPeak > aMax, nmTicks, aTicks: [0, 1, 2, 3, 4].map((i) => (aMax * i) / 4) };
}

/** The sentence under the overlay when an absorbance curve runs above the axis. */
export const clippedNote = (f: OverlayFrame) =>
	f.clipped ? `Absorbance is drawn up to ${f.aMax}; above that the curves are cut at the top of the axis (largest value in this range: A = ${f.aPeak.toPrecision(3)}).` : '';
