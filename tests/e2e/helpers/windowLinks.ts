/**
 * Window finder links for browser tests: looks up the demo spectra, solvents, walls and lamps by name through the API
 * (ids depend on seeding order) and writes the page's query string.
 */
import type { APIRequestContext } from '@playwright/test';

export interface Ids {
	spectrum: (name: string) => number;
	solvent: (name: string) => number;
	material: (slug: string) => number;
	lamp: (name: RegExp) => number;
}

export async function demoIds(request: APIRequestContext): Promise<Ids> {
	const spectra = (await (await request.get('/api/spectra?limit=500')).json()).items as { id: number; name: string }[];
	const solvents = (await (await request.get('/api/solvents')).json()) as { id: number; name: string }[];
	const materials = (await (await request.get('/api/materials')).json()) as { id: number; slug: string }[];
	const lampsBody = await (await request.get('/api/lamps')).json();
	const lamps = (Array.isArray(lampsBody) ? lampsBody : lampsBody.items) as { id: number; name: string }[];
	const need = <T>(x: T | undefined, what: string): T => {
		if (x === undefined) throw new Error(`demo data has no ${what}`);
		return x;
	};
	return {
		spectrum: (name) => need(spectra.find((s) => s.name === name), `spectrum ${name}`).id,
		solvent: (name) => need(solvents.find((s) => s.name === name), `solvent ${name}`).id,
		material: (slug) => need(materials.find((m) => m.slug === slug), `material ${slug}`).id,
		lamp: (re) => need(lamps.find((l) => re.test(l.name)), `lamp ${re}`).id
	};
}

/** The query string of the Window finder for these inputs (same keys as src/routes/(app)/window/windowQuery.ts). */
export function windowLink(q: Record<string, string | number | undefined>): string {
	const p = new URLSearchParams();
	for (const [k, v] of Object.entries(q)) if (v !== undefined) p.set(k, String(v));
	return `/window?${p}`;
}
