/** Small request helpers shared by the /api/plans routes. */
import { ApiError } from '$lib/server/http';
import { linkBase } from '$lib/server/mail/send';
import type { MailContext } from './planReview';

/** A JSON body that may be empty (→ {}); 400 naming the problem when it is not JSON. */
export async function readOptionalJson(request: Request): Promise<unknown> {
	const text = await request.text();
	if (!text.trim()) return {};
	try {
		return JSON.parse(text);
	} catch {
		throw new ApiError(400, 'bad_json', 'The request body is not valid JSON.');
	}
}

/** Links in mail use PUBLIC_ORIGIN / ORIGIN or the request's origin. */
export const mailContext = (url: URL): MailContext => ({ origin: linkBase(url) });
