import { ApiError } from '$lib/server/http';

const num = (v: FormDataEntryValue | null) => {
	const s = String(v ?? '').trim().replace(',', '.');
	return s === '' ? undefined : Number(s);
};
const text = (v: FormDataEntryValue | null) => {
	const s = String(v ?? '').trim();
	return s === '' ? undefined : s;
};

/** Turns the lamp form's fields into the JSON body /api/lamps takes (the same zod schema validates both). */
export function lampBodyFromForm(f: FormData): Record<string, unknown> {
	const type = String(f.get('modelType') ?? '');
	let model: Record<string, unknown> = { type };
	if (type === 'led') model = { type, peakNm: num(f.get('peakNm')), fwhmNm: num(f.get('fwhmNm')), shape: text(f.get('shape')) ?? 'gaussian' };
	else if (type === 'mercury-low-pressure' || type === 'mercury-medium-pressure') model = { type, ozoneFree: f.get('ozoneFree') === 'on', ...(f.get('powerWithout185nm') === 'on' ? { powerWithout185nm: true } : {}) };
	else if (type === 'laser') model = { type, lineNm: num(f.get('lineNm')) };
	else if (type === 'blackbody') model = { type, temperatureK: num(f.get('temperatureK')), fromNm: num(f.get('fromNm')), toNm: num(f.get('toNm')) };
	else if (type === 'excimer') model = { type, emitter: text(f.get('emitter')) };
	else if (type === 'phosphor') model = { type, peakNm: num(f.get('peakNm')), fwhmNm: num(f.get('fwhmNm')), mercuryLines: f.get('mercuryLines') === 'on' };
	else if (type === 'spectrum') model = { type, spectrumId: num(f.get('spectrumId')), ...(text(f.get('floor')) ? { floor: text(f.get('floor')) } : {}) };
	return {
		name: text(f.get('name')) ?? '',
		powerW: num(f.get('powerW')),
		couplingFactor: num(f.get('couplingFactor')),
		distanceNote: text(f.get('distanceNote')),
		// a cleared field clears the stored value (null), as the API allows
		exposureDistanceCm: num(f.get('exposureDistanceCm')) ?? null,
		exposureIrradianceWPerM2: num(f.get('exposureIrradianceWPerM2')) ?? null,
		notes: text(f.get('notes')),
		model,
		...(f.get('version') ? { version: num(f.get('version')) } : {})
	};
}

/** The actinometry form's fields → the POST /api/actinometry body (the same schema validates both). */
export function actinometryBodyFromForm(f: FormData, lampId: number): Record<string, unknown> {
	return {
		lampId,
		actinometer: text(f.get('actinometer')),
		concentrationM: num(f.get('concentrationM')),
		irradiatedVolumeMl: num(f.get('irradiatedVolumeMl')),
		aliquotVolumeMl: num(f.get('aliquotVolumeMl')),
		finalVolumeMl: num(f.get('finalVolumeMl')),
		deltaAbsorbance: num(f.get('deltaAbsorbance')),
		readoutPathCm: num(f.get('readoutPathCm')),
		irradiationTimeS: num(f.get('irradiationTimeS')),
		absorbanceAtIrradiation: num(f.get('absorbanceAtIrradiation')),
		vessel: { materialId: num(f.get('materialId')), thicknessMm: num(f.get('thicknessMm')), pathCm: num(f.get('pathCm')) },
		measuredAt: text(f.get('measuredAt')),
		operator: text(f.get('operator')),
		notes: text(f.get('notes'))
	};
}

/** The radiometer form's fields → the POST /api/lamps/:id/calibrations body. */
export function radiometerBodyFromForm(f: FormData): Record<string, unknown> {
	return {
		kind: 'radiometer',
		opticalPowerW: num(f.get('opticalPowerW')),
		vessel: { materialId: num(f.get('materialId')), thicknessMm: num(f.get('thicknessMm')) },
		measuredAt: text(f.get('measuredAt')),
		operator: text(f.get('operator')),
		notes: text(f.get('notes'))
	};
}

/** The form values to send back on failure (no secrets here, so all of them). */
export function formValues(f: FormData): Record<string, string> {
	const out: Record<string, string> = {};
	for (const [k, v] of f.entries()) if (typeof v === 'string') out[k] = v;
	return out;
}

/** Maps an ApiError from a service to `fail` data: status, message and the field it names. */
export function failureOf(e: unknown): { status: number; message: string; field?: string } | null {
	if (e instanceof ApiError) return { status: e.status, message: e.message, field: e.extra.field };
	return null;
}
