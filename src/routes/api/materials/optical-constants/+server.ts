/** POST /api/materials/optical-constants (multipart: `file` = wavelength, n, k table; `name`; `thicknessMm`) — member+: a wall material from n, k. */
import { json } from '@sveltejs/kit';
import { ApiError, apiHandler } from '$lib/server/http';
import { requireUser } from '$lib/server/policy';
import { requireMemberSomewhere } from '$lib/server/services/groupChoice';
import { addWallMaterialFromOpticalConstants } from '$lib/server/services/wallFromOpticalConstants';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = apiHandler(async ({ locals, request }) => {
	requireUser(locals);
	await requireMemberSomewhere(locals);
	if (!/multipart\/form-data/i.test(request.headers.get('content-type') ?? ''))
		throw new ApiError(415, 'unsupported_media_type', 'Send the n, k table as multipart/form-data with "file", "name" and "thicknessMm" fields.', { field: 'file' });
	let form: FormData;
	try {
		form = await request.formData();
	} catch {
		throw new ApiError(400, 'invalid', 'The multipart body could not be read.', { field: 'file' });
	}
	return json(await addWallMaterialFromOpticalConstants(locals, form), { status: 201 });
});
