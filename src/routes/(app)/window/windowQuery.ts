/**
 * The Window finder's inputs ⇄ URL query, so a result can be shared by its link, and ⇄ the POST /api/window body.
 * Pure (no DOM): unit-tested beside this file.
 */
export interface WindowInputs {
	substrateId: number | null;
	concentrationM: number;
	others: { spectrumId: number; concentrationM: number }[];
	productId: number | null;
	solventId: number | null;
	materialId: number | null;
	thicknessMm: number;
	pathCm: number;
	/** Empty = all of the group's lamps. */
	lampIds: number[];
	quantumYield: number | null;
	amountMol: number | null;
	volumeMl: number | null;
	thresholds: { minWallTransmission: number; maxSolventAbsorbance: number; minSubstrateAbsorbance: number; minSelectivity: number };
	rankWalls: { materialId: number; thicknessMm: number }[];
	rankSolventIds: number[];
	flow: { reactorVolumeMl: number; flowRateMlPerMin: number } | null;
	tripletMarginKJPerMol: number;
	/** Which species should absorb (API.md "Reaction modes"): the substrate, a photocatalyst, or a reversible pair. */
	reactionType: ReactionType;
	photocatalyst: { spectrumId: number; concentrationM: number } | null;
	/** Φ of the back reaction (product → substrate), reversible mode. */
	quantumYieldBack: number | null;
	vesselShape: VesselShape;
	innerDiameterCm: number | null;
	outerDiameterCm: number | null;
}

export type ReactionType = 'direct' | 'photocatalytic' | 'reversible';
export type VesselShape = 'slab' | 'cylinder' | 'annulus';
const REACTIONS: ReactionType[] = ['direct', 'photocatalytic', 'reversible'];
const SHAPES: VesselShape[] = ['slab', 'cylinder', 'annulus'];

/** Defaults shown in the form (thresholds as in src/lib/irradiation/window.ts). */
export function defaultInputs(thresholds: WindowInputs['thresholds']): WindowInputs {
	return {
		substrateId: null,
		concentrationM: 0.05,
		others: [],
		productId: null,
		solventId: null,
		materialId: null,
		thicknessMm: 2,
		pathCm: 1,
		lampIds: [],
		quantumYield: null,
		amountMol: null,
		volumeMl: null,
		thresholds: { ...thresholds },
		rankWalls: [],
		rankSolventIds: [],
		flow: null,
		tripletMarginKJPerMol: 10,
		reactionType: 'direct',
		photocatalyst: null,
		quantumYieldBack: null,
		vesselShape: 'slab',
		innerDiameterCm: null,
		outerDiameterCm: null
	};
}

const num = (v: string | null) => (v === null || v.trim() === '' || !Number.isFinite(Number(v)) ? null : Number(v));
const ids = (v: string | null) => (v ? v.split(',').map(Number).filter((n) => Number.isInteger(n) && n > 0) : []);

/** Reads inputs from a query string; anything missing or unreadable keeps its default. */
export function inputsFromQuery(q: URLSearchParams, defaults: WindowInputs): WindowInputs {
	const out = structuredClone(defaults);
	out.substrateId = num(q.get('s')) ?? out.substrateId;
	out.concentrationM = num(q.get('c')) ?? out.concentrationM;
	out.others = (q.get('o') ?? '')
		.split(',')
		.filter(Boolean)
		.map((p) => p.split(':'))
		.map(([id, c]) => ({ spectrumId: Number(id), concentrationM: Number(c) }))
		.filter((o) => Number.isInteger(o.spectrumId) && o.spectrumId > 0 && Number.isFinite(o.concentrationM));
	out.productId = num(q.get('p')) ?? out.productId;
	out.solventId = num(q.get('solv')) ?? out.solventId;
	out.materialId = num(q.get('wall')) ?? out.materialId;
	out.thicknessMm = num(q.get('d')) ?? out.thicknessMm;
	out.pathCm = num(q.get('l')) ?? out.pathCm;
	out.lampIds = ids(q.get('lamps'));
	out.quantumYield = num(q.get('phi'));
	out.amountMol = num(q.get('n'));
	out.volumeMl = num(q.get('v'));
	const th = (q.get('th') ?? '').split(',').map(num);
	if (th.length === 4 && th.every((t) => t !== null)) {
		const [a, b, c, d] = th as number[];
		out.thresholds = { minWallTransmission: a, maxSolventAbsorbance: b, minSubstrateAbsorbance: c, minSelectivity: d };
	}
	out.rankWalls = (q.get('rw') ?? '')
		.split(',')
		.filter(Boolean)
		.map((p) => p.split('@'))
		.map(([id, d]) => ({ materialId: Number(id), thicknessMm: Number(d) }))
		.filter((w) => Number.isInteger(w.materialId) && w.thicknessMm > 0);
	out.rankSolventIds = ids(q.get('rs'));
	const fl = (q.get('flow') ?? '').split(',').map(num);
	out.flow = fl.length === 2 && fl[0] && fl[1] ? { reactorVolumeMl: fl[0], flowRateMlPerMin: fl[1] } : null;
	out.tripletMarginKJPerMol = num(q.get('margin')) ?? out.tripletMarginKJPerMol;
	const mode = q.get('mode') as ReactionType | null;
	if (mode && REACTIONS.includes(mode)) out.reactionType = mode;
	const [pcId, pcC] = (q.get('pc') ?? '').split(':').map(num);
	if (pcId && Number.isInteger(pcId) && pcId > 0) out.photocatalyst = { spectrumId: pcId, concentrationM: pcC ?? 0.001 };
	out.quantumYieldBack = num(q.get('phib'));
	const shape = q.get('vs') as VesselShape | null;
	if (shape && SHAPES.includes(shape)) out.vesselShape = shape;
	out.innerDiameterCm = num(q.get('di'));
	out.outerDiameterCm = num(q.get('do'));
	return out;
}

/** Writes inputs to a query string (only what differs from nothing, so links stay short). */
export function inputsToQuery(i: WindowInputs): URLSearchParams {
	const q = new URLSearchParams();
	const put = (k: string, v: unknown) => v !== null && v !== undefined && v !== '' && q.set(k, String(v));
	put('s', i.substrateId);
	put('c', i.concentrationM);
	if (i.others.length) put('o', i.others.map((o) => `${o.spectrumId}:${o.concentrationM}`).join(','));
	put('p', i.productId);
	put('solv', i.solventId);
	put('wall', i.materialId);
	put('d', i.thicknessMm);
	put('l', i.pathCm);
	if (i.lampIds.length) put('lamps', i.lampIds.join(','));
	put('phi', i.quantumYield);
	put('n', i.amountMol);
	put('v', i.volumeMl);
	const t = i.thresholds;
	put('th', [t.minWallTransmission, t.maxSolventAbsorbance, t.minSubstrateAbsorbance, t.minSelectivity].join(','));
	if (i.rankWalls.length) put('rw', i.rankWalls.map((w) => `${w.materialId}@${w.thicknessMm}`).join(','));
	if (i.rankSolventIds.length) put('rs', i.rankSolventIds.join(','));
	if (i.flow) put('flow', `${i.flow.reactorVolumeMl},${i.flow.flowRateMlPerMin}`);
	if (i.tripletMarginKJPerMol !== 10) put('margin', i.tripletMarginKJPerMol);
	if (i.reactionType !== 'direct') put('mode', i.reactionType);
	if (i.photocatalyst) put('pc', `${i.photocatalyst.spectrumId}:${i.photocatalyst.concentrationM}`);
	put('phib', i.quantumYieldBack);
	if (i.vesselShape !== 'slab') put('vs', i.vesselShape);
	put('di', i.innerDiameterCm);
	put('do', i.outerDiameterCm);
	return q;
}

/** The optical depth sent as `pathCm`: the slab depth, the tube's inner diameter, or the annular gap. */
export function opticalDepthCm(i: WindowInputs): number | null {
	if (i.vesselShape === 'cylinder') return i.innerDiameterCm;
	if (i.vesselShape === 'annulus') return i.innerDiameterCm !== null && i.outerDiameterCm !== null ? (i.outerDiameterCm - i.innerDiameterCm) / 2 : null;
	return i.pathCm;
}

function reactionFields(i: WindowInputs): Record<string, unknown> {
	if (i.reactionType === 'photocatalytic' && i.photocatalyst)
		return { reaction: { type: 'photocatalytic', photocatalyst: { spectrumId: i.photocatalyst.spectrumId, concentrationM: i.photocatalyst.concentrationM } } };
	if (i.reactionType === 'reversible' && i.productId)
		return { reaction: { type: 'reversible', product: { spectrumId: i.productId }, ...(i.quantumYieldBack !== null ? { quantumYieldBack: i.quantumYieldBack } : {}) } };
	return {};
}

function vesselFields(i: WindowInputs): Record<string, unknown> {
	if (i.vesselShape === 'cylinder') return { vessel: { shape: 'cylinder', innerDiameterCm: i.innerDiameterCm } };
	if (i.vesselShape === 'annulus') return { vessel: { shape: 'annulus', innerDiameterCm: i.innerDiameterCm, outerDiameterCm: i.outerDiameterCm } };
	return {};
}

/**
 * The POST /api/window body for these inputs, or null while a required choice is missing (substrate, solvent, wall;
 * the photocatalyst in photocatalytic mode, the product in reversible mode). Numbers are sent as typed: the form
 * checks them first (see windowChecks.ts) and the server names the field of anything it refuses.
 */
export function requestBody(i: WindowInputs): Record<string, unknown> | null {
	if (!i.substrateId || !i.solventId || !i.materialId) return null;
	if (i.reactionType === 'photocatalytic' && !i.photocatalyst) return null;
	if (i.reactionType === 'reversible' && !i.productId) return null;
	const reversible = i.reactionType === 'reversible';
	return {
		substrate: { spectrumId: i.substrateId, concentrationM: i.concentrationM },
		...(i.others.length ? { others: i.others } : {}),
		...(i.productId && !reversible ? { product: { spectrumId: i.productId } } : {}),
		...reactionFields(i),
		...vesselFields(i),
		solvent: { id: i.solventId },
		wall: { materialId: i.materialId, thicknessMm: i.thicknessMm },
		pathCm: opticalDepthCm(i),
		...(i.lampIds.length ? { lamps: i.lampIds } : {}),
		...(i.quantumYield !== null ? { quantumYield: i.quantumYield } : {}),
		...(i.amountMol !== null ? { amountMol: i.amountMol } : {}),
		...(i.volumeMl !== null ? { volumeL: i.volumeMl / 1000 } : {}),
		thresholds: i.thresholds,
		...(i.rankWalls.length || i.rankSolventIds.length ? { rank: { walls: i.rankWalls, solvents: i.rankSolventIds } } : {}),
		...(i.flow ? { flow: i.flow } : {}),
		sensitiserMarginKJPerMol: i.tripletMarginKJPerMol,
		includeCurves: true
	};
}
