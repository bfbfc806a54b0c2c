import { describe, expect, it } from 'vitest';
import { computeWindow } from './computeWindow';
import { HCNA_J_NM_PER_MOL } from './constants';
import { findWallMaterial } from './data/materials';
import { calibratedPhotonFluxPerNm, radiometerPhotonFlux, transmittedPhotonFlux, wallRatio, weightedWallTransmission } from './lampCalibration';
import { lampSpectrum, photonFluxSpectrum } from './lamps';
import { wallTransmissionOnGrid } from './walls';
import { COMPUTATION_GRID as grid, gridWavelengths } from './wavelengthGrid';

const wl = gridWavelengths(grid);
const wall = (id: string, mm: number) => wallTransmissionOnGrid(findWallMaterial(id)!.definition, mm, grid.fromNm, grid.stepNm, grid.count);
const led = (peakNm: number, powerW = 1) => photonFluxSpectrum(lampSpectrum({ type: 'led', peakNm, fwhmNm: 10 }, powerW, grid));
const boro = wall('borosilicate-3.3-tubing', 2);
const silica = wall('fused-silica-uv-grade', 1);

describe('a calibration is the flux entering the solution through its wall', () => {
	it('an opaque solution in the calibrated vessel absorbs the calibrated flux within 1 %', () => {
		const qCal = 2.5e-6; // einstein s⁻¹ measured through 2 mm borosilicate 3.3 (invented run)
		const lamp = calibratedPhotonFluxPerNm(led(313), boro, qCal, grid.stepNm).photonFluxPerNm;
		// substrate with A ≈ 20 over 1 cm everywhere (ε = 2000 M⁻¹ cm⁻¹, 0.01 M): absorbs > 99.99 % of what enters (Beer–Lambert)
		const out = computeWindow({ grid, substrate: { epsilon: wl.map(() => 2000), concentrationM: 0.01 }, solventAbsorbancePerCm: wl.map(() => 0), wallTransmission: boro, pathCm: 1, lamps: [{ id: 'L', name: 'LED', photonFluxPerNm: lamp }] });
		expect(out.ok).toBe(true);
		if (out.ok) expect(Math.abs(out.value.lamps[0].absorbedPhotonFluxEinsteinPerS / qCal - 1)).toBeLessThan(0.01);
	});

	it('the wall is applied once: at 313 nm the old "rescale before the wall" lost ⟨T⟩ of the flux', () => {
		// 2 mm borosilicate 3.3 tubing transmits ≈ 0.73 at 313 nm (REFERENCE §2.3 computed table, internal T; plus Fresnel loss)
		const t = weightedWallTransmission(led(313), boro, grid.stepNm);
		expect(t).toBeGreaterThan(0.5);
		expect(t).toBeLessThan(0.8);
		const q = calibratedPhotonFluxPerNm(led(313), boro, 1e-6, grid.stepNm).photonFluxPerNm;
		expect(transmittedPhotonFlux(q, boro, grid.stepNm)).toBeCloseTo(1e-6, 15);
	});

	it('another wall scales by ∫q·T_B/∫q·T_A weighted by the lamp photon spectrum (sum done here independently)', () => {
		const qm = led(313);
		let a = 0, b = 0;
		for (let i = 0; i < grid.count; i++) { a += qm[i] * boro[i]; b += qm[i] * silica[i]; }
		const q = calibratedPhotonFluxPerNm(qm, boro, 1e-6, grid.stepNm).photonFluxPerNm;
		expect(transmittedPhotonFlux(q, silica, grid.stepNm) / 1e-6).toBeCloseTo(b / a, 3);
		expect(wallRatio(q, boro, silica, grid.stepNm)).toBeCloseTo(b / a, 3);
		expect(b / a).toBeGreaterThan(1.2); // fused silica lets far more 313 nm light in than borosilicate (REFERENCE §2.3)
	});
});

describe('radiometer reading', () => {
	it('1 W at the vessel from a narrow 450 nm source through a lossless wall = 3.7617 µmol s⁻¹ (REFERENCE §4, CODATA 2018)', () => {
		const s = lampSpectrum({ type: 'laser', lineNm: 450 }, 1, grid);
		const q = radiometerPhotonFlux(1, s.wavelengthNm, s.powerWPerNm, wl.map(() => 1), grid.stepNm);
		expect(q * 1e6).toBeCloseTo(3.7617, 3);
		expect(q).toBeCloseTo(450 / HCNA_J_NM_PER_MOL, 9);
	});
});
