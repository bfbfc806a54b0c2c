/**
 * The Window finder's checks in plain words, shown at the field (pure; unit-tested beside this file).
 * Field keys are the POST /api/window field paths (API.md), so the server's own refusals land on the same field.
 */
import type { WindowInputs } from './windowQuery';

export interface FieldProblem {
	field: string;
	message: string;
}

/** What each field is called on the page. */
export const FIELD_LABELS: Record<string, string> = {
	'substrate.spectrumId': 'Substrate',
	'substrate.concentrationM': 'Substrate concentration',
	'product.spectrumId': 'Product',
	'solvent.id': 'Solvent',
	'wall.materialId': 'Wall material',
	'wall.thicknessMm': 'Wall thickness',
	pathCm: 'Optical path',
	quantumYield: 'Quantum yield Φ',
	amountMol: 'Amount',
	volumeL: 'Volume',
	'reaction.photocatalyst.spectrumId': 'Photocatalyst',
	'reaction.photocatalyst.concentrationM': 'Photocatalyst concentration',
	'reaction.product.spectrumId': 'Product',
	'reaction.quantumYieldBack': 'Back quantum yield Φ(P→S)',
	'vessel.innerDiameterCm': 'Inner diameter',
	'vessel.outerDiameterCm': 'Outer diameter',
	'thresholds.minWallTransmission': 'Wall T threshold',
	'thresholds.maxSolventAbsorbance': 'Solvent absorbance threshold',
	'thresholds.minSubstrateAbsorbance': 'Absorber absorbance threshold',
	'thresholds.minSelectivity': 'Selectivity threshold',
	'flow.reactorVolumeMl': 'Reactor volume',
	'flow.flowRateMlPerMin': 'Flow rate',
	sensitiserMarginKJPerMol: 'Sensitiser margin'
};

/** zod paths come as "others.0.concentrationM"; the page and the physics checks write "others[0].concentrationM". */
export const normaliseField = (f: string) => f.replace(/\.(\d+)(?=\.|$)/g, '[$1]');

/** The label of a field, including list entries ("Other absorber 2 concentration"). */
export function labelOf(field: string): string {
	const f = normaliseField(field);
	const other = /^others\[(\d+)\]\.(concentrationM|spectrumId)$/.exec(f);
	if (other) return `Other absorber ${Number(other[1]) + 1}${other[2] === 'concentrationM' ? ' concentration' : ''}`;
	const lamp = /^lamps\[(\d+)\]$/.exec(f);
	if (lamp) return `Lamp ${Number(lamp[1]) + 1}`;
	return FIELD_LABELS[f] ?? f;
}

/** A server message in plain words: "pathCm: must be a number" → "Optical path: must be a number". */
export function plainMessage(field: string | undefined, message: string): string {
	if (!field) return message;
	const f = normaliseField(field);
	const label = labelOf(f);
	let m = message;
	for (const raw of new Set([field, f])) m = m.split(raw).join(label);
	m = m.replace(/\(field: [^)]*\)/g, '').trim();
	return m.charAt(0).toUpperCase() + m.slice(1);
}

/** On a round vessel the server's `pathCm` is the diameter or the gap: show its problems at the diameter. */
export function fieldOnPage(field: string, i: WindowInputs): string {
	const f = normaliseField(field);
	if (f === 'pathCm' && i.vesselShape !== 'slab') return i.vesselShape === 'annulus' ? 'vessel.outerDiameterCm' : 'vessel.innerDiameterCm';
	return f;
}

const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/** Problems with what is typed, before anything is sent. Empty optional fields are fine. */
export function checkInputs(i: WindowInputs): FieldProblem[] {
	const out: FieldProblem[] = [];
	const need = (field: string, v: unknown, rule: (x: number) => boolean, says: string, optional = false) => {
		if ((v === null || v === undefined || v === '') && optional) return;
		if (!isNum(v)) return void out.push({ field, message: `${labelOf(field)}: enter a number${says ? ` (${says})` : ''}.` });
		if (!rule(v)) out.push({ field, message: `${labelOf(field)} must be ${says}.` });
	};
	need('substrate.concentrationM', i.concentrationM, (x) => x >= 0, '0 mol L⁻¹ or more');
	i.others.forEach((o, k) => need(`others[${k}].concentrationM`, o.concentrationM, (x) => x >= 0, '0 mol L⁻¹ or more'));
	need('wall.thicknessMm', i.thicknessMm, (x) => x > 0 && x <= 100, 'above 0 and at most 100 mm');
	if (i.vesselShape === 'slab') need('pathCm', i.pathCm, (x) => x > 0, 'above 0 cm');
	if (i.vesselShape !== 'slab') need('vessel.innerDiameterCm', i.innerDiameterCm, (x) => x > 0, 'above 0 cm');
	if (i.vesselShape === 'annulus') {
		need('vessel.outerDiameterCm', i.outerDiameterCm, (x) => x > 0, 'above 0 cm');
		if (isNum(i.innerDiameterCm) && isNum(i.outerDiameterCm) && i.outerDiameterCm <= i.innerDiameterCm)
			out.push({ field: 'vessel.outerDiameterCm', message: 'Outer diameter must be larger than the inner diameter (the liquid fills the gap between them).' });
	}
	// Φ up to 10⁴: radical chains give far more than one molecule per photon (API.md, reaction modes).
	need('quantumYield', i.quantumYield, (x) => x > 0 && x <= 1e4, 'above 0 and at most 10 000', true);
	need('volumeL', i.volumeMl, (x) => x > 0, 'above 0 mL', true);
	need('amountMol', i.amountMol, (x) => x > 0, 'above 0 mol', true);
	if (i.reactionType === 'photocatalytic') {
		if (!i.photocatalyst) out.push({ field: 'reaction.photocatalyst.spectrumId', message: 'Choose the photocatalyst (or sensitiser) that should absorb.' });
		else need('reaction.photocatalyst.concentrationM', i.photocatalyst.concentrationM, (x) => x > 0, 'above 0 mol L⁻¹');
	}
	if (i.reactionType === 'reversible') {
		if (!i.productId) out.push({ field: 'reaction.product.spectrumId', message: 'Choose the product spectrum: the back reaction needs it.' });
		need('reaction.quantumYieldBack', i.quantumYieldBack, (x) => x > 0 && x <= 1e4, 'above 0 and at most 10 000');
	}
	const t = i.thresholds;
	need('thresholds.minWallTransmission', t.minWallTransmission, (x) => x >= 0 && x <= 1, 'a fraction from 0 to 1');
	need('thresholds.maxSolventAbsorbance', t.maxSolventAbsorbance, (x) => x >= 0, '0 or more');
	need('thresholds.minSubstrateAbsorbance', t.minSubstrateAbsorbance, (x) => x >= 0, '0 or more');
	need('thresholds.minSelectivity', t.minSelectivity, (x) => x >= 0 && x <= 1, 'a fraction from 0 to 1');
	if (i.flow) {
		need('flow.reactorVolumeMl', i.flow.reactorVolumeMl, (x) => x > 0, 'above 0 mL');
		need('flow.flowRateMlPerMin', i.flow.flowRateMlPerMin, (x) => x > 0, 'above 0 mL min⁻¹');
	}
	need('sensitiserMarginKJPerMol', i.tripletMarginKJPerMol, (x) => x >= 0, '0 kJ mol⁻¹ or more');
	return out;
}
