/**
 * Emission files in photon units, end to end in the real test database: a CSV whose column says µmol m⁻² s⁻¹ nm⁻¹
 * (or photons cm⁻² s⁻¹ nm⁻¹) is stored under its own photon unit, and a lamp made from it keeps the file's photon shape
 * (never weighted by λ a second time). Invented test spectra; constants CODATA 2018.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '$lib/server/db';
import { createLamp } from '$lib/server/services/lampsApi';
import { callerOf } from '$lib/server/services/spectraAccess';
import { lampsOnGrid, GRID } from '$lib/server/services/windowInputs';
import { cleanup } from './helpers/accounts';
import { localsOf, resetSpectraWorld, upload } from './spectraTestKit';

const H = 6.62607015e-34, C = 299792458, NA = 6.02214076e23; // CODATA 2018, exact
let groupA: number;

/** A flat spectrum 300–800 nm every 1 nm under `header`, value `v`, zero from 290 to 299 and from 801 to 810 nm. */
const flat = (header: string, v: number) =>
	['wavelength (nm),' + header, ...Array.from({ length: 521 }, (_, i) => `${290 + i},${290 + i >= 300 && 290 + i <= 800 ? v : 0}`)].join('\n') + '\n';

beforeAll(async () => {
	({ groupA } = await resetSpectraWorld());
});
afterAll(async () => {
	await cleanup();
	await closeDb();
});

describe('photon units are stored as such and stay photon spectra', () => {
	it('µmol m⁻² s⁻¹ nm⁻¹ is stored under umol/m2/s/nm; a 1 W lamp from it gives 4.2614 µmol s⁻¹, flat in photons', async () => {
		const saved = await upload('member', 'spx-flat-photon.csv', flat('photon irradiance (µmol m-2 s-1 nm-1)', 2.5), { part: 'lamp' });
		const item = saved.items[0];
		expect(item.kind).toBe('emission');
		expect(item.yUnit).toBe('umol/m2/s/nm');
		const member = localsOf('member');
		const lamp = await createLamp(member, { name: 'spx flat photon source', powerW: 1, couplingFactor: 1, model: { type: 'spectrum', spectrumId: item.id }, groupId: groupA });
		const [g] = await lampsOnGrid(member, await callerOf(member), [lamp.id]);
		const total = g.photonFluxPerNm.reduce((a, b) => a + b, 0) * GRID.stepNm;
		// 1 W spread flat in photons over 300–800 nm: q = P / (hcN_A ⟨1/λ⟩), ⟨1/λ⟩ = ln(800/300)/(500 nm) → 4.2614 µmol s⁻¹ (CODATA 2018)
		const mean = Math.log(800 / 300) / 500e-9;
		const expected = 1 / (H * C * NA * mean);
		expect(expected * 1e6).toBeCloseTo(4.2614, 3);
		// (the linear edges 299–300 and 800–801 nm add 1 nm of 501: within 0.5 %)
		expect(Math.abs(total - expected) / expected).toBeLessThan(0.005);
		// flat photon shape: the photon flux density at 700 nm equals the one at 400 nm (not 1.75× as a power spectrum would give)
		const at = (nm: number) => g.photonFluxPerNm[Math.round((nm - GRID.fromNm) / GRID.stepNm)];
		expect(at(700) / at(400)).toBeCloseTo(1, 3);
	});

	it('photons cm⁻² s⁻¹ nm⁻¹ is scaled to µmol m⁻² s⁻¹ nm⁻¹ (× 10⁴ × 10⁶ / N_A) and says so', async () => {
		const v = (NA / 1e6 / 1e4) * 3; // 3 µmol m⁻² s⁻¹ nm⁻¹ written as photons cm⁻² s⁻¹ nm⁻¹
		const saved = await upload('member', 'spx-photons-per-cm2.csv', flat('photons cm-2 s-1 nm-1', v), { part: 'lamp' });
		expect(saved.items[0].yUnit).toBe('umol/m2/s/nm');
		expect(Math.abs(saved.items[0].valueAtMax! - 3) / 3).toBeLessThan(1e-9);
		expect(saved.warnings.map((w: { message: string }) => w.message).join(' ')).toMatch(/converted to µmol m⁻² s⁻¹ nm⁻¹/);
	});
});
