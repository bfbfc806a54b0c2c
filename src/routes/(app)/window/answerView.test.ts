import { describe, expect, it } from 'vitest';
import { bandMaxHeadline, budgetOf, curvesToCsv, longestBandMaximum, penetrationDepthFromCurves, sortLamps, verdictSentence, type LampAnswer } from './answerView';

const lamp = (over: Partial<LampAnswer>): LampAnswer => ({
	id: 1,
	name: 'Lamp',
	incidentPhotonFluxEinsteinPerS: 1e-6,
	absorbedPhotonFluxEinsteinPerS: 4e-7,
	selectivity: 0.8,
	shares: { wall: 0.1, solvent: 0.05, species: [{ name: 'S', share: 0.4 }, { name: 'X', share: 0.1 }], transmitted: 0.35 },
	timeTo90PctS: 3600,
	...over
});

describe('photon budget', () => {
	it('splits a lamp’s photons into five parts that add up to one', () => {
		const parts = budgetOf(lamp({}), 'S');
		expect(parts.map((p) => p.key)).toEqual(['wall', 'solvent', 'other', 'intended', 'through']);
		expect(parts.find((p) => p.key === 'intended')!.share).toBeCloseTo(0.4, 12);
		expect(parts.find((p) => p.key === 'other')!.share).toBeCloseTo(0.1, 12);
		expect(parts.reduce((s, p) => s + p.share, 0)).toBeCloseTo(1, 12);
	});
	it('takes the intended absorber from absorbedByIntendedEinsteinPerS when it is not among the species names', () => {
		const parts = budgetOf(lamp({ absorbedByIntendedEinsteinPerS: 1e-7 }), 'Catalyst');
		expect(parts.find((p) => p.key === 'intended')!.share).toBeCloseTo(0.1, 12);
		expect(parts.find((p) => p.key === 'other')!.share).toBeCloseTo(0.4, 12);
	});
	it('sorts and keeps the server’s rank beside each lamp', () => {
		const a = lamp({ id: 1, name: 'b', absorbedPhotonFluxEinsteinPerS: 5e-7, selectivity: 0.2, timeTo90PctS: null });
		const b = lamp({ id: 2, name: 'a', absorbedPhotonFluxEinsteinPerS: 1e-7, selectivity: 0.9, timeTo90PctS: 60 });
		expect(sortLamps([a, b], 'selectivity').map((r) => [r.lamp.id, r.rank])).toEqual([[2, 2], [1, 1]]);
		expect(sortLamps([a, b], 'time').map((r) => r.lamp.id)).toEqual([2, 1]);
		expect(sortLamps([a, b], 'name').map((r) => r.lamp.name)).toEqual(['a', 'b']);
	});
});

describe('penetration depth', () => {
	it('is 1/a for one wavelength (Beer–Lambert law: 10^(−a·d) = 0.1 at d = 1/a)', () => {
		expect(penetrationDepthFromCurves([1], [2.5])!).toBeCloseTo(0.4, 8);
		expect(penetrationDepthFromCurves([0, 3, 0], [100, 0.05, 100])!).toBeCloseTo(20, 6);
	});
	it('solves the polychromatic sum: the depth found absorbs 90 % when evaluated independently', () => {
		const w = [1, 2, 1];
		const a = [4, 1, 0.25];
		const d = penetrationDepthFromCurves(w, a)!;
		const absorbed = (w[0] * (1 - 10 ** (-a[0] * d)) + w[1] * (1 - 10 ** (-a[1] * d)) + w[2] * (1 - 10 ** (-a[2] * d))) / 4;
		expect(absorbed).toBeCloseTo(0.9, 9);
	});
	it('is null when light is never 90 % absorbed (a transparent share above 10 %)', () => {
		expect(penetrationDepthFromCurves([1, 1], [1, 0])).toBeNull();
		expect(penetrationDepthFromCurves([0, 0], [1, 1])).toBeNull();
	});
});

describe('band maximum', () => {
	// two Gaussian bands (common practice for model absorption spectra): the reddest one is reported, not the strongest
	const x = Array.from({ length: 401 }, (_, i) => 200 + i);
	const a = x.map((l) => 3 * Math.exp(-(((l - 250) / 15) ** 2)) + 0.6 * Math.exp(-(((l - 452) / 25) ** 2)));
	it('finds the longest-wavelength band, not the global maximum', () => {
		expect(longestBandMaximum(x, a)).toBe(452);
	});
	it('ignores a band below 5 % of the strongest', () => {
		const weak = x.map((l, i) => a[i] - 0.6 * Math.exp(-(((l - 452) / 25) ** 2)) + 0.05 * Math.exp(-(((l - 452) / 25) ** 2)));
		expect(longestBandMaximum(x, weak)).toBe(250);
	});
	it('writes the headline', () => {
		expect(bandMaxHeadline({ wavelengthNm: 452, transmission: 0.914 })).toBe('At its band maximum (452 nm) the wall passes 91 %');
	});
});

describe('verdict', () => {
	const base = { reaction: 'direct' as const, intendedName: 'Morrow enone', wallName: '2 mm borosilicate 3.3 glass', windows: [{ fromNm: 310, toNm: 440 }], bandMax: { wavelengthNm: 364, transmission: 0.91 }, hasVolume: true };
	it('says window, best lamp, wall T at the band maximum and time in one sentence', () => {
		const s = verdictSentence({ ...base, best: lamp({ name: 'Bench LED 365', timeTo90PctS: 5400 }) });
		expect(s).toBe('Window 310–440 nm; best lamp: Bench LED 365; the wall passes 91 % at the band maximum (364 nm); 90 % conversion in 1.5 h.');
	});
	it('says when 90 % is not reachable, and the photostationary state of a reversible pair', () => {
		expect(verdictSentence({ ...base, best: lamp({ timeTo90PctS: null, unreachableReason: 'beyond the photostationary state' }) })).toContain('90 % conversion is not reachable (beyond the photostationary state)');
		const rev = verdictSentence({ ...base, reaction: 'reversible', productName: 'Z isomer', best: lamp({ timeTo90PctS: null, photostationaryProductFraction: 0.78, timeTo90PctOfStationaryS: 600 }) });
		expect(rev).toContain('78 % Z isomer at the photostationary state, 90 % of the way there in 10 min');
	});
	it('without a window names the wall', () => {
		expect(verdictSentence({ ...base, windows: [], best: undefined })).toMatch(/^No usable window for Morrow enone through 2 mm borosilicate 3.3 glass \(the wall passes 91 % at 364 nm\)/);
	});
});

describe('curves as CSV', () => {
	it('writes one row per grid point with wall T, solvent A, species A and lamp photon flux', () => {
		const csv = curvesToCsv(
			{
				x: [300, 301],
				substrateAbsorbance: [0.5, 0.4],
				others: [{ id: 3, name: 'Amine, 0.1 M', absorbance: [0.1, 0] }],
				solventAbsorbance: [0.01, 0],
				wallTransmission: [0.8, 0.85],
				lamps: [{ id: 9, name: 'LED', emission: [1, 0.5], photonFluxPerNm: [2e-8, 1e-8] }]
			},
			{ substrate: 'S', solvent: 'MeCN', wall: '2 mm glass', pathCm: 1 }
		);
		const lines = csv.trimEnd().split('\r\n');
		expect(lines).toHaveLength(3);
		expect(lines[0]).toBe('wavelength (nm),wall T (2 mm glass),solvent A over 1 cm (MeCN),A over 1 cm: S,"A over 1 cm: Amine, 0.1 M",LED: photon flux reaching the wall (einstein s-1 nm-1)');
		expect(lines[1]).toBe('300,0.8,0.01,0.5,0.1,2e-8');
	});
});
