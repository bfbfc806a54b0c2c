import { describe, expect, it } from 'vitest';
import { CAUTION_GRID, lampPeakNm, lampSpectrum, ohnoShape, OHNO_FWHM_PER_DELTA, peakWavelengthNm, photonFluxSpectrum, totalPhotonFluxEinsteinPerS, validateLampModel, type LampModel, type LampSpectrum } from './lamps';
import { trapezoidArea } from './lampModels/grid';
import { MERCURY_LINES } from './mercuryLines';

const area = (s: LampSpectrum) => trapezoidArea(s.powerWPerNm, s.wavelengthNm[1] - s.wavelengthNm[0]);
const powerBetween = (s: LampSpectrum, a: number, b: number) => {
	let sum = 0;
	for (let i = 1; i < s.wavelengthNm.length; i++) if (s.wavelengthNm[i - 1] >= a && s.wavelengthNm[i] <= b) sum += ((s.powerWPerNm[i] + s.powerWPerNm[i - 1]) / 2) * (s.wavelengthNm[i] - s.wavelengthNm[i - 1]);
	return sum;
};
/** FWHM measured on the curve: half-maximum crossings by linear interpolation. */
function measuredFwhm(s: LampSpectrum): number {
	const y = s.powerWPerNm;
	const x = s.wavelengthNm;
	let m = 0;
	for (let i = 1; i < y.length; i++) if (y[i] > y[m]) m = i;
	const half = y[m] / 2;
	let l = m;
	while (y[l - 1] > half) l--;
	let r = m;
	while (y[r + 1] > half) r++;
	const left = x[l - 1] + ((half - y[l - 1]) / (y[l] - y[l - 1])) * (x[l] - x[l - 1]);
	const right = x[r] + ((half - y[r]) / (y[r + 1] - y[r])) * (x[r + 1] - x[r]);
	return right - left;
}

describe('mercury line list', () => {
	// NIST air wavelengths (Sansonetti & Martin 2005; Sansonetti, Salit & Reader 1996), reference table §3.1; 184.950 nm is vacuum.
	const nist = [184.95, 253.652, 296.728, 302.15, 312.567, 313.155, 313.184, 334.148, 365.015, 365.484, 366.328, 404.656, 407.784, 435.834, 546.075, 576.961, 579.067, 1013.975];
	it('positions are within 0.01 nm of the NIST values', () => {
		for (const wl of nist) expect(MERCURY_LINES.some((l) => Math.abs(l.wavelengthNm - wl) <= 0.01), String(wl)).toBe(true);
		expect(MERCURY_LINES.find((l) => l.wavelengthNm < 200)?.medium).toBe('vacuum');
	});

	it('low pressure: most UV power at 253.652 nm; 185 nm only without the ozone-free envelope', () => {
		// Reference table §3.1 (from memory): ≈ 85–90 % of UV output at 253.7 nm, ≈ 5–10 % at 184.9 nm.
		const lp = lampSpectrum({ type: 'mercury-low-pressure' }, 1, CAUTION_GRID);
		expect(Math.abs(peakWavelengthNm(lp) - 253.652)).toBeLessThanOrEqual(0.5);
		expect(powerBetween(lp, 250, 257) / powerBetween(lp, 150, 400)).toBeGreaterThan(0.8);
		expect(powerBetween(lp, 180, 190)).toBeGreaterThan(0.03);
		const of = lampSpectrum({ type: 'mercury-low-pressure', ozoneFree: true }, 1, CAUTION_GRID);
		expect(powerBetween(of, 150, 240)).toBeLessThan(1e-9);
	});

	it('medium pressure: the 365 nm group carries the UV power it is given', () => {
		// Calvert & Pitts 1966 table (from memory): 365–366 = 100 is the largest UV band.
		const mp = lampSpectrum({ type: 'mercury-medium-pressure' }, 450);
		expect(powerBetween(mp, 360, 370)).toBeGreaterThan(powerBetween(mp, 305, 320));
		// the 1128.7 and 1367.3 nm groups (5.9 W of 175.7 W in the Calvert & Pitts table, summed by hand) lie beyond the 1100 nm grid
		expect(mp.outsideGridFraction).toBeCloseTo(5.9 / 175.7, 3);
		expect(area(mp)).toBeCloseTo(450 * (1 - 5.9 / 175.7), 2);
	});
});

describe('LED models', () => {
	it.each(['gaussian', 'ohno'] as const)('%s: area = power and measured FWHM = input within 1 %', (shape) => {
		for (const [peakNm, fwhmNm] of [[365, 10], [450, 20], [525, 33]]) {
			const s = lampSpectrum({ type: 'led', peakNm, fwhmNm, shape }, 2.5);
			expect(area(s)).toBeCloseTo(2.5, 9);
			expect(Math.abs(measuredFwhm(s) / fwhmNm - 1)).toBeLessThan(0.01);
			expect(peakWavelengthNm(s)).toBe(peakNm);
		}
	});

	it('skew keeps peak and FWHM and moves power to the long side', () => {
		const s = lampSpectrum({ type: 'led', peakNm: 450, fwhmNm: 20, skew: 0.4 }, 1);
		expect(Math.abs(measuredFwhm(s) / 20 - 1)).toBeLessThan(0.01);
		expect(peakWavelengthNm(s)).toBe(450);
		expect(powerBetween(s, 450, 600)).toBeGreaterThan(powerBetween(s, 300, 450));
	});

	it('Ohno 2005: S(λ₀) = 1, S(λ₀ ± Δ) = (e⁻¹ + 2e⁻⁵)/3 = 0.12712, FWHM/Δ = 0.9218', () => {
		// Reference table §3.5 [computed from Ohno, Opt. Eng. 44, 111302 (2005)].
		expect(ohnoShape(0, 7)).toBe(1);
		expect(ohnoShape(7, 7)).toBeCloseTo(0.12712, 5);
		expect(ohnoShape(-7, 7)).toBeCloseTo(0.12712, 5);
		expect(OHNO_FWHM_PER_DELTA).toBeCloseTo(0.9218, 4);
	});

	it('photon flux of a 1 W narrow 365 nm LED = 3.0512 µmol s⁻¹ (CODATA 2018: q = P·λ/(h·c·N_A))', () => {
		// 365e-9 m / (6.62607015e-34 · 299792458 · 6.02214076e23) = 3.05116e-6 einstein s⁻¹.
		const s = lampSpectrum({ type: 'led', peakNm: 365, fwhmNm: 2 }, 1);
		expect(totalPhotonFluxEinsteinPerS(s) * 1e6).toBeCloseTo(3.0512, 4);
		expect(photonFluxSpectrum(s).length).toBe(s.wavelengthNm.length);
	});
});

describe('other models', () => {
	it('blackbody peak follows Wien: λmax = b/T, b = 2.897771955e6 nm·K (CODATA 2018)', () => {
		const s = lampSpectrum({ type: 'blackbody', temperatureK: 3200 }, 100);
		expect(Math.abs(peakWavelengthNm(s) - 2.897771955e6 / 3200)).toBeLessThanOrEqual(0.5);
		expect(area(s)).toBeCloseTo(100, 6);
	});

	it('each model integrates to its power on any uniform grid', () => {
		const grid = { fromNm: 160, stepNm: 0.25, count: 3761 };
		const models: LampModel[] = [
			{ type: 'excimer', emitter: 'XeCl' }, { type: 'excimer', emitter: 'Xe2' }, { type: 'laser', lineNm: 532, widthNm: 0.01 }, { type: 'xenon' },
			{ type: 'phosphor', peakNm: 350, fwhmNm: 40 }, { type: 'measured', wavelengthNm: [340, 350, 360], power: [0, 5, 0] }
		];
		// powerW is the model's whole output: the grid holds powerW·(1 − outsideGridFraction) (lamps.ts convention)
		for (const m of models) {
			const s = lampSpectrum(m, 3, grid);
			expect(area(s), m.type).toBeCloseTo(3 * (1 - s.outsideGridFraction), 6);
		}
		expect(peakWavelengthNm(lampSpectrum({ type: 'excimer', emitter: 'XeCl' }, 1))).toBe(308);
		expect(peakWavelengthNm(lampSpectrum({ type: 'laser', lineNm: 532 }, 1))).toBe(532);
	});

	it('reports power outside the grid and refuses a lamp that is mostly off-grid', () => {
		const lp = lampSpectrum({ type: 'mercury-low-pressure' }, 1);
		expect(lp.outsideGridFraction).toBeGreaterThan(0.05);
		expect(() => lampSpectrum({ type: 'excimer', emitter: 'Xe2' }, 1)).toThrow(/^grid:/);
	});

	it('bad parameters: RangeError naming the field, or a result value from validateLampModel', () => {
		expect(() => lampSpectrum({ type: 'led', peakNm: 365, fwhmNm: 0 }, 1)).toThrow(/^fwhmNm:/);
		expect(() => lampSpectrum({ type: 'led', peakNm: 365, fwhmNm: 10 }, -1)).toThrow(/powerW/);
		expect(() => lampSpectrum({ type: 'measured', wavelengthNm: [400, 300], power: [1, 2] }, 1)).toThrow(/^wavelengthNm:/);
		const r = validateLampModel({ type: 'excimer', emitter: 'ArXe' });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.issues[0].message).toMatch(/^emitter:/);
		expect(validateLampModel({ type: 'led', peakNm: 450, fwhmNm: 20 }).ok).toBe(true);
		expect(validateLampModel(null).ok).toBe(false);
	});
});

describe('line sources: peaks, complete tables and the 185 nm convention', () => {
	it('peakNm is the strongest line at its own NIST air wavelength, not a grid point', () => {
		// NIST ASD / Sansonetti & Martin 2005 (REFERENCE §3.1): Hg I 253.652 nm (air); 365.015 nm strongest of the 365/366 group
		expect(lampPeakNm({ type: 'mercury-low-pressure' }, lampSpectrum({ type: 'mercury-low-pressure' }, 1))).toBe(253.652);
		// Calvert & Pitts 1966 (REFERENCE §3.2, from memory): 365/366 nm = 100 is the strongest group (546.1 nm = 96)
		expect(lampPeakNm({ type: 'mercury-medium-pressure' }, lampSpectrum({ type: 'mercury-medium-pressure' }, 1))).toBe(365.015);
		expect(lampPeakNm({ type: 'laser', lineNm: 354.7 }, lampSpectrum({ type: 'laser', lineNm: 354.7 }, 1))).toBe(354.7);
	});

	it('the medium-pressure model keeps every group of its table: 232–275 nm and 1014 nm included', () => {
		const mp = lampSpectrum({ type: 'mercury-medium-pressure' }, 175.7);
		// watts per group from the table (REFERENCE §3.2 ratios × 25.6 W): 232 + 236 + 238 + 240 = 7.3 W; 1014 nm 10.5 W
		expect(powerBetween(mp, 229, 243)).toBeCloseTo(7.3, 1);
		expect(powerBetween(mp, 1005, 1025)).toBeCloseTo(10.5, 1);
		const mid = powerBetween(mp, 268.5, 277); // 270.0 (1.0 W) + 275.3 (0.7 W), less the Gaussian tails beyond the limits
		expect(mid).toBeGreaterThan(1.5);
		expect(mid).toBeLessThan(1.8);
	});

	it('the 185 nm line: included in powerW by default, on top of it with powerWithout185nm; never handed to other lines', () => {
		const incl = lampSpectrum({ type: 'mercury-low-pressure' }, 10, CAUTION_GRID);
		const excl = lampSpectrum({ type: 'mercury-low-pressure', powerWithout185nm: true }, 10, CAUTION_GRID);
		expect(area(incl)).toBeCloseTo(10, 6);
		expect(powerBetween(excl, 200, 1100)).toBeCloseTo(10, 4);
		const planner = lampSpectrum({ type: 'mercury-low-pressure' }, 10);
		// 9 of 118.7 relative units at 184.95 nm (model table): the planner grid from 190 nm holds the rest only
		expect(planner.outsideGridFraction).toBeCloseTo(9 / 118.7, 3);
		expect(area(planner)).toBeCloseTo(10 * (1 - 9 / 118.7), 3);
	});
});
