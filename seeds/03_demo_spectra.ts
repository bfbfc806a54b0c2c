/**
 * Demo spectra of the invented Harbourlight scenario (demo only; every compound, catalyst, filter
 * and lamp here is invented and its bands are generated: Gaussian bands on a wavenumber scale or
 * log-normal bands in ε). Stored through the same service code path as an upload — the CSV text
 * is built here and parsed, normalised, derived and persisted exactly like a file from the bench.
 * Idempotent (a file already in the group is skipped); production mode without WINDOWSILL_DEMO=1
 * seeds nothing.
 */
import type { Knex } from 'knex';
import { prepareSpectra } from '../src/lib/server/services/spectraPrepare';
import { storeSpectra } from '../src/lib/server/services/spectraStore';
import type { UploadMetadata } from '../src/lib/schemas/spectra';

/** Gaussian band on the wavenumber axis (symmetric in energy), peak ε at λ0, FWHM in cm⁻¹. */
const bandE = (λ: number, λ0: number, fwhmCm: number, h: number) => h * Math.exp((-4 * Math.LN2 * (1e7 / λ - 1e7 / λ0) ** 2) / fwhmCm ** 2);
/** Log-normal band in wavelength (skewed to the red), width σ in ln λ. */
const bandLog = (λ: number, λ0: number, σ: number, h: number) => h * Math.exp(-0.5 * (Math.log(λ / λ0) / σ) ** 2);
/** Logistic edge from 0 to `top` centred at λ50 (walls, long-pass filters). */
const edge = (λ: number, λ50: number, widthNm: number, top: number) => top / (1 + Math.exp(-(λ - λ50) / widthNm));
/** Solvent absorbance of 1 cm near its cut-off: A = 10^((λc − λ)/s), s = 10 nm per decade (PRODUCT.md model), capped at 4. */
const solventA = (λ: number, cutoffNm: number) => Math.min(4, 10 ** ((cutoffNm - λ) / 10));

interface DemoSpectrum {
	file: string;
	header: string;
	y: (λ: number) => number;
	fromNm?: number;
	toNm?: number;
	owner: 'lead' | 'member' | 'outsider';
	meta: UploadMetadata;
}

const ε = 'wavelength (nm),epsilon (M-1 cm-1)';
const A = 'wavelength (nm),absorbance';
const T = 'wavelength (nm),transmittance (%)';
const EM = 'wavelength (nm),relative emission';
const potentials = (red: number, ox: number) => [
	{ label: 'E(PC*/PC−)', volts: red, reference: 'SCE' },
	{ label: 'E(PC+/PC*)', volts: ox, reference: 'SCE' }
];

const SPECTRA: DemoSpectrum[] = [
	// substrates
	{ file: 'pinewick-ester.csv', header: ε, y: (l) => bandE(l, 256, 4200, 14200) + bandE(l, 212, 5000, 21000), owner: 'member', meta: { name: 'Pinewick ester', part: 'substrate', solvent: 'acetonitrile', synonyms: ['PW-ester'], tags: ['uv-c only', 'demo'], tripletEnergyKjPerMol: 238, visibility: 'group', notes: 'Absorbs only below about 290 nm: needs UV-C or a sensitiser.' } },
	{ file: 'morrow-enone.csv', header: ε, y: (l) => bandLog(l, 364, 0.055, 9600) + bandE(l, 238, 5000, 12500), owner: 'member', meta: { name: 'Morrow enone', part: 'substrate', solvent: 'dichloromethane', synonyms: ['ME-3', 'Morrow cyclohexenone'], tags: ['[2+2]', 'uv-a', 'demo'], visibility: 'group' } },
	{ file: 'calder-aryl-bromide.csv', header: A, y: (l) => bandE(l, 279, 4500, 0.64) + bandE(l, 224, 6000, 1.4), owner: 'lead', meta: { name: 'Calder aryl bromide', part: 'substrate', solvent: 'acetonitrile', concentrationM: 2e-4, pathCm: 1, tags: ['demo'], visibility: 'group' } },
	{ file: 'dunmore-cinnamate.csv', header: ε, y: (l) => bandLog(l, 309, 0.07, 24500) + bandE(l, 218, 5000, 15000), owner: 'lead', meta: { name: 'Dunmore cinnamate', part: 'substrate', solvent: 'methanol', tags: ['e/z isomerisation', 'demo'], visibility: 'public' } },
	{ file: 'larch-diene.csv', header: ε, y: (l) => bandE(l, 233, 3500, 21000), owner: 'member', meta: { name: 'Larch diene', part: 'substrate', solvent: 'cyclohexane', tags: ['demo'], visibility: 'group' } },
	{ file: 'skerry-azide.csv', header: ε, y: (l) => bandE(l, 287, 5000, 1900) + bandE(l, 226, 6000, 9000), owner: 'member', meta: { name: 'Skerry azide', part: 'substrate', solvent: 'acetonitrile', tags: ['draft'], visibility: 'private', notes: 'Draft measurement, not shared yet.' } },
	// photocatalysts (triplet energies and excited-state potentials invented for the demo)
	{ file: 'tidewater-blue-twb7.csv', header: ε, y: (l) => bandLog(l, 452, 0.06, 14200) + bandE(l, 288, 4000, 36000), owner: 'lead', meta: { name: 'Tidewater Blue (TWB-7)', part: 'photocatalyst', solvent: 'acetonitrile', synonyms: ['TWB-7'], tags: ['blue', 'metal complex', 'demo'], tripletEnergyKjPerMol: 232, excitedStatePotentials: potentials(-0.81, 1.21), visibility: 'group' } },
	{ file: 'harbour-amber-ha2.csv', header: ε, y: (l) => bandLog(l, 421, 0.07, 6800) + bandE(l, 262, 4500, 28000), owner: 'member', meta: { name: 'Harbour Amber (HA-2)', part: 'photocatalyst', solvent: 'acetonitrile', synonyms: ['HA-2'], tags: ['violet', 'metal complex', 'demo'], tripletEnergyKjPerMol: 250, excitedStatePotentials: potentials(-1.73, 0.77), visibility: 'group' } },
	{ file: 'kestrel-violet.csv', header: ε, y: (l) => bandLog(l, 396, 0.065, 4100) + bandE(l, 250, 5000, 19000), owner: 'lead', meta: { name: 'Kestrel Violet', part: 'photocatalyst', solvent: 'dichloromethane', tags: ['violet', 'demo'], tripletEnergyKjPerMol: 261, visibility: 'public' } },
	{ file: 'fenwick-green.csv', header: ε, y: (l) => bandLog(l, 531, 0.045, 52000) + bandE(l, 498, 1800, 14000) + bandE(l, 300, 5000, 9000), owner: 'member', meta: { name: 'Fenwick Green dye', part: 'photocatalyst', solvent: 'ethanol', tags: ['green', 'organic dye', 'demo'], tripletEnergyKjPerMol: 181, excitedStatePotentials: potentials(-1.1, 0.83), visibility: 'group' } },
	{ file: 'saltmarsh-ketone.csv', header: ε, y: (l) => bandLog(l, 381, 0.06, 6300) + bandE(l, 258, 4000, 42000), owner: 'member', meta: { name: 'Saltmarsh ketone sensitiser', part: 'photocatalyst', solvent: 'acetonitrile', synonyms: ['SK-sens'], tags: ['energy transfer', 'uv-a', 'demo'], tripletEnergyKjPerMol: 266, visibility: 'group' } },
	{ file: 'corran-red.csv', header: ε, y: (l) => bandLog(l, 562, 0.04, 78000) + bandE(l, 525, 1800, 25000), owner: 'lead', meta: { name: 'Corran Red', part: 'photocatalyst', solvent: 'methanol', tags: ['green', 'organic dye', 'demo'], tripletEnergyKjPerMol: 172, visibility: 'group' } },
	// products (the Morrow cyclobutane still absorbs where its enone does: it competes for photons)
	{ file: 'morrow-cyclobutane.csv', header: ε, y: (l) => bandLog(l, 352, 0.06, 4200) + bandE(l, 240, 5000, 9000), owner: 'member', meta: { name: 'Morrow cyclobutane', part: 'product', solvent: 'dichloromethane', tags: ['[2+2]', 'demo'], visibility: 'group', notes: 'Product of Morrow enone; absorbs at 350–380 nm as well.' } },
	{ file: 'pinewick-acid.csv', header: ε, y: (l) => bandE(l, 248, 4500, 11000), owner: 'member', meta: { name: 'Pinewick acid', part: 'product', solvent: 'acetonitrile', tags: ['demo'], visibility: 'group' } },
	{ file: 'dunmore-cinnamate-z.csv', header: ε, y: (l) => bandLog(l, 301, 0.075, 15800) + bandE(l, 220, 5000, 14000), owner: 'lead', meta: { name: 'Dunmore cinnamate (Z isomer)', part: 'product', solvent: 'methanol', tags: ['e/z isomerisation', 'demo'], visibility: 'public' } },
	// additives
	{ file: 'hollin-amine.csv', header: ε, y: (l) => bandE(l, 259, 4000, 3600), owner: 'member', meta: { name: 'Hollin amine', part: 'additive', solvent: 'acetonitrile', tags: ['reductant', 'demo'], visibility: 'group' } },
	{ file: 'tarrow-dihydropyridine.csv', header: ε, y: (l) => bandLog(l, 352, 0.07, 7300) + bandE(l, 232, 5000, 16000), owner: 'lead', meta: { name: 'Tarrow dihydropyridine', part: 'additive', solvent: 'acetonitrile', tags: ['reductant', 'uv-a', 'demo'], visibility: 'group', notes: 'Absorbs up to ~400 nm: an inner filter under UV-A.' } },
	{ file: 'brisk-thiol.csv', header: ε, y: (l) => bandE(l, 238, 4000, 2400), owner: 'member', meta: { name: 'Brisk thiol', part: 'additive', solvent: 'acetonitrile', tags: ['hat catalyst', 'demo'], visibility: 'group' } },
	// solvents: measured neat in a 1 cm cell against air (absorbance)
	{ file: 'acetonitrile-neat-1cm.csv', header: A, y: (l) => solventA(l, 192), owner: 'lead', meta: { name: 'Acetonitrile, neat (1 cm)', part: 'solvent', solvent: 'acetonitrile', pathCm: 1, tags: ['solvent', 'demo'], visibility: 'public' } },
	{ file: 'dichloromethane-neat-1cm.csv', header: A, y: (l) => solventA(l, 233), owner: 'lead', meta: { name: 'Dichloromethane, neat (1 cm)', part: 'solvent', solvent: 'dichloromethane', pathCm: 1, tags: ['solvent', 'demo'], visibility: 'public' } },
	{ file: 'acetone-neat-1cm.csv', header: A, y: (l) => solventA(l, 330), owner: 'member', meta: { name: 'Acetone, neat (1 cm)', part: 'solvent', solvent: 'acetone', pathCm: 1, tags: ['solvent', 'demo'], visibility: 'public' } },
	// walls and filters: transmission (%T)
	{ file: 'borosilicate-tube-1-5mm.csv', header: T, y: (l) => edge(l, 298, 7, 91.5), fromNm: 220, owner: 'lead', meta: { name: 'Borosilicate 3.3 glass tube wall, 1.5 mm', part: 'wall', thicknessMm: 1.5, tags: ['wall', 'demo'], visibility: 'public' } },
	{ file: 'fused-silica-cell-1-25mm.csv', header: T, y: (l) => edge(l, 196, 3, 92.5), fromNm: 190, owner: 'lead', meta: { name: 'Fused silica cell wall, 1.25 mm', part: 'wall', thicknessMm: 1.25, tags: ['wall', 'demo'], visibility: 'public' } },
	{ file: 'fep-tubing-0-8mm.csv', header: T, y: (l) => edge(l, 232, 12, 86), fromNm: 200, owner: 'member', meta: { name: 'FEP tubing wall, 0.8 mm (flow coil)', part: 'wall', thicknessMm: 0.8, tags: ['wall', 'flow', 'demo'], visibility: 'group' } },
	{ file: 'longpass-400.csv', header: T, y: (l) => edge(l, 401, 4, 90), fromNm: 250, owner: 'member', meta: { name: 'Long-pass filter, 400 nm (demo)', part: 'filter', thicknessMm: 3, tags: ['filter', 'demo'], visibility: 'group' } },
	{ file: 'bandpass-450-40.csv', header: T, y: (l) => 0.05 + 84 * Math.exp(-(((l - 450) / 24) ** 6)), fromNm: 300, owner: 'member', meta: { name: 'Band-pass filter 450/40 (demo)', part: 'filter', thicknessMm: 2, tags: ['filter', 'blue', 'demo'], visibility: 'group' } },
	// bench lamps: relative emission
	{ file: 'bench-led-450.csv', header: EM, y: (l) => bandE(l, 452, 1050, 1), fromNm: 350, toNm: 600, owner: 'lead', meta: { name: 'Bench LED 450 nm (rig B)', part: 'lamp', tags: ['lamp', 'blue', 'demo'], visibility: 'group' } },
	{ file: 'bench-led-365.csv', header: EM, y: (l) => bandE(l, 367, 900, 1), fromNm: 300, toNm: 450, owner: 'lead', meta: { name: 'Bench LED 365 nm (rig A)', part: 'lamp', tags: ['lamp', 'uv-a', 'demo'], visibility: 'group' } },
	{ file: 'bench-led-390.csv', header: EM, y: (l) => bandE(l, 392, 950, 1), fromNm: 320, toNm: 480, owner: 'member', meta: { name: 'Bench LED 390 nm (flow rig)', part: 'lamp', tags: ['lamp', 'violet', 'demo'], visibility: 'group' } },
	// Quillon Materials Lab: rows that Harbourlight must not see
	{ file: 'quillon-photoinitiator-qp1.csv', header: ε, y: (l) => bandLog(l, 377, 0.06, 950) + bandE(l, 275, 5000, 17000), owner: 'outsider', meta: { name: 'Quillon photoinitiator QP-1', part: 'additive', solvent: 'acetonitrile', tags: ['coatings'], visibility: 'private' } },
	{ file: 'quillon-resin-base.csv', header: ε, y: (l) => bandE(l, 276, 4500, 2100), owner: 'outsider', meta: { name: 'Quillon resin base', part: 'substrate', solvent: 'neat', tags: ['coatings'], visibility: 'group' } }
];

/** The CSV text of one demo spectrum (1 nm, 190–800 nm unless given). */
function csvText(s: DemoSpectrum): string {
	const rows = ['# invented demo spectrum (Windowsill demo data)', s.header];
	for (let l = s.fromNm ?? 190; l <= (s.toNm ?? 800); l++) rows.push(`${l},${Number(s.y(l).toPrecision(6))}`);
	return rows.join('\n') + '\n';
}

const USER = { lead: 'lead@windowsill.test', member: 'member@windowsill.test', outsider: 'outsider@windowsill.test' } as const;

export async function seed(knex: Knex): Promise<void> {
	if (process.env.NODE_ENV === 'production' && process.env.WINDOWSILL_DEMO !== '1') {
		console.log('[seed] production mode: no demo spectra');
		return;
	}
	const users = new Map<string, string>();
	for (const [k, email] of Object.entries(USER)) {
		const u = await knex('users').where({ email }).first('id');
		if (u) users.set(k, u.id);
	}
	const groups = new Map<string, number>();
	for (const slug of ['harbourlight', 'quillon']) {
		const g = await knex('groups').where({ slug }).first('id');
		if (g) groups.set(slug, Number(g.id));
	}
	if (users.size < 3 || groups.size < 2) {
		console.log('[seed] demo spectra skipped: run the demo accounts seed first');
		return;
	}
	let added = 0;
	for (const s of SPECTRA) {
		const bytes = new TextEncoder().encode(csvText(s));
		const groupId = groups.get(s.owner === 'outsider' ? 'quillon' : 'harbourlight')!;
		const exists = await knex('spectra').where({ group_id: groupId, file_name: s.file }).first('id');
		if (exists) continue;
		const prepared = prepareSpectra(bytes, s.file, s.meta);
		await storeSpectra(knex, { groupId, ownerId: users.get(s.owner)!, bytes, filename: s.file, meta: s.meta, ...prepared });
		added++;
	}
	console.log(`[seed] demo spectra: ${added} added, ${SPECTRA.length - added} already there`);
}
