import { describe, expect, it } from 'vitest';
import { cautionsForLamp, cautionsForSpectrum, cautionsPerLamp, mergeCautions, SAFETY_DEFERRAL_TEXT, spectralBandShares } from './cautions';
import { CAUTION_GRID, lampSpectrum } from './lamps';

const codes = (list: { code: string }[]) => list.map((c) => c.code);
// Deferral text: product rule (every list ends with it).
const endsWithDeferral = (list: { code: string; text: string }[]) => {
	expect(list[list.length - 1].text).toBe(SAFETY_DEFERRAL_TEXT);
	expect(list[list.length - 1].text).toMatch(/safety officer/);
};

describe('cautions', () => {
	// Band limits: CIE/ISO UV-C 100–280, UV-B 280–315, UV-A 315–400 nm (reference table §7).
	it('low-pressure mercury: UV-C; ozone only when the 185 nm line is emitted', () => {
		const open = cautionsForLamp({ type: 'mercury-low-pressure', ozoneFree: false }, 5);
		expect(codes(open)).toContain('uv-c');
		expect(codes(open)).toContain('ozone');
		endsWithDeferral(open);
		const doped = cautionsForLamp({ type: 'mercury-low-pressure', ozoneFree: true }, 5);
		expect(codes(doped)).toContain('uv-c');
		expect(codes(doped)).not.toContain('ozone');
		endsWithDeferral(doped);
	});

	it('reports the actinic effective fraction (254 nm: S ≈ 0.5, ICNIRP 2004)', () => {
		const list = cautionsForLamp({ type: 'mercury-low-pressure', ozoneFree: true }, 5);
		const uvc = list.find((c) => c.code === 'uv-c')!;
		const m = /effective fraction is ([\d.]+)/.exec(uvc.text);
		expect(Number(m![1])).toBeGreaterThan(0.4);
		expect(Number(m![1])).toBeLessThan(0.55);
	});

	it('450 nm high-power LED: blue-light note; a weak one does not get it', () => {
		// Threshold: ≥ 1 W optical in 400–500 nm (our rule; IEC 62471 blue-light hazard).
		const strong = cautionsForSpectrum(lampSpectrum({ type: 'led', peakNm: 450, fwhmNm: 20 }, 5), { lampType: 'led' });
		expect(codes(strong)).toContain('blue-light');
		expect(codes(strong)).not.toContain('uv-a');
		endsWithDeferral(strong);
		expect(codes(cautionsForSpectrum(lampSpectrum({ type: 'led', peakNm: 450, fwhmNm: 20 }, 0.1)))).not.toContain('blue-light');
	});

	it('365 nm LED: UV-A and not UV-C', () => {
		const list = cautionsForLamp({ type: 'led', peakNm: 365, fwhmNm: 10 }, 1);
		expect(codes(list)).toContain('uv-a');
		expect(codes(list)).not.toContain('uv-c');
		expect(codes(list)).not.toContain('ozone');
		endsWithDeferral(list);
	});

	it('arc lamps get heat, high voltage and pressure; excimer drivers high voltage', () => {
		const mp = cautionsForLamp({ type: 'mercury-medium-pressure' }, 100);
		expect(codes(mp)).toEqual(expect.arrayContaining(['uv-c', 'uv-b', 'uv-a', 'ozone', 'heat', 'high-voltage', 'pressure', 'mercury']));
		expect(codes(cautionsForLamp({ type: 'xenon' }, 50))).toEqual(expect.arrayContaining(['heat', 'high-voltage']));
		expect(codes(cautionsForLamp({ type: 'excimer', emitter: 'KrCl' }, 1))).toEqual(expect.arrayContaining(['high-voltage', 'ozone', 'uv-c']));
		endsWithDeferral(mp);
	});

	it('band shares: bands with ≥ 1 % of the power', () => {
		const s = lampSpectrum({ type: 'mercury-low-pressure' }, 1, CAUTION_GRID);
		const bands = spectralBandShares(s).map((b) => b.band);
		expect(bands).toContain('UV-C');
		expect(bands).not.toContain('IR');
		const total = spectralBandShares(s, 0).reduce((a, b) => a + b.fraction, 0);
		expect(total).toBeCloseTo(1, 6);
	});

	it('merges several lamps without duplicates, highest severity kept, deferral once and last', () => {
		const merged = mergeCautions(
			cautionsForLamp({ type: 'mercury-low-pressure' }, 5),
			cautionsForLamp({ type: 'led', peakNm: 365, fwhmNm: 10 }, 1),
			cautionsForLamp({ type: 'led', peakNm: 450, fwhmNm: 20 }, 5)
		);
		const keys = merged.map((c) => `${c.code}|${c.band ?? ''}`);
		expect(new Set(keys).size).toBe(keys.length);
		expect(codes(merged).filter((c) => c === 'consult-safety-officer')).toHaveLength(1);
		endsWithDeferral(merged);
		expect(codes(merged)).toEqual(expect.arrayContaining(['uv-c', 'uv-a', 'ozone', 'blue-light']));
	});
});

describe('cautions of several lamps', () => {
	it('each caution names its lamp; nothing is merged across lamps; the deferral comes once, last', () => {
		const uv = cautionsForLamp({ type: 'mercury-low-pressure' }, 10);
		const blue = cautionsForLamp({ type: 'led', peakNm: 405, fwhmNm: 14 }, 1.6); // 1.6 W 405 nm strip: blue-light caution (≥ 1 W in 400–500 nm)
		const all = cautionsPerLamp([{ lampId: 1, lampName: 'UV-C pencil', cautions: uv }, { lampId: 2, lampName: 'Violet strip', cautions: blue }]);
		expect(all.at(-1)?.code).toBe('consult-safety-officer');
		expect(all.filter((c) => c.code === 'consult-safety-officer')).toHaveLength(1);
		const b = all.find((c) => c.code === 'blue-light')!;
		expect(b.lampName).toBe('Violet strip');
		expect(b.title).toMatch(/^Violet strip: /);
		expect(all.find((c) => c.code === 'uv-c')?.lampId).toBe(1);
		for (const c of all.slice(0, -1)) expect(c.lampName).toBeTruthy();
	});
});
