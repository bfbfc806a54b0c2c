import { describe, expect, it } from 'vitest';
import { checkInputs, fieldOnPage, labelOf, plainMessage } from './windowChecks';
import { defaultInputs, type WindowInputs } from './windowQuery';

const th = { minWallTransmission: 0.5, maxSolventAbsorbance: 0.5, minSubstrateAbsorbance: 0.1, minSelectivity: 0.5 };
const ok = (): WindowInputs => ({ ...defaultInputs(th), substrateId: 1, solventId: 2, materialId: 3 });
const fields = (i: WindowInputs) => checkInputs(i).map((p) => p.field);

describe('Window finder checks in plain words', () => {
	it('accepts sensible inputs', () => {
		expect(checkInputs(ok())).toEqual([]);
	});
	it('names the field of a negative concentration, an empty path and an impossible Φ', () => {
		expect(checkInputs({ ...ok(), concentrationM: -1 })).toEqual([{ field: 'substrate.concentrationM', message: 'Substrate concentration must be 0 mol L⁻¹ or more.' }]);
		expect(fields({ ...ok(), pathCm: null as unknown as number })).toEqual(['pathCm']);
		// Φ ≤ 0 or > 10⁴ is refused; a chain may give up to 10⁴ (API.md, reaction modes)
		expect(fields({ ...ok(), quantumYield: 0 })).toEqual(['quantumYield']);
		expect(fields({ ...ok(), quantumYield: 2e4 })).toEqual(['quantumYield']);
		expect(fields({ ...ok(), quantumYield: 5000 })).toEqual([]);
	});
	it('checks round vessels: diameters above 0, the outer larger than the inner', () => {
		expect(fields({ ...ok(), vesselShape: 'cylinder', innerDiameterCm: -4 })).toEqual(['vessel.innerDiameterCm']);
		expect(fields({ ...ok(), vesselShape: 'annulus', innerDiameterCm: 4, outerDiameterCm: 3 })).toEqual(['vessel.outerDiameterCm']);
		expect(fields({ ...ok(), vesselShape: 'annulus', innerDiameterCm: 4, outerDiameterCm: 6 })).toEqual([]);
	});
	it('needs the photocatalyst or the product for the modes that use them', () => {
		expect(fields({ ...ok(), reactionType: 'photocatalytic' })).toEqual(['reaction.photocatalyst.spectrumId']);
		expect(fields({ ...ok(), reactionType: 'reversible' })).toEqual(['reaction.product.spectrumId', 'reaction.quantumYieldBack']);
		expect(fields({ ...ok(), reactionType: 'reversible', productId: 5, quantumYieldBack: 0.3 })).toEqual([]);
	});
	it('turns server field paths into the page’s words', () => {
		expect(plainMessage('substrate.concentrationM', 'substrate.concentrationM must not be negative')).toBe('Substrate concentration must not be negative');
		expect(plainMessage('pathCm', 'pathCm: must be a number')).toBe('Optical path: must be a number');
		expect(labelOf('others.1.concentrationM')).toBe('Other absorber 2 concentration');
		expect(fieldOnPage('pathCm', { ...ok(), vesselShape: 'cylinder' })).toBe('vessel.innerDiameterCm');
	});
});
