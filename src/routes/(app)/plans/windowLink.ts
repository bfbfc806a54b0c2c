/**
 * The Window finder link for stored plan inputs (a POST /api/window body) or matrix conditions, written with the
 * finder's own query format (../window/windowQuery.ts), so a click reproduces the same computation there.
 */
import { defaultInputs, inputsToQuery, type WindowInputs } from '../window/windowQuery';

type R = Record<string, unknown>;
const o = (v: unknown): R => (v && typeof v === 'object' && !Array.isArray(v) ? (v as R) : {});
const n = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

/** `/window?…` for a Window-finder request body. */
export function windowLinkForBody(body: R, thresholds: WindowInputs['thresholds']): string {
	const i = defaultInputs(thresholds);
	i.substrateId = n(o(body.substrate).spectrumId);
	i.concentrationM = n(o(body.substrate).concentrationM) ?? i.concentrationM;
	i.others = (Array.isArray(body.others) ? body.others : []).map((x) => ({ spectrumId: Number(o(x).spectrumId), concentrationM: Number(o(x).concentrationM) }));
	i.productId = n(o(body.product).spectrumId);
	i.solventId = n(o(body.solvent).id);
	i.materialId = n(o(body.wall).materialId);
	i.thicknessMm = n(o(body.wall).thicknessMm) ?? i.thicknessMm;
	i.pathCm = n(body.pathCm) ?? i.pathCm;
	i.lampIds = Array.isArray(body.lamps) ? body.lamps.map(Number) : [];
	i.quantumYield = n(body.quantumYield);
	i.amountMol = n(body.amountMol);
	i.volumeMl = n(body.volumeL) !== null ? Number(((body.volumeL as number) * 1000).toPrecision(12)) : null;
	const t = o(body.thresholds);
	if (['minWallTransmission', 'maxSolventAbsorbance', 'minSubstrateAbsorbance', 'minSelectivity'].every((k) => n(t[k]) !== null)) i.thresholds = t as WindowInputs['thresholds'];
	const f = o(body.flow);
	i.flow = n(f.reactorVolumeMl) && n(f.flowRateMlPerMin) ? { reactorVolumeMl: f.reactorVolumeMl as number, flowRateMlPerMin: f.flowRateMlPerMin as number } : null;
	return `/window?${inputsToQuery(i).toString()}`;
}

/** `/window?…` for one matrix cell: that absorber at that concentration with that lamp, solvent, wall and path. */
export function windowLinkForCell(c: { spectrumId: number; part: string; lampId: number; solventId: number; materialId: number; thicknessMm: number; pathCm: number; concentrationM: number }, thresholds: WindowInputs['thresholds']): string {
	return windowLinkForBody(
		{ substrate: { spectrumId: c.spectrumId, concentrationM: c.concentrationM }, solvent: { id: c.solventId }, wall: { materialId: c.materialId, thicknessMm: c.thicknessMm }, pathCm: c.pathCm, lamps: [c.lampId] },
		thresholds
	);
}
