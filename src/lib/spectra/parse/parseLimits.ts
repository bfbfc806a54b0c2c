/**
 * Limits on what one uploaded file may expand to, checked while decoding (a DUP count cannot allocate past them).
 * Pure: the server reads its environment with `parseLimitsFromEnv` and passes the result in.
 */

export interface ParseLimits {
	/** Points over all spectra of one file (default 2 000 000). */
	maxPointsPerFile: number;
	/** Spectra (JCAMP-DX blocks, CSV columns) in one file (default 500). */
	maxSpectraPerFile: number;
}

export const DEFAULT_PARSE_LIMITS: ParseLimits = { maxPointsPerFile: 2_000_000, maxSpectraPerFile: 500 };

const positiveInt = (v: string | undefined, fallback: number) => {
	const n = Number(v);
	return v !== undefined && v.trim() !== '' && Number.isInteger(n) && n > 0 ? n : fallback;
};

/** Reads PARSE_MAX_POINTS and PARSE_MAX_SPECTRA (positive integers; anything else keeps the default). */
export function parseLimitsFromEnv(env: Record<string, string | undefined>): ParseLimits {
	return {
		maxPointsPerFile: positiveInt(env.PARSE_MAX_POINTS, DEFAULT_PARSE_LIMITS.maxPointsPerFile),
		maxSpectraPerFile: positiveInt(env.PARSE_MAX_SPECTRA, DEFAULT_PARSE_LIMITS.maxSpectraPerFile)
	};
}
