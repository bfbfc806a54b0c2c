/**
 * Physical constants, SI 2019 exact values (CODATA 2018).
 * Source: CODATA 2018 recommended values (NIST), exact by definition since the 2019 SI.
 */
export const PLANCK_J_S = 6.62607015e-34;
export const SPEED_OF_LIGHT_M_S = 299792458;
export const AVOGADRO_PER_MOL = 6.02214076e23;
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;
export const BOLTZMANN_J_K = 1.380649e-23;

/** h·c·N_A in J nm mol⁻¹ (= 1.19626566e8): photon flux q (einstein s⁻¹) = P(W)·λ(nm) / HCNA_J_NM_PER_MOL. */
export const HCNA_J_NM_PER_MOL = PLANCK_J_S * SPEED_OF_LIGHT_M_S * AVOGADRO_PER_MOL * 1e9;

/** h·c/e in eV nm (= 1239.841984): E(eV) = HC_EV_NM / λ(nm). */
export const HC_EV_NM = (PLANCK_J_S * SPEED_OF_LIGHT_M_S * 1e9) / ELEMENTARY_CHARGE_C;

/** Photon flux in einstein s⁻¹ of `powerW` watts at one wavelength (REFERENCE.md §4 formula). */
export function photonFluxEinsteinPerS(powerW: number, wavelengthNm: number): number {
	return (powerW * wavelengthNm) / HCNA_J_NM_PER_MOL;
}
