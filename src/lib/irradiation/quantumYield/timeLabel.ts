/** Reading an irradiation time from a spectrum's label (a module of its own: the browser uses it too). */

/** Times read from spectrum names or column headers ("t = 30 s", "120 s", "2 min", "1.5 h", "t=45"); null when not a time. */
export function timeFromLabel(label: string): number | null {
	const m = /(?:^|[^a-z0-9.])(?:t\s*=?\s*)?(\d+(?:[.,]\d+)?)\s*(ms|s|sec|secs|seconds?|min|mins|minutes?|h|hr|hrs|hours?)?\s*\)?\s*$/i.exec(label.trim());
	if (!m) return null;
	const v = Number(m[1].replace(',', '.'));
	const unit = (m[2] ?? '').toLowerCase();
	const hasT = /t\s*=?\s*\d/i.test(label);
	if (!unit && !hasT) return null;
	const f = unit.startsWith('ms') ? 1e-3 : unit.startsWith('m') ? 60 : unit.startsWith('h') ? 3600 : 1;
	return v * f;
}

/** The irradiation time of a series spectrum: the time stored with its block (kinetics files), else read from its label. */
export const seriesTimeS = (blockTimeS: number | null | undefined, label: string): number | null => blockTimeS ?? timeFromLabel(label);
