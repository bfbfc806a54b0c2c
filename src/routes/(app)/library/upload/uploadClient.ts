/** Browser side of the upload page: XMLHttpRequest with upload progress, and the metadata JSON of a card's form. */

export interface XhrResult {
	status: number;
	body: unknown;
}

/** POSTs a file to /api/spectra (optionally `?preview=1`) and reports upload progress 0–1. */
export function sendSpectrum(file: File, metadata: Record<string, unknown>, preview: boolean, onProgress: (fraction: number) => void): Promise<XhrResult> {
	return new Promise((resolve) => {
		const xhr = new XMLHttpRequest();
		xhr.open('POST', `/api/spectra${preview ? '?preview=1' : ''}`);
		xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
		xhr.onload = () => {
			let body: unknown = null;
			try {
				body = JSON.parse(xhr.responseText);
			} catch {
				body = { error: { message: xhr.responseText.slice(0, 200) || `HTTP ${xhr.status}` } };
			}
			onProgress(1);
			resolve({ status: xhr.status, body });
		};
		xhr.onerror = () => resolve({ status: 0, body: { error: { message: 'The connection failed; try again.' } } });
		const fd = new FormData();
		fd.append('file', file);
		fd.append('metadata', JSON.stringify(metadata));
		xhr.send(fd);
	});
}

const list = (v: FormDataEntryValue | null) => String(v ?? '').split(/[;,\n]/).map((s) => s.trim()).filter(Boolean);

/** The metadata JSON of one card's form (empty inputs omitted; numbers parsed; potentials one per line). */
export function metadataFromForm(form: HTMLFormElement): { value: Record<string, unknown> } | { error: string } {
	const fd = new FormData(form);
	const out: Record<string, unknown> = {};
	for (const k of ['name', 'cas', 'part', 'solvent', 'instrument', 'notes', 'visibility', 'kind', 'xUnit', 'yUnit', 'layout']) {
		const v = String(fd.get(k) ?? '').trim();
		if (v) out[k] = v;
	}
	for (const k of ['concentrationM', 'pathCm', 'thicknessMm', 'temperatureC', 'tripletEnergyKjPerMol']) {
		const v = String(fd.get(k) ?? '').trim();
		if (!v) continue;
		const n = Number(v.replace(',', '.'));
		if (!Number.isFinite(n)) return { error: `${k}: “${v}” is not a number` };
		out[k] = n;
	}
	const syn = list(fd.get('synonyms'));
	if (syn.length) out.synonyms = syn;
	const tags = list(fd.get('tags'));
	if (tags.length) out.tags = tags;
	const cols = fd.getAll('columns').map(Number);
	if (cols.length) out.columns = cols;
	const group = String(fd.get('group') ?? '');
	if (group) out.group = Number(group);
	const pots = String(fd.get('potentials') ?? '').split('\n').map((l) => l.trim()).filter(Boolean);
	const potentials = [];
	for (const [i, l] of pots.entries()) {
		const m = /^(.+?)\s*=\s*([-+−]?\d+(?:\.\d+)?)\s*V?\s*(?:vs\.?\s*(.+))?$/i.exec(l);
		if (!m) return { error: `excited-state potentials, line ${i + 1}: write e.g. “E(PC*/PC−) = +1.21 V vs SCE”` };
		potentials.push({ label: m[1], volts: Number(m[2].replace('−', '-')), reference: (m[3] ?? 'SCE').trim() });
	}
	if (potentials.length) out.excitedStatePotentials = potentials;
	return { value: out };
}
