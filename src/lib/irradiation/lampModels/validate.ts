/** Validation of lamp model parameters: a list of { field, message } (empty when valid). */
import type { ParseIssue, Result } from '../../spectra/types';
import { EXCIMER_EMITTERS } from './lineSources';
import type { LampModel, SpectralGrid } from './types';

export interface FieldIssue { field: string; message: string }

const positive = (v: unknown) => typeof v === 'number' && Number.isFinite(v) && v > 0;

/** Checks a lamp model's parameters; each issue names the field. */
export function lampModelIssues(model: LampModel): FieldIssue[] {
	const out: FieldIssue[] = [];
	const need = (ok: boolean, field: string, message: string) => { if (!ok) out.push({ field, message }); };
	const m = model as unknown as Record<string, unknown>;
	const opt = (field: string) => m[field] === undefined || positive(m[field]);
	switch (model.type) {
		case 'led':
		case 'phosphor':
			need(positive(model.peakNm), 'peakNm', 'must be a positive number of nm');
			need(positive(model.fwhmNm), 'fwhmNm', 'must be a positive number of nm');
			if (model.type === 'led') {
				need(model.shape === undefined || model.shape === 'gaussian' || model.shape === 'ohno', 'shape', "must be 'gaussian' or 'ohno'");
				need(model.skew === undefined || (Number.isFinite(model.skew) && Math.abs(model.skew) < 1), 'skew', 'must lie between −1 and 1');
			}
			break;
		case 'mercury-low-pressure':
		case 'mercury-medium-pressure':
			need(opt('lineWidthNm'), 'lineWidthNm', 'must be a positive number of nm');
			break;
		case 'excimer':
			need(Object.hasOwn(EXCIMER_EMITTERS, model.emitter), 'emitter', `must be one of ${Object.keys(EXCIMER_EMITTERS).join(', ')}`);
			need(opt('fwhmNm'), 'fwhmNm', 'must be a positive number of nm');
			break;
		case 'laser':
			need(positive(model.lineNm), 'lineNm', 'must be a positive number of nm');
			need(opt('widthNm'), 'widthNm', 'must be a positive number of nm');
			break;
		case 'blackbody':
			need(positive(model.temperatureK), 'temperatureK', 'must be a positive number of K');
			need(opt('fromNm') && opt('toNm'), 'fromNm', 'fromNm and toNm must be positive numbers of nm');
			need(!(model.fromNm !== undefined && model.toNm !== undefined && model.toNm <= model.fromNm), 'toNm', 'must exceed fromNm');
			break;
		case 'xenon':
			break;
		case 'measured': {
			const { wavelengthNm: x, power: y } = model;
			if (!Array.isArray(x) || !Array.isArray(y) || x.length < 2 || x.length !== y.length) {
				out.push({ field: 'wavelengthNm', message: 'need ≥ 2 points and as many power values as wavelengths' });
				break;
			}
			for (let i = 0; i < x.length; i++) {
				if (!Number.isFinite(x[i]) || (i > 0 && !(x[i] > x[i - 1]))) { out.push({ field: 'wavelengthNm', message: `point ${i + 1}: wavelengths must be finite and ascending` }); break; }
				if (!Number.isFinite(y[i])) { out.push({ field: 'power', message: `point ${i + 1}: not a finite number` }); break; }
			}
			break;
		}
		default:
			out.push({ field: 'type', message: `unknown lamp model type "${(model as { type?: unknown }).type}"` });
	}
	return out;
}

export function gridIssues(grid: SpectralGrid): FieldIssue[] {
	const ok = positive(grid.fromNm) && positive(grid.stepNm) && Number.isInteger(grid.count) && grid.count >= 2;
	return ok ? [] : [{ field: 'grid', message: 'fromNm and stepNm must be positive and count an integer ≥ 2' }];
}

/** Result-value form for callers that must not throw (API input): the model typed, or issues naming fields. */
export function validateLampModel(input: unknown): Result<LampModel> {
	if (typeof input !== 'object' || input === null || typeof (input as { type?: unknown }).type !== 'string') {
		return { ok: false, issues: [{ severity: 'error', code: 'invalid_lamp_model', message: 'type: a lamp model needs a "type"' }] };
	}
	const issues = lampModelIssues(input as LampModel);
	if (issues.length === 0) return { ok: true, value: input as LampModel, warnings: [] };
	return { ok: false, issues: issues.map((i): ParseIssue => ({ severity: 'error', code: 'invalid_lamp_model', message: `${i.field}: ${i.message}` })) };
}
