/**
 * The report of a plan: the reporting checklist for a photochemical experiment (minimum information after Bonfield
 * et al., Nat. Commun. 11, 804 (2020), and Kowalczyk et al., ChemPhotoChem (2022), doi:10.1002/cptc.202200044, plus
 * common practice), a methods paragraph for an experimental section, the cautions of the chosen lamp ending with the
 * deferral to local rules and the safety officer, and the curves for the overlay. One model, two renderings
 * (planReportHtml.ts, planReportPdf.ts). Items the plan does not record are marked so, never invented.
 */
import { SAFETY_DEFERRAL_TEXT } from '$lib/irradiation/cautions';
import { nameInSentence } from '$lib/irradiation/names';

type R = Record<string, unknown>;
const o = (v: unknown): R => (v && typeof v === 'object' && !Array.isArray(v) ? (v as R) : {});
const arr = (v: unknown): R[] => (Array.isArray(v) ? (v as R[]) : []);
const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

export interface ReportSource {
	id: number;
	title: string;
	state: string;
	groupName: string;
	ownerName: string | null;
	reviewerName: string | null;
	reviewedAt: Date | null;
	version: number;
	revision: { number: number; reason: string; createdAt: Date } | null;
	inputs: R;
	decision: R | null;
	results: R;
	generatedAt: Date;
}

export interface ChecklistItem {
	label: string;
	value: string;
	/** false = the plan does not record it: the report says so and asks for it. */
	recorded: boolean;
}

export interface ReportCaution {
	title: string;
	text: string;
	severity: string;
	band: string | null;
	source: string;
}

export interface PlanReport {
	heading: string;
	subtitle: string;
	status: string;
	checklist: ChecklistItem[];
	methods: string;
	cautions: ReportCaution[];
	safetyMeasures: string | null;
	deferral: string;
	curves: { x: number[]; series: { name: string; kind: 'absorbance' | 'emission' | 'transmission'; y: number[] }[] } | null;
	modelNote: string;
}

/** 3 significant figures in scientific notation with a proper times sign and superscript exponent: 3.42 × 10⁻⁷. */
export function sci(v: number | null, digits = 3): string {
	if (v === null || !Number.isFinite(v)) return '—';
	if (v === 0) return '0';
	const e = Math.floor(Math.log10(Math.abs(v)));
	if (e >= -2 && e <= 3) return Number(v.toPrecision(digits)).toString();
	const m = v / 10 ** e;
	const sup = String(e).replace(/[-0-9]/g, (c) => '⁻⁰¹²³⁴⁵⁶⁷⁸⁹'['-0123456789'.indexOf(c)]);
	return `${m.toFixed(digits - 1)} × 10${sup}`;
}

/** A duration in words a chemist uses: 45 s, 12 min, 3.5 h, 2.0 d. */
export function duration(s: number | null): string {
	if (s === null || !Number.isFinite(s)) return '—';
	if (s < 120) return `${Math.round(s)} s`;
	if (s < 7200) return `${Math.round(s / 60)} min`;
	if (s < 172800) return `${(s / 3600).toFixed(1)} h`;
	return `${(s / 86400).toFixed(1)} d`;
}

const molar = (c: number | null) => (c === null ? '—' : c >= 0.1 ? `${Number(c.toPrecision(3))} M` : c >= 1e-4 ? `${Number((c * 1000).toPrecision(3))} mM` : `${Number((c * 1e6).toPrecision(3))} µM`);

function vesselText(inputs: R, pathCm: number | null): string {
	const v = o(inputs.vessel);
	if (v.shape === 'cylinder') return `round tube or flask, inner diameter ${num(v.innerDiameterCm)} cm, lit from one side (chord-averaged)`;
	if (v.shape === 'annulus') return `immersion well (annulus), inner diameter ${num(v.innerDiameterCm)} cm, outer diameter ${num(v.outerDiameterCm)} cm, lamp inside`;
	return `flat layer (slab), optical path ${pathCm ?? '—'} cm, lit face-on`;
}

function reactionText(inputs: R, names: Map<number, string>): string | null {
	const r = o(inputs.reaction);
	if (r.type === 'photocatalytic') {
		const pc = o(r.photocatalyst);
		return `photocatalytic: ${names.get(Number(pc.spectrumId)) ?? `spectrum #${pc.spectrumId}`} (${molar(num(pc.concentrationM))}) absorbs and is not consumed`;
	}
	if (r.type === 'reversible') return `reversible photoreaction (product ${names.get(Number(o(r.product).spectrumId)) ?? `spectrum #${o(r.product).spectrumId}`}, Φ back = ${num(r.quantumYieldBack) ?? '—'})`;
	return 'direct photolysis of the substrate';
}

/** Builds the report of a plan (or of one of its frozen revisions). */
export function buildPlanReport(src: ReportSource): PlanReport {
	const { inputs, results } = src;
	const d = o(src.decision);
	const lamp = o(results.decided);
	const substrate = o(results.substrate);
	const solvent = o(results.solvent);
	const wall = o(results.wall);
	const curves = o(results.curves);
	const names = new Map<number, string>();
	if (num(substrate.id)) names.set(Number(substrate.id), String(substrate.name));
	for (const x of arr(curves.others)) names.set(Number(x.id), String(x.name));
	const pathCm = num(d.pathCm) ?? num(inputs.pathCm);
	const volumeL = num(inputs.volumeL);
	const timeS = num(d.irradiationTimeS);
	const temperature = num(d.temperatureC);
	const phi = num(inputs.quantumYield);
	const others = arr(inputs.others).map((x) => `${names.get(Number(x.spectrumId)) ?? `spectrum #${x.spectrumId}`} ${molar(num(x.concentrationM))}`);
	const flow = o(inputs.flow);
	const incident = num(lamp.incidentPhotonFluxEinsteinPerS);
	const absorbed = num(lamp.absorbedByIntendedEinsteinPerS) ?? num(lamp.absorbedPhotonFluxEinsteinPerS);
	const fractionAbsorbed = incident && absorbed !== null ? absorbed / incident : null;
	const lampName = String(lamp.name ?? '—');
	const basis = String(lamp.photonFluxBasisLabel ?? lamp.photonFluxBasis ?? 'model');
	const reaction = reactionText(inputs, names);
	const windows = arr(results.windows).map((w) => `${w.fromNm}–${w.toNm} nm`).join(', ');
	const peakNm = num(lamp.peakNm);
	// "Absorbance at λ_irr": for a polychromatic lamp the wavelength that matters is where the absorber takes up the
	// most photons, argmax of emission(λ)·(1 − 10^−A(λ)) on the plan's 1 nm curves, not the emission peak.
	const atIrradiation = (() => {
		const x = arr(curves.x) as unknown as number[];
		const y = arr(curves.substrateAbsorbance) as unknown as number[];
		const em = arr(arr(curves.lamps).find((l) => Number(l.id) === Number(lamp.lampId))?.emission) as unknown as number[];
		if (!x.length || !y.length || !em.length) return null;
		let best = -1, bestV = 0;
		for (let i = 0; i < x.length; i++) {
			const v = (em[i] ?? 0) * (1 - 10 ** -(y[i] ?? 0));
			if (v > bestV) { bestV = v; best = i; }
		}
		return best < 0 ? null : { wavelengthNm: x[best], absorbance: y[best] };
	})();

	const item = (label: string, value: string | null | undefined, recorded = value !== null && value !== undefined && value !== ''): ChecklistItem => ({
		label,
		value: recorded ? String(value) : 'not recorded in this plan — record it before publishing',
		recorded
	});
	const checklist: ChecklistItem[] = [
		item('Light source', lamp.name ? `${lampName} — ${lamp.modelLabel ?? ''}`.trim() : null),
		item('Emission spectrum', peakNm ? `peak ${Math.round(peakNm)} nm${num(lamp.fwhmNm) ? `, FWHM ${num(lamp.fwhmNm)} nm` : ''} (${String(o(lamp.model).type) === 'spectrum' ? 'measured emission spectrum' : 'emission model'}); plotted below` : null),
		item('Optical power at the vessel', num(lamp.powerW) !== null ? `${lamp.powerW} W optical × coupling factor ${lamp.couplingFactor ?? '—'}` : null),
		item('Electrical power', null),
		item('Photon flux into the vessel and its basis', incident !== null ? `${sci(incident)} einstein s⁻¹ (${basis})` : null),
		item('Absorbed photon flux (intended absorber)', absorbed !== null ? `${sci(absorbed)} einstein s⁻¹ (${fractionAbsorbed !== null ? `${(100 * fractionAbsorbed).toFixed(1)} % of the incident photons` : ''})` : null),
		item('Absorbance at the irradiation wavelength, fraction absorbed', atIrradiation ? `A(${Math.round(atIrradiation.wavelengthNm)} nm) = ${atIrradiation.absorbance.toFixed(3)} over ${pathCm} cm, where the absorber takes up most of the lamp's photons${fractionAbsorbed !== null ? `; fraction of the incident photons it absorbs ${(100 * fractionAbsorbed).toFixed(1)} %` : ''}` : null),
		item('Distance and geometry', lamp.distanceNote ? String(lamp.distanceNote) : null),
		item('Vessel', vesselText(inputs, pathCm)),
		item('Vessel material and wall thickness', wall.name ? `${wall.name}, ${num(d.wall && o(d.wall).thicknessMm) ?? wall.thicknessMm} mm` : null),
		item('Fill volume', volumeL !== null ? `${Number((volumeL * 1000).toPrecision(4))} mL` : null),
		item('Filters', null),
		item('Solvent', solvent.name ? `${solvent.name} (cut-off ${solvent.cutoffNm ?? '—'} nm; ${solvent.basis ?? ''})` : null),
		item('Concentrations', substrate.name ? [`${substrate.name} ${molar(num(substrate.concentrationM))}`, ...others].join('; ') : null),
		item('Reaction type', reaction),
		item('Degassing and atmosphere', null),
		item('Temperature of the mixture (measured, not the set-point)', temperature !== null ? `${temperature} °C (planned)` : null),
		item('Stirring', null),
		item('Quantum yield Φ', phi !== null ? `${phi} (assumed for the planned times)` : null),
		item('Irradiation time', timeS !== null ? `${duration(timeS)} (${Math.round(timeS)} s) planned${num(lamp.timeTo90PctS) ? `; model time to 90 % conversion ${duration(num(lamp.timeTo90PctS))}` : ''}` : null),
		item('Residence time and flow rate', num(flow.reactorVolumeMl) ? `reactor ${flow.reactorVolumeMl} mL at ${flow.flowRateMlPerMin} mL min⁻¹ (τ = ${Number(((Number(flow.reactorVolumeMl) / Number(flow.flowRateMlPerMin)) * 60).toPrecision(3))} s)` : null),
		item('Excitation window', windows || 'none found under these conditions'),
		item('Lamp age and warm-up', null)
	];

	const methods = [
		`Irradiations were carried out with the ${nameInSentence(lampName)}${peakNm ? ` (emission maximum ${Math.round(peakNm)} nm${num(lamp.fwhmNm) ? `, FWHM ${num(lamp.fwhmNm)} nm` : ''})` : ''}${lamp.distanceNote ? `, ${lamp.distanceNote}` : ''}.`,
		incident !== null ? `The photon flux entering the solution was ${sci(incident)} einstein s⁻¹ (${basis}).` : '',
		`A solution of ${substrate.name ?? 'the substrate'} (${molar(num(substrate.concentrationM))}${others.length ? `; with ${others.join(', ')}` : ''}) in ${String(solvent.name ?? 'the solvent').toLowerCase()}${volumeL !== null ? ` (${Number((volumeL * 1000).toPrecision(4))} mL)` : ''} was irradiated in a vessel of ${String(wall.name ?? 'the chosen wall material').toLowerCase()} (wall ${num(o(d.wall).thicknessMm) ?? wall.thicknessMm} mm; ${vesselText(inputs, pathCm)})${temperature !== null ? ` at ${temperature} °C` : ''}${timeS !== null ? ` for ${duration(timeS)}` : ''}.`,
		absorbed !== null ? `Under these conditions the intended absorber takes up an estimated ${sci(absorbed)} einstein s⁻¹ (${fractionAbsorbed !== null ? `${(100 * fractionAbsorbed).toFixed(0)} %` : '—'} of the incident photons; inner-filter model, IUPAC 2007).` : ''
	]
		.filter(Boolean)
		.join(' ');

	const cautions = arr(lamp.cautions).length ? arr(lamp.cautions) : arr(results.cautions);
	const reportCautions = cautions.map((c) => ({ title: String(c.title), text: String(c.text), severity: String(c.severity), band: (c.band as string) ?? null, source: String(c.source ?? '') }));
	// The list ends with the deferral, whatever the stored cautions held.
	const withoutDeferral = reportCautions.filter((c) => c.text !== SAFETY_DEFERRAL_TEXT);

	const x = arr(curves.x) as unknown as number[];
	const series: NonNullable<PlanReport['curves']>['series'] = [];
	if (x.length) {
		if (Array.isArray(curves.substrateAbsorbance)) series.push({ name: `${substrate.name ?? 'substrate'} (absorbance)`, kind: 'absorbance', y: curves.substrateAbsorbance as number[] });
		for (const s of arr(curves.others)) series.push({ name: `${s.name} (absorbance)`, kind: 'absorbance', y: s.absorbance as number[] });
		if (Array.isArray(curves.solventAbsorbance)) series.push({ name: `${solvent.name ?? 'solvent'} (absorbance)`, kind: 'absorbance', y: curves.solventAbsorbance as number[] });
		if (Array.isArray(curves.wallTransmission)) series.push({ name: `${wall.name ?? 'wall'} (transmission)`, kind: 'transmission', y: curves.wallTransmission as number[] });
		const chosen = arr(curves.lamps).find((l) => Number(l.id) === Number(lamp.lampId));
		if (chosen) series.push({ name: `${chosen.name} (relative emission)`, kind: 'emission', y: chosen.emission as number[] });
	}
	const status =
		src.state === 'approved'
			? `Approved by ${src.reviewerName ?? '—'}${src.reviewedAt ? ` on ${new Date(src.reviewedAt).toISOString().slice(0, 10)}` : ''}`
			: `${src.state[0].toUpperCase()}${src.state.slice(1)} — not approved`;
	return {
		heading: src.title,
		subtitle: `Irradiation plan #${src.id}${src.revision ? `, revision ${src.revision.number} (${src.revision.reason}, ${src.revision.createdAt.toISOString().slice(0, 10)})` : `, version ${src.version}`} · ${src.groupName} · author ${src.ownerName ?? '—'}`,
		status,
		checklist,
		methods,
		cautions: withoutDeferral,
		safetyMeasures: (d.safetyMeasures as string) || null,
		deferral: SAFETY_DEFERRAL_TEXT,
		curves: series.length ? { x, series } : null,
		modelNote: `Numbers are model estimates for a ${o(inputs.vessel).shape === 'cylinder' ? 'cylindrical vessel (chord-averaged)' : o(inputs.vessel).shape === 'annulus' ? 'annular vessel' : 'slab vessel lit face-on'}, as frozen in the plan when it was saved${src.revision ? ' or recomputed' : ''}; photon flux basis: ${basis}. Report generated ${src.generatedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC.`
	};
}
