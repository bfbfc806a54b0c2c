/** Reads the detail page's metadata form into a PATCH body (the zod schema in the service validates it). */

const list = (v: FormDataEntryValue | null) =>
	String(v ?? '')
		.split(/[;,\n]/)
		.map((s) => s.trim())
		.filter(Boolean);

/**
 * One excited-state potential per line: `E(PC* / PC−) = −1.73 V vs SCE` (unicode minus accepted).
 * @returns the list, or an error naming the line
 */
export function parsePotentials(text: string): { value: { label: string; volts: number; reference: string }[] } | { error: string } {
	const out = [];
	const lines = text.split('\n').map((l) => l.trim()).filter(Boolean);
	for (let i = 0; i < lines.length; i++) {
		const m = /^(.+?)\s*=\s*([-+−]?\d+(?:\.\d+)?)\s*V?\s*(?:vs\.?\s*(.+))?$/i.exec(lines[i]);
		if (!m) return { error: `excited-state potentials, line ${i + 1}: write e.g. “E(PC*/PC−) = −1.73 V vs SCE”` };
		out.push({ label: m[1], volts: Number(m[2].replace('−', '-')), reference: (m[3] ?? 'SCE').trim() });
	}
	return { value: out };
}

/** Form fields → PATCH body; empty inputs clear optional values. */
export function formToPatch(form: FormData): { value: Record<string, unknown> } | { error: string; field: string } {
	const pot = parsePotentials(String(form.get('potentials') ?? ''));
	if ('error' in pot) return { error: pot.error, field: 'excitedStatePotentials' };
	const str = (k: string) => String(form.get(k) ?? '');
	return {
		value: {
			version: str('version'),
			name: str('name'),
			synonyms: list(form.get('synonyms')),
			cas: str('cas'),
			part: str('part'),
			solvent: str('solvent'),
			concentrationM: str('concentrationM'),
			pathCm: str('pathCm'),
			thicknessMm: str('thicknessMm'),
			temperatureC: str('temperatureC'),
			instrument: str('instrument'),
			notes: str('notes'),
			tags: list(form.get('tags')),
			visibility: str('visibility'),
			tripletEnergyKjPerMol: str('tripletEnergyKjPerMol'),
			excitedStatePotentials: pot.value
		}
	};
}
