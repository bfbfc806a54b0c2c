/** Measured quantum yields stored on a reactant's spectrum (table measured_quantum_yields). */
import { db } from './index';

export interface MeasuredQuantumYieldRow {
	id: number;
	spectrumId: number;
	groupId: number;
	lampId: number | null;
	lampName: string | null;
	method: string;
	reactionType: string;
	quantumYield: number;
	standardError: number;
	quantumYieldBack: number | null;
	standardErrorBack: number | null;
	initialRateQuantumYield: number | null;
	fromNm: number | null;
	toNm: number | null;
	photonFluxBasis: string | null;
	createdBy: string | null;
	measuredAt: string;
}

const num = (v: unknown) => (v == null ? null : Number(v));
const toRow = (r: Record<string, unknown>): MeasuredQuantumYieldRow => ({
	id: Number(r.id),
	spectrumId: Number(r.spectrum_id),
	groupId: Number(r.group_id),
	lampId: num(r.lamp_id),
	lampName: (r.lamp_name as string) ?? null,
	method: String(r.method),
	reactionType: String(r.reaction_type),
	quantumYield: Number(r.quantum_yield),
	standardError: Number(r.standard_error),
	quantumYieldBack: num(r.quantum_yield_back),
	standardErrorBack: num(r.standard_error_back),
	initialRateQuantumYield: num(r.initial_rate_quantum_yield),
	fromNm: num(r.from_nm),
	toNm: num(r.to_nm),
	photonFluxBasis: (r.photon_flux_basis as string) ?? null,
	createdBy: (r.created_by as string) ?? null,
	measuredAt: new Date(r.measured_at as string).toISOString()
});

export async function insertMeasuredQuantumYield(row: Omit<MeasuredQuantumYieldRow, 'id' | 'measuredAt'> & { inputs: unknown }): Promise<number> {
	const [id] = await db()('measured_quantum_yields').insert({
		spectrum_id: row.spectrumId,
		group_id: row.groupId,
		lamp_id: row.lampId,
		lamp_name: row.lampName,
		method: row.method,
		reaction_type: row.reactionType,
		quantum_yield: row.quantumYield,
		standard_error: row.standardError,
		quantum_yield_back: row.quantumYieldBack,
		standard_error_back: row.standardErrorBack,
		initial_rate_quantum_yield: row.initialRateQuantumYield,
		from_nm: row.fromNm,
		to_nm: row.toNm,
		photon_flux_basis: row.photonFluxBasis,
		inputs: JSON.stringify(row.inputs),
		created_by: row.createdBy
	});
	return Number(id);
}

/** Newest first. */
export async function listMeasuredQuantumYields(spectrumId: number): Promise<MeasuredQuantumYieldRow[]> {
	const rows = await db()('measured_quantum_yields').where({ spectrum_id: spectrumId }).orderBy([{ column: 'measured_at', order: 'desc' }, { column: 'id', order: 'desc' }]);
	return rows.map(toRow);
}

/** The API shape. */
export const measuredQuantumYieldToApi = (r: MeasuredQuantumYieldRow) => ({
	id: r.id,
	quantumYield: r.quantumYield,
	standardError: r.standardError,
	quantumYieldBack: r.quantumYieldBack,
	standardErrorBack: r.standardErrorBack,
	initialRateQuantumYield: r.initialRateQuantumYield,
	reactionType: r.reactionType,
	method: r.method,
	lampId: r.lampId,
	lampName: r.lampName,
	photonFluxBasis: r.photonFluxBasis,
	fromNm: r.fromNm,
	toNm: r.toNm,
	measuredAt: r.measuredAt
});
