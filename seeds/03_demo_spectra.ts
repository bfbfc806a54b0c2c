/**
 * Demo spectra of the invented Harbourlight scenario (demo only; every compound, catalyst, filter and lamp here is
 * invented, carries an invented name and no CAS number; the three neat solvents are real and carry their real CAS
 * numbers). Band shapes follow what solution spectra look like:
 * - vibronic progressions: a Poisson (Franck–Condon, Huang–Rhys factor S) series of Gaussian bands on the wavenumber
 *   axis, 0–0 at the long-wavelength end, spacing ≈ the excited-state C=O / C=C / ring stretch (950–1450 cm⁻¹);
 * - broad charge-transfer and MLCT bands: log-normal bands on the wavenumber axis (Siano & Metzler, J. Chem. Phys. 51,
 *   1856 (1969)), skewed towards high energy;
 * - ε of the right order for each transition type (common practice, e.g. Montalti et al., Handbook of Photochemistry,
 *   3rd ed., 2006): n→π* 10–100, spin-allowed π→π* 10³–10⁵, MLCT ≈ 10⁴, d–d 1–100, spin-forbidden MLCT 10²–10³ M⁻¹ cm⁻¹;
 * - measured absorbance files carry instrument noise (deterministic pseudo-random, σ ≈ 0.0006 A) and read a flat
 *   ceiling where the true absorbance exceeds the photometric range (A > 3.2 → 3.6), as instruments do.
 * Excited-state potentials follow from the ground-state couples and the triplet energy E_T (Rehm–Weller-type estimate):
 * the excited-state oxidation potential is E(PC⁺/PC) − E_T/F and the excited-state reduction potential E(PC/PC⁻) + E_T/F, V vs SCE.
 * Stored through the same service code path as an upload — the CSV text is built here and parsed, normalised,
 * derived and persisted like a file from the bench. Idempotent: a file already in the group is kept when unchanged and
 * updated in place (same id, version + 1) when this seed's data changed; production mode without WINDOWSILL_DEMO=1
 * seeds nothing.
 */
import type { Knex } from 'knex';
import { prepareSpectra } from '../src/lib/server/services/spectraPrepare';
import { sha256Hex, storeSpectra } from '../src/lib/server/services/spectraStore';
import { derivedColumns } from '../src/lib/server/services/spectraDerive';
import { float64ToBuffer } from '../src/lib/server/db/spectraBlobs';
import { vectorToBuffer } from '../src/lib/spectra/grid';
import type { UploadMetadata } from '../src/lib/schemas/spectra';

const cm = (λ: number) => 1e7 / λ;
/** Gaussian band on the wavenumber axis: peak h at λ0, FWHM in cm⁻¹. */
const bandE = (λ: number, λ0: number, fwhmCm: number, h: number) => h * Math.exp((-4 * Math.LN2 * (cm(λ) - cm(λ0)) ** 2) / fwhmCm ** 2);
/**
 * Log-normal band on the wavenumber axis (Siano & Metzler 1969): peak h at λ0, FWHM in cm⁻¹, asymmetry ρ > 1 tails
 * towards high energy (short λ).
 */
function bandLogN(λ: number, λ0: number, fwhmCm: number, h: number, ρ = 1.3): number {
	const a = 1 + ((cm(λ) - cm(λ0)) * (ρ * ρ - 1)) / (ρ * fwhmCm);
	if (a <= 0) return 0;
	return h * Math.exp((-Math.LN2 / Math.log(ρ) ** 2) * Math.log(a) ** 2);
}
/** Vibronic progression: 0–0 at λ00, spacing in cm⁻¹ towards high energy, Poisson weights e^−S S^k/k!, scaled so the tallest component is h. */
function vibronic(λ: number, λ00: number, spacingCm: number, fwhmCm: number, h: number, S: number, n = 6): number {
	let sum = 0;
	let wMax = 0;
	let w = Math.exp(-S);
	for (let k = 0; k < n; k++) {
		if (k > 0) w *= S / k;
		wMax = Math.max(wMax, w);
		sum += w * Math.exp((-4 * Math.LN2 * (cm(λ) - (cm(λ00) + k * spacingCm)) ** 2) / fwhmCm ** 2);
	}
	return (h * sum) / wMax;
}
/** Logistic edge from 0 to `top` centred at λ50 (walls, long-pass filters). */
const edge = (λ: number, λ50: number, widthNm: number, top: number) => top / (1 + Math.exp(-(λ - λ50) / widthNm));

/** Deterministic pseudo-random numbers per file (linear congruential generator), uniform with standard deviation σ. */
function noiseFor(file: string) {
	let v = [...file].reduce((h, c) => (h * 31 + c.charCodeAt(0)) % 4294967296, 7);
	return (σ: number) => {
		v = (v * 1664525 + 1013904223) % 4294967296;
		return (v / 4294967296 - 0.5) * σ * 3.4641;
	};
}

interface DemoSpectrum {
	file: string;
	header: string;
	y: (λ: number) => number;
	fromNm?: number;
	toNm?: number;
	/** 'absorbance': instrument noise and the photometric ceiling; 'epsilon': noise of 5·10⁻⁵ of the largest ε (at least 0.05 M⁻¹ cm⁻¹), as in spectra merged from two concentrations. */
	measured?: 'absorbance' | 'epsilon';
	/** Absorbance = y × this (c·l) for an absorbance file computed from ε. */
	absorbancePerY?: number;
	owner: 'lead' | 'member' | 'outsider';
	meta: UploadMetadata;
}

const ε = 'wavelength (nm),epsilon (M-1 cm-1)';
const A = 'wavelength (nm),absorbance';
const T = 'wavelength (nm),transmittance (%)';
const EM = 'wavelength (nm),relative emission';
const F = 96.485; // kJ mol⁻¹ per eV (CODATA 2018: N_A·e)
/** Ground-state couples (V vs SCE) and E_T (kJ mol⁻¹) → the four potentials with correctly signed excited-state values. */
const potentials = (oxV: number, redV: number, tripletKjPerMol: number) => {
	const e00 = tripletKjPerMol / F;
	const r = (v: number) => Math.round(v * 100) / 100;
	return [
		{ label: 'E(PC⁺/PC)', volts: r(oxV), reference: 'SCE' },
		{ label: 'E(PC/PC⁻)', volts: r(redV), reference: 'SCE' },
		{ label: 'E(PC⁺/PC*)', volts: r(oxV - e00), reference: 'SCE' },
		{ label: 'E(PC*/PC⁻)', volts: r(redV + e00), reference: 'SCE' }
	];
};
/** Molar concentration of a neat liquid (density g mL⁻¹, molar mass g mol⁻¹). */
const neat = (density: number, molarMass: number) => (1000 * density) / molarMass;
/** Neat-solvent absorbance of 1 cm near its cut-off: the short-wavelength edge A = 10^((λc − λ)/s). */
const solventEdge = (λ: number, cutoffNm: number, s: number) => 10 ** ((cutoffNm - λ) / s);

const SPECTRA: DemoSpectrum[] = [
	// substrates
	{ file: 'pinewick-ester.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 231, 4800, 12500, 1.3) + vibronic(l, 279, 950, 700, 880, 1.0) + bandE(l, 200, 5000, 30000), owner: 'member', meta: { name: 'Pinewick ester', part: 'substrate', solvent: 'acetonitrile', synonyms: ['PW-ester'], tags: ['uv-c only', 'demo'], tripletEnergyKjPerMol: 238, visibility: 'group', notes: 'Aryl ester: a π→π* band at 231 nm and the structured ¹Lb band (0–0 279 nm, ε ≈ 900); nothing above ≈ 290 nm, so it needs UV-C or a sensitiser.' } },
	{ file: 'morrow-enone.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 246, 5200, 11800, 1.25) + vibronic(l, 372, 1250, 800, 62, 1.2) + bandE(l, 205, 5000, 9000), owner: 'member', meta: { name: 'Morrow enone', part: 'substrate', solvent: 'dichloromethane', synonyms: ['ME-3', 'Morrow cyclohexenone'], tags: ['[2+2]', 'uv-a', 'demo'], visibility: 'group', notes: 'Aryl enone: π→π* at 246 nm (ε ≈ 12 000) and the weak, structured n→π* band (0–0 at 372 nm, ε ≈ 40–60) that UV-A LEDs excite.' } },
	{ file: 'calder-aryl-bromide.csv', header: A, measured: 'absorbance', absorbancePerY: 1, fromNm: 200, y: (l) => 5e-3 * (vibronic(l, 271, 930, 600, 215, 0.9) + bandLogN(l, 212, 5500, 8200, 1.2)), owner: 'lead', meta: { name: 'Calder aryl bromide', part: 'substrate', solvent: 'acetonitrile', concentrationM: 5e-3, pathCm: 1, tags: ['demo'], visibility: 'group', notes: 'Measured at 5 mM to see the ¹Lb fine structure (0–0 271 nm); the 212 nm band is off scale at this concentration.' } },
	{ file: 'dunmore-cinnamate.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 310, 5200, 24000, 1.35) + bandLogN(l, 225, 5000, 13000, 1.2), owner: 'lead', meta: { name: 'Dunmore cinnamate', part: 'substrate', solvent: 'methanol', tags: ['e/z isomerisation', 'demo'], visibility: 'public' } },
	{ file: 'larch-diene.csv', header: ε, measured: 'epsilon', y: (l) => vibronic(l, 243, 1450, 1100, 21000, 1.0), owner: 'member', meta: { name: 'Larch diene', part: 'substrate', solvent: 'cyclohexane', tags: ['demo'], visibility: 'group' } },
	{ file: 'skerry-azide.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 251, 5000, 15000, 1.25) + bandE(l, 286, 2500, 1100), owner: 'member', meta: { name: 'Skerry azide', part: 'substrate', solvent: 'acetonitrile', tags: ['draft'], visibility: 'private', notes: 'Draft measurement, not shared yet.' } },
	// photocatalysts (ground-state couples and triplet energies invented for the demo)
	{ file: 'tidewater-blue-twb7.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 452, 4600, 14000, 1.4) + bandLogN(l, 287, 2200, 72000, 1.1) + bandE(l, 244, 4000, 22000), owner: 'lead', meta: { name: 'Tidewater Blue (TWB-7)', part: 'photocatalyst', solvent: 'acetonitrile', synonyms: ['TWB-7'], tags: ['blue', 'metal complex', 'demo'], tripletEnergyKjPerMol: 232, excitedStatePotentials: potentials(1.45, -1.55, 232), visibility: 'group', notes: 'Metal polypyridyl complex: MLCT band at 452 nm (ε ≈ 1.4 × 10⁴), its blue side tailing into a shoulder, ligand π→π* at 287 nm. Excited state both oxidising and reducing.' } },
	{ file: 'harbour-amber-ha2.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 378, 4200, 8200, 1.3) + bandE(l, 455, 2000, 650) + bandLogN(l, 282, 3000, 35000, 1.15), owner: 'member', meta: { name: 'Harbour Amber (HA-2)', part: 'photocatalyst', solvent: 'acetonitrile', synonyms: ['HA-2'], tags: ['violet', 'metal complex', 'demo'], tripletEnergyKjPerMol: 250, excitedStatePotentials: potentials(0.8, -2.2, 250), visibility: 'group', notes: 'Cyclometalated complex: spin-allowed MLCT at 378 nm, spin-forbidden MLCT at 455 nm (ε ≈ 650). Strongly reducing excited state.' } },
	{ file: 'kestrel-violet.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 402, 5500, 6200, 1.3) + vibronic(l, 338, 1300, 800, 9000, 0.6) + bandE(l, 290, 4000, 30000), owner: 'lead', meta: { name: 'Kestrel Violet', part: 'photocatalyst', solvent: 'dichloromethane', tags: ['violet', 'donor–acceptor', 'demo'], tripletEnergyKjPerMol: 261, visibility: 'public', notes: 'Donor–acceptor dye: charge-transfer band at 402 nm above structured donor bands (0–0 338 nm).' } },
	{ file: 'fenwick-green.csv', header: ε, measured: 'epsilon', y: (l) => vibronic(l, 528, 1250, 1000, 96000, 0.35) + bandE(l, 310, 5000, 9000) + bandE(l, 255, 4000, 21000), owner: 'member', meta: { name: 'Fenwick Green dye', part: 'photocatalyst', solvent: 'ethanol', tags: ['green', 'organic dye', 'demo'], tripletEnergyKjPerMol: 181, excitedStatePotentials: potentials(0.84, -1.02, 181), visibility: 'group', notes: 'Xanthene-type dye: π→π* 0–0 band at 528 nm (ε ≈ 9.6 × 10⁴) with its vibronic shoulder near 495 nm.' } },
	{ file: 'saltmarsh-ketone.csv', header: ε, measured: 'epsilon', y: (l) => vibronic(l, 384, 1350, 1400, 6100, 0.8) + bandE(l, 258, 3500, 42000), owner: 'member', meta: { name: 'Saltmarsh ketone sensitiser', part: 'photocatalyst', solvent: 'acetonitrile', synonyms: ['SK-sens'], tags: ['energy transfer', 'uv-a', 'demo'], tripletEnergyKjPerMol: 266, visibility: 'group', notes: 'Aromatic ketone sensitiser: π→π* band 0–0 at 384 nm (ε ≈ 6 × 10³); high triplet energy for energy transfer.' } },
	{ file: 'corran-red.csv', header: ε, measured: 'epsilon', y: (l) => vibronic(l, 558, 1200, 900, 92000, 0.3) + bandE(l, 262, 4000, 28000), owner: 'lead', meta: { name: 'Corran Red', part: 'photocatalyst', solvent: 'methanol', tags: ['green', 'organic dye', 'demo'], tripletEnergyKjPerMol: 172, visibility: 'group' } },
	// products (the Morrow product keeps the aryl ketone: its n→π* tail still competes weakly below ≈ 360 nm)
	{ file: 'morrow-cyclobutane.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 320, 4500, 55, 1.2) + bandE(l, 280, 2500, 1100) + bandLogN(l, 242, 4500, 12500, 1.25), owner: 'member', meta: { name: 'Morrow cyclobutane', part: 'product', solvent: 'dichloromethane', tags: ['[2+2]', 'demo'], visibility: 'group', notes: 'Product of Morrow enone: an aryl ketone, n→π* at 320 nm (ε ≈ 55) — it still takes a few UV-A photons.' } },
	{ file: 'pinewick-acid.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 228, 4800, 11000, 1.3) + vibronic(l, 276, 950, 700, 780, 1.0), owner: 'member', meta: { name: 'Pinewick acid', part: 'product', solvent: 'acetonitrile', tags: ['demo'], visibility: 'group' } },
	{ file: 'dunmore-cinnamate-z.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 300, 5600, 14500, 1.3) + bandLogN(l, 220, 5000, 12000, 1.2), owner: 'lead', meta: { name: 'Dunmore cinnamate (Z isomer)', part: 'product', solvent: 'methanol', tags: ['e/z isomerisation', 'demo'], visibility: 'public' } },
	// additives
	{ file: 'hollin-amine.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 251, 4500, 14000, 1.25) + bandLogN(l, 298, 3500, 2100, 1.2), owner: 'member', meta: { name: 'Hollin amine', part: 'additive', solvent: 'acetonitrile', tags: ['reductant', 'demo'], visibility: 'group' } },
	{ file: 'tarrow-dihydropyridine.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 352, 5800, 7400, 1.3) + bandLogN(l, 232, 5000, 16000, 1.2), owner: 'lead', meta: { name: 'Tarrow dihydropyridine', part: 'additive', solvent: 'acetonitrile', tags: ['reductant', 'uv-a', 'demo'], visibility: 'group', notes: 'Absorbs up to ≈ 400 nm: an inner filter under UV-A.' } },
	{ file: 'brisk-thiol.csv', header: ε, measured: 'epsilon', y: (l) => bandLogN(l, 236, 5000, 9500, 1.2) + vibronic(l, 272, 900, 900, 700, 0.8), owner: 'member', meta: { name: 'Brisk thiol', part: 'additive', solvent: 'acetonitrile', tags: ['hat catalyst', 'demo'], visibility: 'group' } },
	{ file: 'brackwater-nickel.csv', header: ε, measured: 'epsilon', y: (l) => bandE(l, 625, 4200, 11) + bandE(l, 388, 3500, 24) + bandLogN(l, 305, 4500, 5200, 1.3) + bandE(l, 246, 4500, 21000), owner: 'member', meta: { name: 'Brackwater nickel co-catalyst', part: 'additive', solvent: 'acetonitrile', tags: ['cross-coupling', 'metal complex', 'demo'], visibility: 'group', notes: 'Octahedral Ni(II) complex: two weak d–d bands (625 nm, ε ≈ 11; 388 nm, ε ≈ 24) above a charge-transfer band at 305 nm.' } },
	// solvents: real solvents, measured neat in a 1 cm cell against air (absorbance); n→π* of neat acetone from ε ≈ 15 at 270 nm × 13.6 M
	{ file: 'acetonitrile-neat-1cm.csv', header: A, measured: 'absorbance', absorbancePerY: 1, y: (l) => solventEdge(l, 191, 5.5), owner: 'lead', meta: { name: 'Acetonitrile, neat (1 cm)', part: 'solvent', solvent: 'acetonitrile', cas: '75-05-8', pathCm: 1, tags: ['solvent', 'demo'], visibility: 'public' } },
	{ file: 'dichloromethane-neat-1cm.csv', header: A, measured: 'absorbance', absorbancePerY: 1, y: (l) => solventEdge(l, 233, 6), owner: 'lead', meta: { name: 'Dichloromethane, neat (1 cm)', part: 'solvent', solvent: 'dichloromethane', cas: '75-09-2', pathCm: 1, tags: ['solvent', 'demo'], visibility: 'public' } },
	{ file: 'acetone-neat-1cm.csv', header: A, measured: 'absorbance', absorbancePerY: 1, y: (l) => neat(0.7845, 58.08) * bandE(l, 270, 4800, 15) + solventEdge(l, 200, 6), owner: 'member', meta: { name: 'Acetone, neat (1 cm)', part: 'solvent', solvent: 'acetone', cas: '67-64-1', pathCm: 1, tags: ['solvent', 'demo'], visibility: 'public' } },
	// walls and filters: transmission (%T)
	{ file: 'borosilicate-tube-1-5mm.csv', header: T, y: (l) => edge(l, 298, 7, 91.5), fromNm: 220, owner: 'lead', meta: { name: 'Borosilicate 3.3 glass tube wall, 1.5 mm', part: 'wall', thicknessMm: 1.5, tags: ['wall', 'demo'], visibility: 'public' } },
	{ file: 'fused-silica-cell-1-25mm.csv', header: T, y: (l) => edge(l, 196, 3, 92.5), fromNm: 190, owner: 'lead', meta: { name: 'Fused silica cell wall, 1.25 mm', part: 'wall', thicknessMm: 1.25, tags: ['wall', 'demo'], visibility: 'public' } },
	{ file: 'fep-tubing-0-8mm.csv', header: T, y: (l) => edge(l, 232, 12, 86), fromNm: 200, owner: 'member', meta: { name: 'FEP tubing wall, 0.8 mm (flow coil)', part: 'wall', thicknessMm: 0.8, tags: ['wall', 'flow', 'demo'], visibility: 'group' } },
	{ file: 'longpass-400.csv', header: T, y: (l) => edge(l, 401, 4, 90), fromNm: 250, owner: 'member', meta: { name: 'Long-pass filter, 400 nm (demo)', part: 'filter', thicknessMm: 3, tags: ['filter', 'demo'], visibility: 'group' } },
	{ file: 'bandpass-450-40.csv', header: T, y: (l) => 0.05 + 84 * Math.exp(-(((l - 450) / 24) ** 6)), fromNm: 300, owner: 'member', meta: { name: 'Band-pass filter 450/40 (demo)', part: 'filter', thicknessMm: 2, tags: ['filter', 'blue', 'demo'], visibility: 'group' } },
	// bench lamps: relative emission (LED bands are slightly asymmetric: a log-normal in energy)
	{ file: 'bench-led-450.csv', header: EM, y: (l) => bandLogN(l, 452, 1050, 1, 1.15), fromNm: 350, toNm: 600, owner: 'lead', meta: { name: 'Bench LED 450 nm (rig B)', part: 'lamp', tags: ['lamp', 'blue', 'demo'], visibility: 'group' } },
	{ file: 'bench-led-365.csv', header: EM, y: (l) => bandLogN(l, 367, 900, 1, 1.15), fromNm: 300, toNm: 450, owner: 'lead', meta: { name: 'Bench LED 365 nm (rig A)', part: 'lamp', tags: ['lamp', 'uv-a', 'demo'], visibility: 'group' } },
	{ file: 'bench-led-390.csv', header: EM, y: (l) => bandLogN(l, 392, 950, 1, 1.15), fromNm: 320, toNm: 480, owner: 'member', meta: { name: 'Bench LED 390 nm (flow rig)', part: 'lamp', tags: ['lamp', 'violet', 'demo'], visibility: 'group' } },
	// Quillon Materials Lab: rows that Harbourlight must not see
	{ file: 'quillon-photoinitiator-qp1.csv', header: ε, measured: 'epsilon', y: (l) => vibronic(l, 399, 1000, 900, 640, 1.2) + bandLogN(l, 275, 4500, 17000, 1.2), owner: 'outsider', meta: { name: 'Quillon photoinitiator QP-1', part: 'additive', solvent: 'acetonitrile', tags: ['coatings'], visibility: 'private' } },
	{ file: 'quillon-resin-base.csv', header: ε, measured: 'epsilon', y: (l) => vibronic(l, 277, 950, 800, 2100, 1.0), owner: 'outsider', meta: { name: 'Quillon resin base', part: 'substrate', solvent: 'neat', tags: ['coatings'], visibility: 'group' } }
];

/** The CSV text of one demo spectrum (1 nm, 190–800 nm unless given), with the noise and ceiling of a measurement. */
function csvText(s: DemoSpectrum): string {
	const rows = ['# invented demo spectrum (Windowsill demo data)', s.header];
	const from = s.fromNm ?? 190;
	const to = s.toNm ?? 800;
	const noise = noiseFor(s.file);
	let max = 0;
	for (let l = from; l <= to; l++) max = Math.max(max, s.y(l));
	for (let l = from; l <= to; l++) {
		let v = s.y(l);
		if (s.measured === 'absorbance') {
			const a = v * (s.absorbancePerY ?? 1);
			v = (a > 3.2 ? 3.6 : a + noise(0.0006)) / (s.absorbancePerY ?? 1);
		} else if (s.measured === 'epsilon') v += noise(Math.max(0.05, 5e-5 * max));
		rows.push(`${l},${Number(v.toPrecision(6))}`);
	}
	return rows.join('\n') + '\n';
}

/** Rewrites a demo row whose seed data changed (same id, so plans and links keep pointing at it; version + 1). */
async function refreshInPlace(knex: Knex, id: number, s: DemoSpectrum, bytes: Uint8Array, sha: string): Promise<void> {
	const { spectra, warnings } = prepareSpectra(bytes, s.file, s.meta);
	const p = spectra[0];
	const row = await knex('spectra').where({ id }).first('version');
	await knex('spectra')
		.where({ id })
		.update({
			x_original: float64ToBuffer(p.raw.x), y_original: float64ToBuffer(p.raw.y), x_unit_original: p.raw.xUnit, y_unit_original: p.raw.yUnit,
			x_nm: float64ToBuffer(p.norm.x), y_normalised: float64ToBuffer(p.norm.y), y_unit: p.norm.yUnit, point_count: p.norm.x.length,
			file_bytes: Buffer.from(bytes), file_sha256: sha, search_vector: Buffer.from(vectorToBuffer(p.derived.searchVector)),
			lambda_max_nm: p.derived.lambdaMaxNm, value_at_max: p.derived.valueAtMax, edge_nm: p.derived.edgeNm,
			cutoff10_nm: p.derived.cutoff10Nm, cutoff50_nm: p.derived.cutoff50Nm, peaks: JSON.stringify(p.derived.peaks), ...derivedColumns(p.derived),
			cas: s.meta.cas ?? null, concentration_m: s.meta.concentrationM ?? null, path_cm: s.meta.pathCm ?? null, notes: s.meta.notes ?? null,
			excited_state_potentials: JSON.stringify(s.meta.excitedStatePotentials ?? []), version: Number(row.version) + 1, updated_at: knex.fn.now(),
			warnings: JSON.stringify(warnings.map(({ code, message, line }) => ({ code, message, line })))
		});
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
	let refreshed = 0;
	for (const s of SPECTRA) {
		const bytes = new TextEncoder().encode(csvText(s));
		const sha = sha256Hex(bytes);
		const groupId = groups.get(s.owner === 'outsider' ? 'quillon' : 'harbourlight')!;
		const exists = await knex('spectra').where({ group_id: groupId, file_name: s.file }).first('id', 'file_sha256');
		if (exists) {
			if (exists.file_sha256 !== sha) (await refreshInPlace(knex, Number(exists.id), s, bytes, sha), refreshed++);
			continue;
		}
		const prepared = prepareSpectra(bytes, s.file, s.meta);
		await storeSpectra(knex, { groupId, ownerId: users.get(s.owner)!, bytes, filename: s.file, meta: s.meta, ...prepared });
		added++;
	}
	console.log(`[seed] demo spectra: ${added} added, ${refreshed} refreshed, ${SPECTRA.length - added - refreshed} unchanged`);
}
