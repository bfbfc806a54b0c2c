/**
 * Shared types of the spectra core (pure: no SvelteKit, knex, $env or DOM imports).
 * Wavelengths are nm (air); y-quantities per kind follow PRODUCT.md.
 */

/** `reflectance`: diffuse or specular reflectance (fraction 0–1 stored); never used as absorbance. */
export type SpectrumKind = 'absorption' | 'transmission' | 'emission' | 'reflectance';

/** Units a file or the user may declare for x. */
export type XUnit = 'nm' | 'cm-1' | 'um';

/** Units a file or the user may declare for y (API.md names). */
export type YUnit =
	| 'absorbance'
	| 'epsilon'
	| 'log-epsilon'
	| 'transmittance'
	| 'transmittance-percent'
	| 'reflectance'
	| 'reflectance-percent'
	| 'relative'
	| 'W/nm'
	| 'W/m2/nm'
	| 'umol/s/nm'
	| 'umol/m2/s/nm'
	| 'counts';

/** One problem found while reading a file. `line` is 1-based in the original text when known. */
export interface ParseIssue {
	severity: 'error' | 'warning';
	code: string;
	message: string;
	line?: number;
	/** Which block of a multi-block (LINK) file, 0-based, when relevant. */
	block?: number;
}

export type Result<T> = { ok: true; value: T; warnings: ParseIssue[] } | { ok: false; issues: ParseIssue[] };

/** Metadata a file may carry (JCAMP LDRs, CSV preambles). */
export interface SpectrumFileMetadata {
	title?: string;
	cas?: string;
	solvent?: string;
	concentrationM?: number;
	pathCm?: number;
	origin?: string;
	owner?: string;
	date?: string;
	instrument?: string;
	temperatureC?: number;
	thicknessMm?: number;
	[k: string]: string | number | undefined;
}

/** A spectrum as read from a file, before normalisation: the file's own x/y and units. */
export interface RawSpectrum {
	/** Label: JCAMP block title or CSV column header. */
	label: string;
	/** Index of the block (JCAMP) or y column (CSV), 0-based. */
	index: number;
	x: Float64Array;
	y: Float64Array;
	xUnit: XUnit;
	yUnit: YUnit;
	kind: SpectrumKind;
	metadata: SpectrumFileMetadata;
	/** Free-form original unit strings, for display. */
	xUnitLabel?: string;
	yUnitLabel?: string;
	/** CSV only: 0-based position of the y column in the file (the x column is usually 0). */
	column?: number;
	/** 1-based line in the original text of each point (same length as x), when known. */
	lines?: Int32Array;
	/**
	 * Time series (a delimited table with one spectrum per row, e.g. a kinetics run): the time of this spectrum in
	 * seconds, read from the row's first field in the unit its column header names (seconds when it names none).
	 * Stored as spectra.block_time_s beside block_label; `index` keeps the file order.
	 */
	timeS?: number;
	/** The row's or block's own label as written in the file (e.g. "30" under "Time (s)"). */
	blockLabel?: string;
}

/** A spectrum normalised to nm (ascending) and the y-quantity of its kind (PRODUCT.md). */
export interface NormalisedSpectrum {
	kind: SpectrumKind;
	/** nm, strictly ascending. */
	x: Float64Array;
	/** absorption: epsilon (M^-1 cm^-1) or absorbance; transmission: fraction 0..1; emission: relative, area-normalised W nm^-1 (or the file's absolute unit). */
	y: Float64Array;
	yUnit: 'epsilon' | 'absorbance' | 'transmittance' | 'reflectance' | 'relative' | 'W/nm' | 'W/m2/nm' | 'umol/s/nm' | 'umol/m2/s/nm' | 'counts';
}

/** Derived values stored with a spectrum. */
export interface SpectrumDerived {
	lambdaMaxNm: number | null;
	valueAtMax: number | null;
	/** absorption: longest wavelength where the long-wavelength band falls below 10 % of its maximum. */
	edgeNm: number | null;
	/** transmission: shortest wavelengths above which T stays >= 10 % / 50 %. */
	cutoff10Nm: number | null;
	cutoff50Nm: number | null;
	peaks: { wavelengthNm: number; value: number }[];
	/** absorption: the longest-wavelength band maximum above noise (the band one irradiates), nm; its y value; whether its top is saturated. */
	longestBandNm?: number | null;
	longestBandValue?: number | null;
	longestBandSaturated?: boolean;
	/** absorption: every band maximum above noise, ascending λ (saturated tops flagged). */
	bands?: { wavelengthNm: number; value: number; saturated: boolean }[];
	/** transmission: why a cut-off is null ("below the data range, T(300 nm) = 81 %"). */
	cutoffNotes?: { cutoff10?: string; cutoff50?: string };
	/** Saturated (A above the linear range) and noise-dominated stretches, left out of λmax, peaks and bands. */
	excluded?: { fromNm: number; toNm: number; reason: 'saturated' | 'noise' }[];
	/** Robust noise σ of y. */
	noiseSigma?: number;
	/** Stretches of the 1 nm grid that shape similarity may use ([fromNm, toNm] inclusive). */
	similarity?: { usable: [number, number][]; aboveNoise: [number, number][] };
	/** 1 nm vector on 190..1100 nm (911 values), NaN outside the measured range replaced by 0; see grid.ts. */
	searchVector: Float32Array;
}
