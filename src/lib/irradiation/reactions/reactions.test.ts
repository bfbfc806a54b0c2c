import { describe, expect, it } from 'vitest';
import { COMPUTATION_GRID, gridWavelengths } from '../wavelengthGrid';
import { photocatalyticTimes, preparePhotocatalytic } from './photocatalytic';
import { photostationaryCurve, photostationaryFraction, prepareReversible, reversibleTimes } from './reversible';
import { adaptiveSimpson, rk45 } from './testSolvers';
import { cylinderFractionPerAbsorbance } from '../vessels';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const flat = (v: number) => new Float64Array(grid.count).fill(v);
const zero = () => new Float64Array(grid.count);
/** Invented LED: Gaussian photon spectrum, total flux `total` einstein s⁻¹. */
function led(peakNm: number, fwhmNm: number, total: number) {
	const s = fwhmNm / (2 * Math.sqrt(2 * Math.LN2));
	return wl.map((x) => (total / (s * Math.sqrt(2 * Math.PI))) * Math.exp(-((x - peakNm) ** 2) / (2 * s * s)));
}
/** A single grid line carrying `total` einstein s⁻¹ (monochromatic light: trapezoid weight = step). */
function line(atNm: number, total: number) {
	const q = zero();
	q[Math.round((atNm - grid.fromNm) / grid.stepNm)] = total / grid.stepNm;
	return q;
}
const band = (peakNm: number, widthNm: number, eps: number) => wl.map((x) => eps * Math.exp(-((x - peakNm) ** 2) / (2 * widthNm * widthNm)));

describe('photocatalytic mode', () => {
	it('transparent substrate and product: zero order, t90 = 0.9·n₀/(Φ·q_abs,cat) (closed form of the zero-order law)', () => {
		const q = led(450, 20, 2e-7);
		const epsCat = band(452, 25, 14600); // invented catalyst band
		const p = preparePhotocatalytic({ stepNm: grid.stepNm, photonFluxInMixturePerNm: q, pathCm: 1, volumeL: 0.005, catalystEpsilon: epsCat, catalystConcentrationM: 2e-5, substrateEpsilon: zero(), substrateConcentrationM: 0.1, quantumYield: 0.4 });
		// q_abs,cat computed independently: Σ q·w·(1 − 10^(−A_cat)) (Beer–Lambert, the catalyst the only absorber)
		let qAbs = 0;
		for (let i = 0; i < grid.count; i++) qAbs += q[i] * grid.stepNm * (1 - 10 ** -(epsCat[i] * 2e-5));
		expect(p.catalystAbsorbedFlux(0)).toBeCloseTo(qAbs, 15);
		expect(p.catalystAbsorbedFlux(0.7) / qAbs).toBeCloseTo(1, 12); // not consumed
		const n0 = 0.1 * 0.005;
		const t = photocatalyticTimes(p);
		expect(t.timeTo90PctS! / ((0.9 * n0) / (0.4 * qAbs))).toBeCloseTo(1, 9);
		expect(t.timeTo50PctS! / ((0.5 * n0) / (0.4 * qAbs))).toBeCloseTo(1, 9);
		expect(t.initialRateTimeTo90PctS! / t.timeTo90PctS!).toBeCloseTo(1, 9);
		expect(t.unreachableReason).toBeNull();
	});

	it('chains: Φ = 2000 shortens the time by the same factor (rate = Φ·q_abs)', () => {
		const args = { stepNm: grid.stepNm, photonFluxInMixturePerNm: line(400, 1e-7), pathCm: 1, volumeL: 0.01, catalystEpsilon: flat(300), catalystConcentrationM: 1e-3, substrateEpsilon: zero(), substrateConcentrationM: 1 };
		const a = photocatalyticTimes(preparePhotocatalytic({ ...args, quantumYield: 1 }));
		const b = photocatalyticTimes(preparePhotocatalytic({ ...args, quantumYield: 2000 }));
		expect(a.timeTo90PctS! / b.timeTo90PctS!).toBeCloseTo(2000, 6);
	});

	it('an absorbing substrate competes: matches adaptive quadrature of dt/dX = n₀/(Φ·q_cat(X)) (monochromatic)', () => {
		// A_cat = 0.3, A_S(0) = 1.2 over 1 cm at 420 nm; q_cat(X) = q·(A_c/A)(1 − 10^−A), A = A_c + A_S(1 − X) (IUPAC 2007 inner filter)
		const q = 5e-8, phi = 0.8, n0 = 0.05 * 0.002;
		const p = preparePhotocatalytic({ stepNm: grid.stepNm, photonFluxInMixturePerNm: line(420, q), pathCm: 1, volumeL: 0.002, catalystEpsilon: flat(1.5e4), catalystConcentrationM: 2e-5, substrateEpsilon: flat(24), substrateConcentrationM: 0.05, quantumYield: phi });
		const qCat = (x: number) => { const a = 0.3 + 1.2 * (1 - x); return (q * 0.3 * (1 - 10 ** -a)) / a; };
		const expected = adaptiveSimpson((x) => n0 / (phi * qCat(x)), 0, 0.9);
		expect(photocatalyticTimes(p).timeTo90PctS! / expected).toBeCloseTo(1, 7);
	});

	it('bleaching catalyst: closed form t(X) = n₀/(Φq₀kβ)·[ln(e^k − 1) − ln(e^{k(1−βX)} − 1)], 90 % out of reach when 1/β < 0.9', () => {
		// monochromatic, catalyst the only absorber, A₀ = 0.5, k = A₀·ln10; y = 1 − βX (dn_cat/dn_S = Φ_dec/Φ); ∫dw/(1 − e^−w) = ln(e^w − 1)
		const q0 = 1e-7, phi = 0.5, phiDec = 1e-3, c0 = 0.01, cCat = 1e-4, V = 0.01;
		const n0 = c0 * V, nCat = cCat * V;
		const beta = (phiDec * n0) / (phi * nCat); // 0.2
		const k = 0.5 * Math.LN10;
		const closed = (x: number) => (n0 / (phi * q0 * k * beta)) * (Math.log(Math.expm1(k)) - Math.log(Math.expm1(k * (1 - beta * x))));
		const p = preparePhotocatalytic({ stepNm: grid.stepNm, photonFluxInMixturePerNm: line(450, q0), pathCm: 1, volumeL: V, catalystEpsilon: flat(5000), catalystConcentrationM: cCat, catalystBleachingQuantumYield: phiDec, substrateEpsilon: zero(), substrateConcentrationM: c0, quantumYield: phi });
		const t = photocatalyticTimes(p);
		expect(t.timeTo90PctS! / closed(0.9)).toBeCloseTo(1, 7);
		expect(t.timeTo99PctS! / closed(0.99)).toBeCloseTo(1, 7);
		const fast = photocatalyticTimes(preparePhotocatalytic({ stepNm: grid.stepNm, photonFluxInMixturePerNm: line(450, q0), pathCm: 1, volumeL: V, catalystEpsilon: flat(5000), catalystConcentrationM: cCat, catalystBleachingQuantumYield: 0.02, substrateEpsilon: zero(), substrateConcentrationM: c0, quantumYield: phi }));
		// β = 0.02·n₀/(Φ·n_cat) = 4 → the catalyst is gone at X = 0.25
		expect(fast.limitConversion).toBeCloseTo(0.25, 12);
		expect(fast.timeTo90PctS).toBeNull();
		expect(fast.timeTo50PctS).toBeNull();
		expect(fast.unreachableReason).toMatch(/bleached/);
	});
});

describe('reversible mode: photostationary states', () => {
	it.each([
		// [ε_S, ε_P, Φ_f, Φ_b] at the irradiation wavelength (invented pairs)
		[20000, 5000, 0.1, 0.4],
		[500, 1500, 0.25, 0.55],
		[8000, 200, 0.3, 0.3],
		[1000, 1000, 0.5, 0.05]
	])('monochromatic PSS = ε_S·Φ_f/(ε_S·Φ_f + ε_P·Φ_b) (ε_S=%d, ε_P=%d, Φ_f=%f, Φ_b=%f), thin and thick', (eS, eP, phiF, phiB) => {
		const expected = (eS * phiF) / (eS * phiF + eP * phiB); // classical PSS relation (Zimmerman, Chow & Paik 1958)
		for (const c0 of [1e-6, 1e-2]) {
			const p = prepareReversible({ stepNm: grid.stepNm, photonFluxInMixturePerNm: line(365, 1e-8), pathCm: 1, volumeL: 0.003, substrateEpsilon: flat(eS), substrateConcentrationM: c0, productEpsilon: flat(eP), quantumYield: phiF, quantumYieldBack: phiB });
			expect(photostationaryFraction(p)).toBeCloseTo(expected, 9);
		}
	});

	it('azobenzene in methanol (E → Z): the PSS at 313 and 436 nm implied by the published Φ and ε', () => {
		// Φ(E→Z) 0.11 at 313 nm and 0.25 at 436 nm: REFERENCE.md §5.2 after Gauglitz & Hubig, J. Photochem. 15, 255 (1981)
		// and the IUPAC 2004 actinometry report (Kuhn, Braslavsky & Schmidt, Pure Appl. Chem. 76, 2105). From memory, same
		// sources: Φ(Z→E) 0.41 at 313 nm and 0.56 at 436 nm; ε_E(313) ≈ 2.1e4, ε_Z(313) ≈ 4.7e3, ε_E(436) ≈ 500,
		// ε_Z(436) ≈ 1.45e3 M⁻¹ cm⁻¹. Implied PSS (hand arithmetic of the PSS relation):
		//   313 nm: 2.1e4·0.11/(2.1e4·0.11 + 4.7e3·0.41) = 2310/(2310 + 1927) = 0.5452 Z
		//   436 nm: 500·0.25/(500·0.25 + 1450·0.56) = 125/(125 + 812) = 0.1334 Z
		const at = (nm: number, eE: number, eZ: number, phiEZ: number, phiZE: number) => {
			const eS = zero(), eP = zero();
			const i = Math.round((nm - grid.fromNm) / grid.stepNm);
			eS[i] = eE;
			eP[i] = eZ;
			const p = prepareReversible({ stepNm: grid.stepNm, photonFluxInMixturePerNm: line(nm, 1e-8), pathCm: 1, volumeL: 0.003, substrateEpsilon: eS, substrateConcentrationM: 5e-5, productEpsilon: eP, quantumYield: phiEZ, quantumYieldBack: phiZE });
			return photostationaryFraction(p);
		};
		expect(at(313, 2.1e4, 4.7e3, 0.11, 0.41)).toBeCloseTo(2310 / (2310 + 1927), 9);
		expect(at(436, 500, 1450, 0.25, 0.56)).toBeCloseTo(125 / (125 + 812), 9);
		expect(2310 / (2310 + 1927)).toBeCloseTo(0.5452, 4);
		expect(125 / (125 + 812)).toBeCloseTo(0.1334, 4);
	});

	// Invented photoswitch under an invented 365 nm LED (FWHM 15 nm), with an absorbing solvent-like background.
	const eS = wl.map((x) => 18000 * Math.exp(-((x - 330) ** 2) / (2 * 25 ** 2)) + 400 * Math.exp(-((x - 440) ** 2) / (2 * 30 ** 2)));
	const eP = wl.map((x) => 3000 * Math.exp(-((x - 300) ** 2) / (2 * 20 ** 2)) + 1500 * Math.exp(-((x - 430) ** 2) / (2 * 30 ** 2)));
	const q = led(365, 15, 3e-8);
	const fixed = wl.map((x) => 0.05 * Math.exp(-(x - 300) / 20));
	const c0 = 2e-4, V = 0.004, phiF = 0.12, phiB = 0.9;
	const qMax = Math.max(...q);
	/** Independent right-hand side: inner filter of the slab written out per grid point, dX/dt. */
	const rhs = (x: number, g: (a: number) => number = (a) => (a > 0 ? (1 - 10 ** -a) / a : Math.LN10)) => {
		let s = 0, p = 0;
		for (let i = 0; i < grid.count; i++) {
			if (!(q[i] > 1e-9 * qMax)) continue; // far tails carry < 1e-8 of the flux
			const w = q[i] * (i === 0 || i === grid.count - 1 ? 0.5 : 1) * grid.stepNm;
			const a1 = eS[i] * c0 * (1 - x), a2 = eP[i] * c0 * x;
			const f = g(a1 + a2 + fixed[i]);
			s += w * a1 * f;
			p += w * a2 * f;
		}
		return (phiF * s - phiB * p) / (c0 * V);
	};

	it('polychromatic PSS and time to 90 % of it against an independent adaptive RK45 integration (within 0.5 %)', () => {
		const p = prepareReversible({ stepNm: grid.stepNm, photonFluxInMixturePerNm: q, pathCm: 1, volumeL: V, substrateEpsilon: eS, substrateConcentrationM: c0, productEpsilon: eP, fixedAbsorbance: fixed, quantumYield: phiF, quantumYieldBack: phiB });
		const times = reversibleTimes(p);
		// integrate X(t) far past the time scale and watch the crossing of 90 % of the PSS
		const scale = times.timeTo90PctOfStationaryS!;
		let t90: number | null = null, prev = { t: 0, x: 0 };
		const xEnd = rk45((_, y) => [rhs(y[0])], [0], 0, 30 * scale, 1e-11, (t, y) => {
			if (t90 === null && y[0] >= 0.9 * times.photostationaryProductFraction) t90 = prev.t + ((0.9 * times.photostationaryProductFraction - prev.x) / (y[0] - prev.x)) * (t - prev.t);
			prev = { t, x: y[0] };
		}).y[0];
		expect(Math.abs(times.photostationaryProductFraction / xEnd - 1)).toBeLessThan(0.005);
		expect(Math.abs(times.photostationaryProductFraction / xEnd - 1)).toBeLessThan(1e-6); // in fact much closer
		expect(t90).not.toBeNull();
		expect(Math.abs(times.timeTo90PctOfStationaryS! / t90! - 1)).toBeLessThan(0.005);
		// the PSS lies below 90 %: 90 % conversion is unreachable and the answer says why
		expect(times.photostationaryProductFraction).toBeLessThan(0.9);
		expect(times.timeTo90PctS).toBeNull();
		expect(times.unreachableReason).toMatch(/photostationary state holds/);
	});

	it('in a round vessel the same independent integration with the cylinder geometry agrees', () => {
		const p = prepareReversible({ stepNm: grid.stepNm, photonFluxInMixturePerNm: q, pathCm: 1, volumeL: V, substrateEpsilon: eS, substrateConcentrationM: c0, productEpsilon: eP, fixedAbsorbance: fixed, quantumYield: phiF, quantumYieldBack: phiB, fractionPerAbsorbance: cylinderFractionPerAbsorbance });
		const times = reversibleTimes(p);
		// PSS from the independent right-hand side with the chord average by adaptive Simpson in y (D = 1)
		const gCyl = (a: number) => (a > 1e-9 ? adaptiveSimpson((y) => 1 - 10 ** (-a * 2 * Math.sqrt(Math.max(0, 0.25 - y * y))), -0.5, 0.5, 1e-13) / a : (Math.LN10 * Math.PI) / 4);
		let lo = 0, hi = 1;
		for (let k = 0; k < 30; k++) { const m = (lo + hi) / 2; if (rhs(m, gCyl) > 0) lo = m; else hi = m; }
		expect(Math.abs(times.photostationaryProductFraction / lo - 1)).toBeLessThan(1e-5);
	});

	it('thermal back reaction lowers the PSS: Φ_b = 0 gives X = Φ_f·q_S/(n₀·k_T) balance (thin, monochromatic: closed form)', () => {
		// thin solution: q_abs,S = q·ln10·A_S0(1 − X) ⇒ Φ_f·q·ln10·A_S0(1 − X)/n₀ = k_T·X ⇒ X = r/(r + k_T), r = Φ_f·q·ln10·A_S0/n₀
		const qq = 1e-9, a0 = 1e-4, n0 = 1e-6 * 0.002, kT = 1e-3;
		const p = prepareReversible({ stepNm: grid.stepNm, photonFluxInMixturePerNm: line(400, qq), pathCm: 1, volumeL: 0.002, substrateEpsilon: flat(100), substrateConcentrationM: 1e-6, productEpsilon: zero(), quantumYield: 0.5, quantumYieldBack: 0, thermalBackRateConstantPerS: kT });
		const r = (0.5 * qq * Math.LN10 * a0) / n0;
		expect(photostationaryFraction(p)).toBeCloseTo(r / (r + kT), 4);
	});

	it('PSS over wavelength picks the wavelength with most product', () => {
		const c = photostationaryCurve(grid, eS, eP, phiF, phiB);
		const k = c.productFraction.indexOf(Math.max(...c.productFraction));
		// closed form at that wavelength
		const i = Math.round((c.wavelengthNm[k] - grid.fromNm) / grid.stepNm);
		expect(c.productFraction[k]).toBeCloseTo((eS[i] * phiF) / (eS[i] * phiF + eP[i] * phiB), 12);
		expect(c.wavelengthNm[k]).toBeGreaterThan(330);
		expect(c.wavelengthNm[k]).toBeLessThan(420);
	});
});
