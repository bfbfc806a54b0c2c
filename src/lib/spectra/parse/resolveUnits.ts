/**
 * Decides kind, x unit and y unit of one spectrum: user options win over the file, the file wins
 * over guesses, and every guess is reported as a warning.
 */
import type { ParseIssue, SpectrumKind, XUnit, YUnit } from '../types';
import { KIND_OF_Y, type YUnitGuess } from '../units';
import { checkXUnit } from './xUnitCheck';
import { transmittanceLooksPercent } from './validate';

/** Options the caller (upload form) may give; they override what the file says. */
export interface ReadOptions {
	kind?: SpectrumKind;
	xUnit?: XUnit;
	yUnit?: YUnit;
}


const DEFAULT_Y: Record<SpectrumKind, YUnit> = { absorption: 'absorbance', transmission: 'transmittance', emission: 'relative', reflectance: 'reflectance' };

export interface ResolvedUnits {
	kind: SpectrumKind;
	xUnit: XUnit;
	yUnit: YUnit;
	warnings: ParseIssue[];
}

/**
 * @param x, y - the data (used for the %T/fraction decision and the x-range plausibility check)
 * @param fileX - x unit read from the file (undefined: not stated)
 * @param fileY - y unit guess from the file (undefined: not stated)
 * @param fileKind - kind suggested by the file's data type (undefined: none)
 */
export function resolveUnits(
	x: ArrayLike<number>,
	y: ArrayLike<number>,
	fileX: XUnit | undefined,
	fileY: YUnitGuess | undefined,
	fileKind: SpectrumKind | undefined,
	options: ReadOptions = {},
	where: { what: string; block?: number }
): ResolvedUnits {
	const warnings: ParseIssue[] = [];
	const warn = (code: string, message: string) => warnings.push({ severity: 'warning', code, message, block: where.block });
	let yUnit: YUnit;
	if (options.yUnit) yUnit = options.yUnit;
	else if (fileY) yUnit = fileY.yUnit;
	else {
		const kind = options.kind ?? fileKind;
		yUnit = kind ? DEFAULT_Y[kind] : 'absorbance';
		warn('y_unit_assumed', `${where.what}: y unit not stated; read as ${yUnit}${kind ? '' : ' (absorption)'} — please confirm`);
	}
	if (!options.yUnit && yUnit === 'transmittance' && (!fileY || fileY.transmittanceScaleUnknown)) {
		let max = -Infinity;
		for (let i = 0; i < y.length; i++) if (y[i] > max) max = y[i];
		// Fractions stay ≤ 1 (a little above with noise); %T of a real sample is above 1.5 over much of it (common practice).
		if (transmittanceLooksPercent(y)) {
			yUnit = 'transmittance-percent';
			warn('y_unit_inferred', `${where.what}: transmittance values up to ${max} read as %T`);
		}
	}
	let kind = options.kind ?? KIND_OF_Y[yUnit];
	if (options.kind && options.kind !== KIND_OF_Y[yUnit]) {
		// Allowed pairs: %T/T as absorption (converted to A), A as transmission (converted to T).
		const ok = (options.kind === 'absorption' && KIND_OF_Y[yUnit] === 'transmission') || (options.kind === 'transmission' && yUnit === 'absorbance') || (options.kind === 'emission' && !options.yUnit && !fileY);
		if (!ok) warn('kind_unit_mismatch', `${where.what}: kind ${options.kind} with y unit ${yUnit}`);
		if (options.kind === 'emission' && !options.yUnit && KIND_OF_Y[yUnit] !== 'emission') yUnit = 'relative';
		kind = options.kind;
	}
	let xUnit: XUnit;
	if (options.xUnit) xUnit = options.xUnit;
	else {
		if (!fileX) warn('x_unit_assumed', `${where.what}: x unit not stated; read as nm`);
		const check = checkXUnit(x, fileX ?? 'nm', where.block);
		xUnit = check.xUnit;
		if (check.issue) warnings.push({ ...check.issue, message: `${where.what}: ${check.issue.message}` });
	}
	return { kind, xUnit, yUnit, warnings };
}
