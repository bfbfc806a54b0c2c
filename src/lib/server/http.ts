import { json } from '@sveltejs/kit';

/**
 * One error envelope for every /api route (see API.md):
 * `{ error: { code, message, field?, line? } }`.
 * Throw an `ApiError` anywhere below a route and wrap the handler with `apiHandler`,
 * or return `apiError(...)` directly.
 */
export class ApiError extends Error {
	constructor(
		readonly status: number,
		readonly code: string,
		message: string,
		readonly extra: { field?: string; line?: number; [k: string]: unknown } = {}
	) {
		super(message);
	}
}

export function apiError(status: number, code: string, message: string, extra: ApiError['extra'] = {}): Response {
	return json({ error: { code, message, ...extra } }, { status });
}

export const notSignedIn = () => new ApiError(401, 'unauthenticated', 'Sign in first (session cookie or Authorization: Bearer <token>).');
export const forbidden = (what = 'Your role does not allow this.') => new ApiError(403, 'forbidden', what);
export const notFound = (what = 'Not found.') => new ApiError(404, 'not_found', what);

/** Wraps a request handler: turns thrown `ApiError`s into the JSON envelope; other errors propagate to handleError. */
export function apiHandler<E>(fn: (event: E) => Promise<Response> | Response) {
	return async (event: E): Promise<Response> => {
		try {
			return await fn(event);
		} catch (e) {
			if (e instanceof ApiError) return apiError(e.status, e.code, e.message, e.extra);
			throw e;
		}
	};
}

/** True when reading a body failed because it is above BODY_SIZE_LIMIT (adapter-node errors the stream with 413). */
export function isBodyTooLarge(e: unknown): boolean {
	const err = e as { status?: number; cause?: { status?: number }; message?: string } | undefined;
	return err?.status === 413 || err?.cause?.status === 413 || /content-length of \d+ exceeds limit|payload too large/i.test(err?.message ?? '');
}

export const bodyTooLarge = () => new ApiError(413, 'too_large', `The request body is above the ${process.env.BODY_SIZE_LIMIT ?? '512K'} limit.`);

/** Reads a JSON body or throws a 400 naming the problem (413 when it is too large). */
export async function readJson(request: Request): Promise<unknown> {
	try {
		return await request.json();
	} catch (e) {
		if (isBodyTooLarge(e)) throw bodyTooLarge();
		throw new ApiError(400, 'bad_json', 'The request body is not valid JSON.');
	}
}

/** Reads a multipart or urlencoded body (413 when it is too large, 400 when it cannot be read). */
export async function readFormData(request: Request): Promise<FormData> {
	try {
		return await request.formData();
	} catch (e) {
		if (isBodyTooLarge(e)) throw bodyTooLarge();
		throw new ApiError(400, 'invalid', 'The multipart body could not be read.', { field: 'file' });
	}
}

/** Maps a zod error to the envelope: the first issue's path becomes `field`. */
export function zodToApiError(error: { issues: { path: PropertyKey[]; message: string }[] }, status = 400): ApiError {
	const first = error.issues[0];
	const field = first?.path.map(String).join('.') || undefined;
	return new ApiError(status, 'invalid', field ? `${field}: ${first.message}` : (first?.message ?? 'Invalid input.'), { field, issues: error.issues.map((i) => ({ field: i.path.map(String).join('.'), message: i.message })) });
}
