/**
 * One number formatter for the whole site (pure; runs on the server and in the browser).
 * Significant figures without "e+11", SI prefixes for quantities, durations that stop at "more than a year",
 * percentages that never read above 100 %. Every function answers "—" for null, undefined, NaN or ±∞.
 */

const DASH = '—';
const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

const finite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

/** "10⁻⁹" for an integer exponent. */
export const superscriptPower = (exp: number) => `10${String(exp).replace(/[-0-9]/g, (c) => SUPERSCRIPT[c])}`;

/**
 * A number to `sig` significant figures (default 3), written out between 10⁻³ and 10⁶ ("0.00125", "14200"),
 * else as "1.25 × 10⁻⁹". Trailing zeros that toPrecision adds are kept only when `keepZeros` (default false).
 */
export function formatSig(x: number | null | undefined, sig = 3, keepZeros = false): string {
	if (!finite(x)) return DASH;
	if (x === 0) return '0';
	const abs = Math.abs(x);
	if (abs >= 1e-3 && abs < 1e6) {
		// toPrecision switches to exponent form for large integers (123456 at 3 s.f.): write the rounded value out instead.
		const rounded = Number(x.toPrecision(sig));
		const exp = Math.floor(Math.log10(Math.abs(rounded)));
		const text = rounded.toFixed(Math.max(0, sig - 1 - exp));
		return keepZeros ? text : trimZeros(text);
	}
	const [mant, e] = x.toExponential(sig - 1).split('e');
	const m = keepZeros ? mant : trimZeros(mant);
	return `${m} × ${superscriptPower(Number(e))}`;
}

function trimZeros(s: string): string {
	return s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
}

const PREFIXES: [number, string][] = [
	[1e12, 'T'], [1e9, 'G'], [1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n'], [1e-12, 'p'], [1e-15, 'f']
];

/**
 * A quantity with an SI prefix on its unit: formatSI(3.05e-6, 'mol s⁻¹') → "3.05 µmol s⁻¹",
 * formatSI(0.012, 'L') → "12 mL". `sig` significant figures (default 3); outside f…T the plain unit with a power of ten.
 */
export function formatSI(x: number | null | undefined, unit: string, sig = 3): string {
	if (!finite(x)) return DASH;
	if (x === 0) return `0 ${unit}`;
	const abs = Math.abs(x);
	for (const [f, p] of PREFIXES) {
		// Round first so that 999.96 µ… becomes "1.00 m…" and not "1000 µ…".
		if (Number((abs / f).toPrecision(sig)) >= 1) {
			if (f === 1e12 && abs / f >= 1000) break;
			return `${formatSig(x / f, sig)} ${p}${unit}`;
		}
	}
	return `${formatSig(x, sig)} ${unit}`;
}

/** Photon flux in einstein s⁻¹ (mol photons s⁻¹) → "3.05 µmol s⁻¹" (einstein written as mol of photons). */
export const formatPhotonFlux = (q: number | null | undefined, sig = 3) => formatSI(q, 'mol s⁻¹', sig);

/**
 * A fraction (0–1) as a percentage, clamped to 0–100 %: 0.714 → "71 %", 0.0123 → "1.2 %", 0.00004 → "< 0.01 %",
 * 0.99996 → "> 99.9 %", 1.02 (rounding noise) → "100 %". Never "1.0e+2 %".
 */
export function formatPercent(f: number | null | undefined): string {
	if (!finite(f)) return DASH;
	const p = Math.min(100, Math.max(0, f * 100));
	if (p === 0) return '0 %';
	if (p === 100) return '100 %';
	if (p < 0.01) return '< 0.01 %';
	if (p < 1) return `${trimZeros(p.toFixed(2))} %`;
	if (p < 10) return `${p.toFixed(1)} %`;
	if (p < 99.5) return `${p.toFixed(0)} %`;
	const one = p.toFixed(1);
	return one === '100.0' ? '> 99.9 %' : `${one} %`;
}

const MINUTE = 60;
const HOUR = 3600;
const DAY = 86400;
const YEAR = 365.25 * DAY;

/**
 * Seconds → "45 s", "12 min", "3.4 h", "2.1 d"; a year or more → "more than a year"; below 1 ms → "< 1 ms".
 * Two significant figures below a minute's worth of the unit boundary, three otherwise.
 */
export function formatDuration(s: number | null | undefined): string {
	if (!finite(s) || s < 0) return DASH;
	if (s === 0) return '0 s';
	if (s < 1e-3) return '< 1 ms';
	if (s < 1) return formatSI(s, 's', 2);
	if (s < 90) return `${formatSig(s, 2)} s`;
	if (s < 90 * MINUTE) return `${formatSig(s / MINUTE, s < 10 * MINUTE ? 2 : 3)} min`;
	if (s < 48 * HOUR) return `${formatSig(s / HOUR, 2)} h`;
	if (s < YEAR) return `${formatSig(s / DAY, 2)} d`;
	return 'more than a year';
}

/** Bytes → "840 B", "21 kB", "22.0 MB" (decimal prefixes, as file managers and the SI use). */
export function formatBytes(n: number | null | undefined): string {
	if (!finite(n) || n < 0) return DASH;
	if (n < 1000) return `${Math.round(n)} B`;
	return formatSI(n, 'B', 3);
}

/** A wavelength in nm: whole numbers, or one decimal when the value sits on a half-nanometre grid point. */
export function formatNm(x: number | null | undefined): string {
	if (!finite(x)) return DASH;
	const r = Math.round(x * 2) / 2;
	return `${Number.isInteger(r) ? r.toFixed(0) : r.toFixed(1)} nm`;
}

/** A length in cm as a chemist reads it at bench scale: "0.35 mm", "4.2 mm", "1.5 cm", "more than 1 m" for > 100 cm. */
export function formatLengthCm(cm: number | null | undefined): string {
	if (!finite(cm) || cm < 0) return DASH;
	if (cm === 0) return '0 mm';
	if (cm > 100) return 'more than 1 m';
	if (cm < 0.001) return `${formatSig(cm * 1e4, 2)} µm`;
	if (cm < 1) return `${formatSig(cm * 10, 2)} mm`;
	return `${formatSig(cm, 3)} cm`;
}
