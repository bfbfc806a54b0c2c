/** Metadata of a JCAMP block from its labelled data records (block value wins over the LINK header). */
import type { SpectrumFileMetadata } from '../types';

const pick = (m: Map<string, string>, keys: string[]) => {
	for (const k of keys) {
		const v = m.get(k);
		if (v !== undefined && v !== '') return v;
	}
	return undefined;
};

/** Molar concentration from "0.001", "1e-3 M", "6 mM", "25 µM", "2 mol/L"; undefined for free text. */
export function parseConcentrationM(text: string): number | undefined {
	const m = /^\s*([+-]?\d*\.?\d+(?:[eE][+-]?\d+)?)\s*(M|mol\/L|mol\/l|mol L-1|mM|mmol\/L|µM|uM|μM|nM)?\s*$/.exec(text);
	if (!m) return undefined;
	const scale: Record<string, number> = { mM: 1e-3, 'mmol/L': 1e-3, µM: 1e-6, uM: 1e-6, μM: 1e-6, nM: 1e-9 };
	return Number(m[1]) * (m[2] ? (scale[m[2]] ?? 1) : 1);
}

/** Path length in cm from "1", "1 cm", "10 mm". */
export function parseLengthCm(text: string): number | undefined {
	const m = /^\s*(\d*\.?\d+(?:[eE][+-]?\d+)?)\s*(cm|mm|m)?\s*$/i.exec(text);
	if (!m) return undefined;
	const unit = (m[2] ?? 'cm').toLowerCase();
	return Number(m[1]) * (unit === 'mm' ? 0.1 : unit === 'm' ? 100 : 1);
}

/** Reads title, CAS, solvent, concentration, path, origin, owner, date, instrument, temperature. */
export function readJcampMetadata(ldr: Map<string, string>, parent?: Map<string, string>): SpectrumFileMetadata {
	const get = (keys: string[]) => pick(ldr, keys) ?? (parent ? pick(parent, keys) : undefined);
	const md: SpectrumFileMetadata = {};
	const set = (k: string, v: string | number | undefined) => {
		if (v !== undefined && v !== '') md[k] = v;
	};
	set('title', get(['TITLE']));
	set('cas', get(['CASREGISTRYNO', 'CASRN', 'CAS', '$CAS']));
	set('solvent', get(['SOLVENTNAME', '$SOLVENT', 'SOLVENT', '$SOLVENTNAME', 'SOLVENTREFERENCE']));
	const conc = get(['CONCENTRATION', 'CONCENTRATIONS', '$CONCENTRATION', '$CONCENTRATIONM']);
	if (conc !== undefined) {
		const c = parseConcentrationM(conc);
		if (c !== undefined && c > 0) md.concentrationM = c;
		else md.concentrationText = conc;
	}
	const path = get(['PATHLENGTH', '$PATHLENGTH', '$PATHCM']);
	if (path !== undefined) {
		const l = parseLengthCm(path);
		if (l !== undefined && l > 0) md.pathCm = l;
		else md.pathText = path;
	}
	set('origin', get(['ORIGIN']));
	set('owner', get(['OWNER']));
	const date = get(['LONGDATE', 'DATE']);
	const time = get(['TIME']);
	set('date', date && time ? `${date} ${time}` : date);
	set('instrument', get(['SPECTROMETERDATASYSTEM', 'INSTRUMENT', '$INSTRUMENT']));
	const t = get(['TEMPERATURE', '$TEMPERATURE']);
	if (t !== undefined && Number.isFinite(Number(t))) md.temperatureC = Number(t);
	return md;
}
