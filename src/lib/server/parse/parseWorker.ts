/**
 * Worker-thread entry for upload parsing (run by piscina, see ./pool.ts): parse → normalise →
 * derive one file with the pure cores. Runs with a memory cap and a time limit, so no file can
 * block the server's event loop or take the server down; a worker that runs out of memory dies alone.
 *
 * Answers plain data only (structured clone): the prepared spectra, or the ApiError's fields.
 */
import { prepareSpectra } from '../services/spectraPrepare';
import { ApiError } from '../http';
import type { UploadMetadata } from '../../schemas/spectra';

export interface ParseJob {
	bytes: Uint8Array;
	filename: string;
	meta: UploadMetadata;
}

export type ParseJobResult =
	| { ok: true; value: ReturnType<typeof prepareSpectra> }
	| { ok: false; error: { status: number; code: string; message: string; extra: ApiError['extra'] } };

export default function parseJob(job: ParseJob): ParseJobResult {
	try {
		return { ok: true, value: prepareSpectra(job.bytes, job.filename, job.meta) };
	} catch (e) {
		if (e instanceof ApiError) return { ok: false, error: { status: e.status, code: e.code, message: e.message, extra: JSON.parse(JSON.stringify(e.extra ?? {})) } };
		// A bug in the parser must not look like the user's fault, but it is still about this file.
		const message = e instanceof Error ? e.message : String(e);
		return { ok: false, error: { status: 400, code: 'bad_file', message: `${job.filename}: the file could not be read (${message.slice(0, 200)})`, extra: { field: 'file' } } };
	}
}

// Started as a parser process by workerpool (./pool.ts): register the job.
if (process.env.WINDOWSILL_PARSE_WORKER === '1') {
	const { default: workerpool } = await import('workerpool');
	workerpool.worker({ parseJob });
}
