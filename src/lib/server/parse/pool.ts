/**
 * Upload parsing off the event loop and out of the server's heap: a small workerpool of parser
 * processes, each with its own heap cap, and a time limit per file. The request's event loop only
 * waits for a message.
 *
 * Why processes and not worker threads: on Node 20 a worker thread that outgrows its
 * `resourceLimits` while growing an array aborts the whole process ("Reached heap limit"), server
 * included (a twenty-line loop pushing numbers shows it). A parser process that runs out of
 * memory dies alone; the server answers 413 and starts a fresh one for the next file.
 *
 * Environment: PARSE_WORKERS [2] processes, PARSE_WORKER_MEMORY_MB [768] heap per process,
 * PARSE_TIMEOUT_MS [30000] per file, PARSE_QUEUE [32] files waiting before 503.
 *
 * The built app runs the compiled worker `<build>/workers/parse.js` (made by `npm run build`);
 * the source tree (vite dev, vitest, tsx scripts) runs `parseWorker.ts` through tsx.
 */
import workerpool from 'workerpool';
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ApiError } from '../http';
import type { ParseJob, ParseJobResult } from './parseWorker';
import type { PreparedSpectrum } from '../services/spectraPrepare';
import type { ParseIssue } from '../../spectra/types';

const num = (v: string | undefined, fallback: number) => (v != null && Number.isFinite(Number(v)) && Number(v) > 0 ? Number(v) : fallback);

/** Where the worker script is: the compiled one beside a build, else the TypeScript source. */
export function workerScript(): { filename: string; execArgv: string[] } {
	if (process.env.PARSE_WORKER_FILE) return { filename: process.env.PARSE_WORKER_FILE, execArgv: [] };
	const here = dirname(fileURLToPath(import.meta.url));
	let dir = here;
	for (let i = 0; i < 10; i++) {
		const f = join(dir, 'workers', 'parse.js');
		if (existsSync(f)) return { filename: f, execArgv: [] };
		dir = dirname(dir);
	}
	return { filename: join(here, ['parseWorker', 'ts'].join('.')), execArgv: ['--import', 'tsx'] };
}

let pool: ReturnType<typeof workerpool.pool> | null = null;

function getPool() {
	if (pool) return pool;
	const { filename, execArgv } = workerScript();
	pool = workerpool.pool(filename, {
		workerType: 'process',
		minWorkers: 0,
		maxWorkers: num(process.env.PARSE_WORKERS, 2),
		maxQueueSize: num(process.env.PARSE_QUEUE, 32),
		workerTerminateTimeout: 2_000,
		forkOpts: {
			execArgv: [...execArgv, `--max-old-space-size=${num(process.env.PARSE_WORKER_MEMORY_MB, 768)}`],
			// Typed arrays cross the process boundary as they are (structured clone, not JSON).
			serialization: 'advanced',
			env: { ...process.env, WINDOWSILL_PARSE_WORKER: '1' }
		}
	});
	return pool;
}

/** Ends the pool (tests, shutdown). */
export async function closeParsePool(): Promise<void> {
	const p = pool;
	pool = null;
	if (p) await p.terminate(true);
}

export const parseTimeoutMs = () => num(process.env.PARSE_TIMEOUT_MS, 30_000);

/**
 * Parses, normalises and derives one uploaded file in a parser process.
 * @throws ApiError — the parser's own 400/413/415/422; 413 when the file needs more memory or time
 *   than one upload may use; 503 when too many files are waiting
 */
export async function prepareSpectraInWorker(bytes: Uint8Array, filename: string, meta: ParseJob['meta']): Promise<{ spectra: PreparedSpectrum[]; warnings: ParseIssue[] }> {
	const ms = parseTimeoutMs();
	let result: ParseJobResult;
	try {
		result = (await getPool().exec('parseJob', [{ bytes, filename, meta } satisfies ParseJob]).timeout(ms)) as ParseJobResult;
	} catch (e) {
		const err = e as { name?: string; message?: string };
		if (err instanceof workerpool.Promise.TimeoutError || err.name === 'TimeoutError')
			throw new ApiError(413, 'too_complex', `${filename}: reading this file took longer than ${Math.round(ms / 1000)} s and was stopped; split it into smaller files`, { field: 'file' });
		if (/max queue size/i.test(err.message ?? ''))
			throw new ApiError(503, 'busy', 'Too many files are being read at the moment; try again in a few seconds.', { retryAfterS: 5 });
		if (/terminated unexpectedly|exitCode|signalCode|heap|memory/i.test(err.message ?? ''))
			throw new ApiError(413, 'too_complex', `${filename}: reading this file needs more memory than one upload may use; split it into smaller files`, { field: 'file' });
		console.error('[parse-pool]', String(err.message ?? e).slice(0, 300));
		throw new ApiError(400, 'bad_file', `${filename}: the file could not be read`, { field: 'file' });
	}
	if (!result.ok) throw new ApiError(result.error.status, result.error.code, result.error.message, result.error.extra);
	return result.value;
}
