/**
 * Solvent UV cut-offs: wavelength (nm) where a 1 cm cell of the neat solvent has A = 1.00 against
 * water/air. Values, sources and status follow the group's sourced reference table; cut-offs depend on
 * grade, lot and stabiliser — treat them as ±5 nm soft limits and prefer a measured curve.
 * Refractive indices n_D (≈ 589 nm, 20 °C) are from memory (CRC Handbook of Chemistry and Physics).
 */

/** How firmly a reference value is sourced. */
export type ReferenceStatus = 'verified' | 'computed' | 'from memory' | 'common practice' | 'estimate';

/** What each status means (shown as the badge's explanation). */
export const STATUS_EXPLANATION: Record<ReferenceStatus, string> = {
	verified: 'Verified: the number was read in the published source named beside it.',
	computed: 'Computed here from the open dataset named beside it (method in the notes); real material varies with grade and lot.',
	'from memory': 'From memory: the usual tabulated value, where the named source normally gives it, not re-read in that source. Treat it as a soft limit and prefer a measured curve.',
	'common practice': 'Common practice: general laboratory practice with no single source.',
	estimate: 'Estimate: approximate, derived by analogy or from a related property — verify with a measured curve.'
};

export interface SolventRecord {
	/** Stable slug id. */
	id: string;
	name: string;
	synonyms: string[];
	casNumber: string;
	/** UV cut-off, nm (A = 1 in 1 cm). */
	cutoffNm: number;
	source: string;
	status: ReferenceStatus;
	notes: string;
	/** n_D at ≈ 589 nm (from memory, CRC Handbook) for Fresnel losses; absent when not known. */
	refractiveIndex?: number;
}

const GUIDE = 'solvent-supplier high-purity solvent guide; Sadek, The HPLC Solvent Guide, 2nd ed., Wiley 2002';
/** Published λ cut-off tables of a liquid-chromatography detector maker (values rounded to 10 nm). */
const LC_T1 = 'liquid-chromatography photodiode-array detector manual (2017), appendix table "Solvent miscibility", column "λ cut-off (nm)"';
const LC_T2 = "the same maker's system manual (2019), solvent table";
const SADEK_2004 = 'Sadek, Illustrated Pocket Dictionary of Chromatography, Wiley 2004';
const GRADE = 'Cut-off depends on grade and lot (±5 nm soft limit).';

const s = (
	id: string, name: string, synonyms: string[], casNumber: string, cutoffNm: number,
	status: ReferenceStatus, source: string, notes: string, refractiveIndex?: number
): SolventRecord => ({ id, name, synonyms, casNumber, cutoffNm, status, source, notes: notes || GRADE, refractiveIndex });

export const SOLVENTS: readonly SolventRecord[] = [
	s('water', 'Water', ['H2O'], '7732-18-5', 190, 'from memory', GUIDE, '', 1.333),
	s('acetonitrile', 'Acetonitrile', ['MeCN', 'ACN', 'methyl cyanide'], '75-05-8', 190, 'verified', `${LC_T1}; ${LC_T2}; also the solvent-supplier high-purity solvent guide`,
		'A spectro-grade specification sheet gives A ≤ 0.12 at 195 nm, ≤ 0.032 at 200 nm, ≤ 0.0044 at ≥ 230 nm (read in the sheet). One older manual of the same detector maker prints 210 nm, taken as a misprint. ' + GRADE, 1.3442),
	s('methanol', 'Methanol', ['MeOH', 'methyl alcohol'], '67-56-1', 210, 'verified', LC_T1,
		'The supplier guide gives 205 nm (not re-read); 210 nm is the conservative value. ' + GRADE, 1.3288),
	s('ethanol', 'Ethanol', ['EtOH', 'ethyl alcohol'], '64-17-5', 210, 'verified', `${LC_T1}; ${LC_T2}`,
		'Denatured grades (with ketones or aromatics) cut off far higher. ' + GRADE, 1.3611),
	s('2-propanol', '2-Propanol', ['isopropanol', 'IPA', 'iPrOH', 'isopropyl alcohol'], '67-63-0', 205, 'from memory', 'solvent-supplier high-purity solvent guide',
		'Unsourced open tables give 210 nm. ' + GRADE, 1.3776),
	s('n-hexane', 'n-Hexane', ['hexane', 'hexanes'], '110-54-3', 195, 'from memory', 'solvent-supplier high-purity solvent guide',
		'Technical "hexanes" (isomer mixtures) may contain aromatics and cut off higher. ' + GRADE, 1.3749),
	s('n-heptane', 'n-Heptane', ['heptane'], '142-82-5', 200, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.3876),
	s('cyclohexane', 'Cyclohexane', ['cHex'], '110-82-7', 200, 'from memory', 'solvent-supplier high-purity solvent guide',
		'Benzene traces raise the cut-off; common practice places it at 200–215 nm. ' + GRADE, 1.4262),
	s('isooctane', 'Isooctane', ['2,2,4-trimethylpentane'], '540-84-1', 215, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.3915),
	s('dichloromethane', 'Dichloromethane', ['DCM', 'methylene chloride'], '75-09-2', 233, 'from memory', 'solvent-supplier high-purity solvent guide',
		'Often stabilised with amylene or methanol; the stabiliser and HCl from decomposition shift the cut-off. ' + GRADE, 1.4242),
	s('chloroform', 'Chloroform', ['CHCl3', 'trichloromethane'], '67-66-3', 245, 'verified', SADEK_2004 + ', entry "chloroform"',
		'Stabilised with ethanol (≈ 0.5–1 %) or amylene; stabiliser and grade shift the cut-off (±5 nm soft limit). Under UV and O₂ chloroform forms phosgene.', 1.4459),
	s('carbon-tetrachloride', 'Carbon tetrachloride', ['CCl4', 'tetrachloromethane'], '56-23-5', 263, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.4601),
	s('1-2-dichloroethane', '1,2-Dichloroethane', ['DCE', 'ethylene dichloride'], '107-06-2', 228, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.4448),
	s('tetrahydrofuran', 'Tetrahydrofuran', ['THF', 'oxolane'], '109-99-9', 220, 'verified', `Merck Index monograph ("uv cut-off for spectro grade: 220 nm"); ${LC_T1}`,
		'The supplier guide gives 212 nm for unstabilised THF, and BHT-stabilised THF cuts off near 280 nm (both not re-read). Forms peroxides, which absorb and accumulate under UV. ±5 nm soft limit.', 1.405),
	s('1-4-dioxane', '1,4-Dioxane', ['dioxane'], '123-91-1', 220, 'verified', LC_T1,
		'The supplier guide gives 215 nm (not re-read). Often BHT-stabilised, which shifts the cut-off towards 280 nm; forms peroxides. ' + GRADE, 1.4224),
	s('diethyl-ether', 'Diethyl ether', ['ether', 'Et2O', 'ethyl ether'], '60-29-7', 215, 'verified', SADEK_2004 + ', entry "ethyl ether"',
		'BHT-stabilised grades cut off much higher; forms peroxides. ±5 nm soft limit.', 1.3526),
	s('mtbe', 'tert-Butyl methyl ether', ['MTBE', 'methyl tert-butyl ether', 'TBME'], '1634-04-4', 210, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.369),
	s('ethyl-acetate', 'Ethyl acetate', ['EtOAc', 'AcOEt'], '141-78-6', 260, 'verified', `${SADEK_2004}, entry "ethyl acetate"; ${LC_T1}`,
		'The supplier guide gives 256 nm (not re-read). ±5 nm soft limit.', 1.372),
	s('acetone', 'Acetone', ['propan-2-one', 'dimethyl ketone'], '67-64-1', 330, 'verified', `${LC_T1}; also the solvent-supplier high-purity solvent guide`,
		'The pharmacopoeial stray-light check uses neat acetone in 10 mm, cut-off "about 325 nm", A(300 nm) ≥ 2.0 (USP <857> / Ph. Eur. procedure, read there). Acetone itself is photoreactive (n→π*).', 1.3588),
	s('2-butanone', '2-Butanone', ['MEK', 'methyl ethyl ketone', 'butan-2-one'], '78-93-3', 330, 'verified', LC_T1, 'The supplier guide gives 329 nm (not re-read). ' + GRADE, 1.3788),
	s('toluene', 'Toluene', ['PhMe', 'methylbenzene'], '108-88-3', 284, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.4961),
	s('benzene', 'Benzene', ['PhH'], '71-43-2', 278, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.5011),
	s('o-xylene', 'o-Xylene', ['1,2-dimethylbenzene', 'xylene'], '95-47-6', 288, 'from memory', 'solvent-supplier high-purity solvent guide', 'p-Xylene ≈ 290 nm. ' + GRADE, 1.5055),
	s('chlorobenzene', 'Chlorobenzene', ['PhCl', 'monochlorobenzene'], '108-90-7', 290, 'verified', SADEK_2004 + ', entry "chlorinated solvents"',
		'The source gives "≥ 290 nm" for aromatic chlorinated solvents (chlorobenzene, dichlorobenzenes): a lower bound.', 1.5241),
	s('pyridine', 'Pyridine', ['py'], '110-86-1', 305, 'verified', `${LC_T1}; also the solvent-supplier high-purity solvent guide`, '', 1.5095),
	s('dmf', 'N,N-Dimethylformamide', ['DMF'], '68-12-2', 268, 'from memory', 'solvent-supplier high-purity solvent guide', 'Decomposes slowly to dimethylamine and CO; aged DMF absorbs more. ' + GRADE, 1.4305),
	s('dmac', 'N,N-Dimethylacetamide', ['DMAc', 'DMA'], '127-19-5', 268, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.438),
	s('dmso', 'Dimethyl sulfoxide', ['DMSO'], '67-68-5', 268, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.4793),
	s('nmp', 'N-Methyl-2-pyrrolidone', ['NMP'], '872-50-4', 285, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.47),
	s('acetic-acid', 'Acetic acid (glacial)', ['AcOH', 'HOAc', 'ethanoic acid'], '64-19-7', 255, 'from memory', 'solvent-supplier high-purity solvent guide',
		'Grade-dependent, 230–260 nm; 255 nm taken as the conservative value.', 1.372),
	s('tfe', '2,2,2-Trifluoroethanol', ['TFE', 'trifluoroethanol'], '75-89-8', 190, 'from memory', 'common use of TFE for circular dichroism to 185–190 nm (J. Chem. Soc. Perkin Trans. 1 1980, 1810)',
		'Approximate (≈ 190 nm). ' + GRADE, 1.2907),
	s('hfip', '1,1,1,3,3,3-Hexafluoro-2-propanol', ['HFIP', 'hexafluoroisopropanol'], '920-66-1', 195, 'estimate', 'estimate — verify with a measured curve', 'Approximate (≈ 195 nm); verify with a measured curve.', 1.2752),
	s('nitromethane', 'Nitromethane', ['MeNO2'], '75-52-5', 380, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.3817),
	s('1-butanol', '1-Butanol', ['n-butanol', 'BuOH', 'butan-1-ol'], '71-36-3', 215, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.3993),
	s('glycerol', 'Glycerol', ['glycerin', 'propane-1,2,3-triol'], '56-81-5', 207, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.4746),
	s('formamide', 'Formamide', ['methanamide'], '75-12-7', 260, 'estimate', 'estimate — verify with a measured curve',
		'Grade-dependent, ≈ 230–270 nm; 260 nm taken as a conservative value. Verify with a measured curve.', 1.4472),
	s('propylene-carbonate', 'Propylene carbonate', ['PC', '4-methyl-1,3-dioxolan-2-one'], '108-32-7', 280, 'from memory', 'solvent-supplier high-purity solvent guide', '', 1.421),
	s('dimethyl-carbonate', 'Dimethyl carbonate', ['DMC'], '616-38-6', 215, 'estimate', 'estimate — verify with a measured curve', 'Approximate, ≈ 210–220 nm. Verify with a measured curve.', 1.3687),
	s('anisole', 'Anisole', ['methoxybenzene', 'PhOMe'], '100-66-3', 300, 'estimate',
		'estimate from its ¹Lb band (λmax 271/278 nm) and neat concentration (9.2 M) — verify', 'Approximate (≈ 300 nm).', 1.517),
	s('trifluorotoluene', 'α,α,α-Trifluorotoluene', ['PhCF3', 'benzotrifluoride', 'BTF'], '98-08-8', 280, 'estimate', 'estimate by analogy to benzene/toluene — verify',
		'Approximate (≈ 280 nm).', 1.4146)
];
