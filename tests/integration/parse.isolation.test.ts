/**
 * Upload parsing runs in separate parser processes with a heap cap and a time limit
 * (src/lib/server/parse/pool.ts): a file that would need gigabytes, or that takes too long, is
 * answered with a 4xx while this process (the server) stays up and keeps parsing other files.
 */
import { afterAll, describe, expect, it } from 'vitest';

// A small heap for the parser processes of this file, so the bomb fails fast.
process.env.PARSE_WORKER_MEMORY_MB = '256';
import { ApiError } from '../../src/lib/server/http';
import { closeParsePool, prepareSpectraInWorker } from '../../src/lib/server/parse/pool';

// A 200-byte JCAMP-DX file whose DUP count asks for 10⁸ points (JCAMP-DX 4.24 §5: 'V' is DUP 4, digits follow).
const bomb = new TextEncoder().encode(
	['##TITLE=dup bomb', '##JCAMP-DX=4.24', '##DATA TYPE=UV/VIS SPECTRUM', '##XUNITS=NANOMETERS', '##YUNITS=ABSORBANCE', '##FIRSTX=200', '##LASTX=800', '##NPOINTS=601', '##XFACTOR=1', '##YFACTOR=1', '##XYDATA=(X++(Y..Y))', '200 1V99999999', '##END='].join('\n')
);
// An invented two-column spectrum (demo-style data, not a reference).
const small = new TextEncoder().encode(['nm,A', ...Array.from({ length: 101 }, (_, i) => `${300 + 2 * i},${(0.5 * Math.exp(-(((2 * i - 100) / 30) ** 2))).toFixed(4)}`)].join('\n'));

afterAll(async () => {
	await closeParsePool();
});

describe('parsing in a parser process', () => {
	it('a normal file comes back with typed arrays intact', async () => {
		const { spectra } = await prepareSpectraInWorker(small, 'small.csv', {});
		expect(spectra).toHaveLength(1);
		expect(spectra[0].norm.x).toBeInstanceOf(Float64Array);
		expect(spectra[0].norm.x.length).toBe(101);
	});

	it('a decompression bomb is refused (4xx, not a crash), and the next file still parses', async () => {
		const err = await prepareSpectraInWorker(bomb, 'bomb.jdx', {}).then(
			() => null,
			(e) => e
		);
		expect(err).toBeInstanceOf(ApiError);
		expect([400, 413, 422]).toContain((err as ApiError).status);
		expect((err as ApiError).message).toContain('bomb.jdx');
		const again = await prepareSpectraInWorker(small, 'small.csv', {});
		expect(again.spectra).toHaveLength(1);
	}, 60_000);

	it('bad input keeps its own status and message across the process boundary', async () => {
		const err = await prepareSpectraInWorker(new TextEncoder().encode('hello\nworld\n'), 'words.txt', {}).then(
			() => null,
			(e) => e
		);
		expect(err).toBeInstanceOf(ApiError);
		expect([400, 415]).toContain((err as ApiError).status);
		expect((err as ApiError).message).toContain('words.txt');
	});
});
