import { describe, expect, it } from 'vitest';
import { defaultInputs, inputsFromQuery, inputsToQuery, requestBody } from './windowQuery';

const th = { minWallTransmission: 0.5, maxSolventAbsorbance: 0.5, minSubstrateAbsorbance: 0.1, minSelectivity: 0.5 };

describe('Window finder inputs in the URL', () => {
	it('round-trips every input through the query string', () => {
		const i = {
			...defaultInputs(th),
			substrateId: 7,
			concentrationM: 0.02,
			others: [{ spectrumId: 9, concentrationM: 0.001 }],
			productId: 11,
			solventId: 3,
			materialId: 5,
			thicknessMm: 1.5,
			pathCm: 0.8,
			lampIds: [1, 4],
			quantumYield: 0.4,
			amountMol: 0.0005,
			volumeMl: 10,
			rankWalls: [{ materialId: 2, thicknessMm: 2 }],
			rankSolventIds: [6, 8],
			flow: { reactorVolumeMl: 5, flowRateMlPerMin: 0.5 },
			tripletMarginKJPerMol: 15,
			reactionType: 'photocatalytic' as const,
			photocatalyst: { spectrumId: 12, concentrationM: 0.002 },
			quantumYieldBack: 0.2,
			vesselShape: 'annulus' as const,
			innerDiameterCm: 3,
			outerDiameterCm: 5
		};
		const back = inputsFromQuery(new URLSearchParams(inputsToQuery(i).toString()), defaultInputs(th));
		expect(back).toEqual(i);
	});
	it('keeps defaults for junk and builds no request until substrate, solvent and wall are chosen', () => {
		const i = inputsFromQuery(new URLSearchParams('s=abc&c=&d=-&lamps=x,2'), defaultInputs(th));
		expect(i.substrateId).toBeNull();
		expect(i.concentrationM).toBe(0.05);
		expect(i.lampIds).toEqual([2]);
		expect(requestBody(i)).toBeNull();
		const body = requestBody({ ...i, substrateId: 1, solventId: 2, materialId: 3, volumeMl: 10 });
		expect(body).toMatchObject({ substrate: { spectrumId: 1, concentrationM: 0.05 }, volumeL: 0.01, lamps: [2] });
	});
	it('sends reaction mode and vessel as API.md says (pathCm = diameter or annular gap)', () => {
		const i = { ...defaultInputs(th), substrateId: 1, solventId: 2, materialId: 3 };
		expect(requestBody({ ...i, reactionType: 'photocatalytic', photocatalyst: { spectrumId: 7, concentrationM: 0.001 } })).toMatchObject({
			reaction: { type: 'photocatalytic', photocatalyst: { spectrumId: 7, concentrationM: 0.001 } }
		});
		const rev = requestBody({ ...i, reactionType: 'reversible', productId: 9, quantumYieldBack: 0.4 })!;
		expect(rev.reaction).toEqual({ type: 'reversible', product: { spectrumId: 9 }, quantumYieldBack: 0.4 });
		expect(rev.product).toBeUndefined();
		expect(requestBody({ ...i, reactionType: 'reversible' })).toBeNull();
		expect(requestBody({ ...i, vesselShape: 'cylinder', innerDiameterCm: 4 })).toMatchObject({ vessel: { shape: 'cylinder', innerDiameterCm: 4 }, pathCm: 4 });
		expect(requestBody({ ...i, vesselShape: 'annulus', innerDiameterCm: 3, outerDiameterCm: 5 })).toMatchObject({ vessel: { shape: 'annulus', innerDiameterCm: 3, outerDiameterCm: 5 }, pathCm: 1 });
		expect(requestBody(i)!.vessel).toBeUndefined();
	});
});
