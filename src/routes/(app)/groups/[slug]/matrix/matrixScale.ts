/**
 * The matrix's colour scale (our own): six steps of the app's "lumen" ramp from paper to deep amber, one step per
 * factor of ~3 below the largest cell (a log scale: absorbed photon fluxes span decades). Every cell also prints its
 * number, so the colour is never the only carrier of the value.
 */
export const SCALE = [
	{ bg: '#f7f4ec', fg: '#4c5f87' },
	{ bg: '#fdf6e7', fg: '#1b2436' },
	{ bg: '#fae8c0', fg: '#1b2436' },
	{ bg: '#f2c36a', fg: '#1b2436' },
	{ bg: '#e9a23b', fg: '#1b2436' },
	{ bg: '#b8731a', fg: '#ffffff' },
	{ bg: '#6e4210', fg: '#ffffff' }
] as const;

/** Step 0 = nothing absorbed (or under 1/10⁴ of the maximum); 6 = within a factor of √10 of the maximum. */
export function scaleStep(value: number, max: number): number {
	if (!(value > 0) || !(max > 0)) return 0;
	const decadesBelow = Math.log10(max / value);
	if (decadesBelow >= 4) return 0;
	return Math.max(1, 6 - Math.floor(decadesBelow * 1.5));
}

/** The lower edge of each step (for the legend), as a multiple of the maximum. */
export function stepFloor(step: number): number {
	return step <= 0 ? 0 : 10 ** (-(6 - step + 1) / 1.5);
}

/** 2 significant figures, scientific: 3.1 × 10⁻⁷. */
export function short(v: number): string {
	if (!(v > 0)) return '0';
	const e = Math.floor(Math.log10(v));
	const m = v / 10 ** e;
	const sup = String(e).replace(/[-0-9]/g, (c) => '⁻⁰¹²³⁴⁵⁶⁷⁸⁹'['-0123456789'.indexOf(c)]);
	return `${m.toFixed(1)}×10${sup}`;
}
