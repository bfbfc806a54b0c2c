/**
 * Wall materials for reactor vessels, windows and flow tubing (generic names only).
 * k-table materials use the CC0 refractive-index data resampled in ./materialTables (generated);
 * the others use the approximate edges of the group's reference table (λ at T = 10 % and 50 %,
 * Fresnel loss included), status "from memory" (the named handbook normally gives them; not re-read). Real vessel glass varies with lot, iron content
 * and solarisation.
 */
import type { WallMaterialModel } from '../walls';
import type { ReferenceStatus } from './solvents';
import { MATERIAL_K_TABLES, MATERIAL_N_589 } from './materialTables';

export interface WallMaterialRecord {
	/** Stable slug id. */
	id: string;
	name: string;
	source: string;
	status: ReferenceStatus;
	/** Refractive index at ≈ 589 nm. */
	n: number;
	/** Typical wall thickness of vessels made of it, mm. */
	typicalThicknessMm: number;
	definition: WallMaterialModel;
	notes: string;
}

const DB = 'refractiveindex.info database (CC0)';
const EDGES = 'approximate UV edges (λ at T = 10 % and 50 %), typical literature and manufacturer values';

function kMaterial(id: string, name: string, source: string, typicalThicknessMm: number, notes: string): WallMaterialRecord {
	const t = MATERIAL_K_TABLES[id];
	// status "computed": T(λ, d) = (1 − R)²·exp(−4πk·d/λ) computed here from the dataset's k (the k values themselves are
	// digitised manufacturer or handbook data, reference data rather than test check values)
	return { id, name, source: `${DB}: ${source}`, status: 'computed', n: t.n589Nm, typicalThicknessMm, notes,
		definition: { model: 'k', kTable: { wavelengthNm: t.wavelengthNm, k: t.k }, n: t.n589Nm } };
}

function edgeMaterial(
	id: string, name: string, n: number, edge10Nm: number, edge50Nm: number, atThicknessMm: number,
	typicalThicknessMm: number, notes: string, nSource = 'n: typical handbook value', edgeSource = ''
): WallMaterialRecord {
	return { id, name, source: `${EDGES}${edgeSource ? ` (${edgeSource})` : ''}; ${nSource}`, status: 'from memory', n, typicalThicknessMm, notes,
		definition: { model: 'edge', edge10Nm, edge50Nm, atThicknessMm, n } };
}

const nFrom = (id: string, what: string) => `n ${MATERIAL_N_589[id].toFixed(5)} at 589.3 nm from ${what} (${DB})`;

export const WALL_MATERIALS: readonly WallMaterialRecord[] = [
	kMaterial('fused-silica-uv-grade', 'Fused silica, UV grade', 'UV-grade fused silica n and k compiled from an optical-materials handbook', 2,
		'Transmits to below 190 nm; used for 254 nm and 185 nm work. Immersion wells are typically 1.5–3 mm.'),
	edgeMaterial('fused-quartz-ordinary', 'Fused quartz, ordinary (electrically fused natural quartz)', MATERIAL_N_589['fused-silica'], 205, 232, 1.5, 2,
		'Metal impurities and the 245 nm oxygen-deficiency band; "ozone-free" doped lamp quartz blocks below ≈ 220–240 nm.', nFrom('fused-silica', 'the Malitson 1965 Sellmeier for fused silica')),
	edgeMaterial('high-silica-96', 'High-silica glass (96 % SiO₂)', 1.458, 215, 240, 1.5, 1.5, 'Leached-and-consolidated borosilicate.'),
	kMaterial('borosilicate-3.3-sheet', 'Borosilicate 3.3 glass, float sheet', 'borosilicate 3.3 float sheet, k digitised from a manufacturer datasheet', 3.3,
		'Windows and flat reactor plates.'),
	kMaterial('borosilicate-3.3-tubing', 'Borosilicate 3.3 glass, laboratory tubing and flasks', 'borosilicate 3.3 laboratory tubing, k digitised from a manufacturer brochure', 1.8,
		'Ordinary flasks, vials and tubes (walls ≈ 1.5–2.5 mm): most light below ≈ 280 nm is blocked.'),
	kMaterial('borosilicate-crown', 'Borosilicate crown optical glass', 'borosilicate crown optical glass, manufacturer catalogue n and k', 3,
		'Optical windows and lenses; k data start at 300 nm (taken as opaque below).'),
	kMaterial('soda-lime-window', 'Soda-lime glass, clear window', 'clear soda-lime window glass (Rubin, Sol. Energy Mater. 12, 275, 1985)', 3,
		'Strongly iron-dependent; k data start at 310 nm (taken as opaque below).'),
	kMaterial('soda-lime-slide', 'Soda-lime glass, microscope slide', 'soda-lime microscope slide (Kamptner, Scharber & Schiek, ChemPhysChem 2024)', 1,
		'Also typical of cheap vials and Petri dishes; strongly iron-dependent.'),
	edgeMaterial('uv-b-sleeve-glass', 'Calcium-aluminosilicate filter-sleeve glass', 1.53, 260, 280, 1.5, 1.5,
		'Classic immersion-lamp filter sleeve. n is an estimate.', 'n: estimate', 'filter-sleeve table of Murov, Carmichael & Hug, Handbook of Photochemistry, 2nd ed., Dekker 1993'),
	edgeMaterial('uranium-glass-sleeve', 'Uranium glass filter sleeve', 1.53, 325, 345, 1.5, 1.5,
		'Immersion-lamp filter sleeve. n is an estimate.', 'n: estimate', 'filter-sleeve table of Murov, Carmichael & Hug, Handbook of Photochemistry, 2nd ed., Dekker 1993'),
	edgeMaterial('sapphire', 'Sapphire (UV grade)', MATERIAL_N_589.sapphire, 148, 170, 1, 1,
		'Intrinsic edge ≈ 143 nm; maximum T ≈ 85 % from Fresnel loss (R ≈ 7.7 % per face).', nFrom('sapphire', 'the Malitson 1962 ordinary-ray Sellmeier')),
	edgeMaterial('pmma-standard', 'PMMA, standard (UV-absorber-containing)', MATERIAL_N_589.pmma, 375, 390, 3, 3,
		'Blocks UV-A below ≈ 375 nm.', nFrom('pmma', 'a PMMA dispersion formula')),
	edgeMaterial('pmma-uv-transmitting', 'PMMA, UV-transmitting grade', MATERIAL_N_589.pmma, 265, 285, 3, 3, 'Grade without UV absorber.', nFrom('pmma', 'a PMMA dispersion formula')),
	edgeMaterial('polycarbonate', 'Polycarbonate (UV-stabilised)', MATERIAL_N_589.polycarbonate, 385, 400, 3, 3,
		'The edge agrees with the absorption coefficient α(405 nm) = 2.09 cm⁻¹ of an open polycarbonate dataset (Zhang et al. 2020): T_int(3 mm) = 0.53.', nFrom('polycarbonate', 'the Sultanova polycarbonate dispersion formula'), 'consistent with Zhang et al. 2020, α(405 nm) = 2.09 cm⁻¹'),
	edgeMaterial('polystyrene', 'Polystyrene', MATERIAL_N_589.polystyrene, 295, 315, 2, 1,
		'Disposable PS cuvettes are usable ≈ 340–800 nm (common practice).', nFrom('polystyrene', 'a polystyrene dispersion formula')),
	edgeMaterial('fep', 'FEP (fluorinated ethylene propylene)', 1.344, 195, 225, 0.25, 0.4,
		'Thin film ≈ 80–90 % at 254 nm; widely used for UV-C and UV-A flow coils.'),
	edgeMaterial('pfa', 'PFA (perfluoroalkoxy alkane)', 1.34, 210, 245, 0.75, 0.8, 'Similar to FEP; common flow-reactor tubing.'),
	edgeMaterial('etfe', 'ETFE (ethylene tetrafluoroethylene)', 1.4, 220, 265, 0.1, 0.1, 'Film.')
];

/** Wall material by id; undefined when unknown. */
export function findWallMaterial(id: string): WallMaterialRecord | undefined {
	return WALL_MATERIALS.find((m) => m.id === id);
}
