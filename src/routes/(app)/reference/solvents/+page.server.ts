import { fail, redirect } from '@sveltejs/kit';
import { listLinkableSpectra, listSolvents } from '$lib/server/db/solvents';
import { ApiError } from '$lib/server/http';
import { membershipsOf } from '$lib/server/policy';
import { linkSolventSpectrum } from '$lib/server/services/solventLink';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	const ms = await membershipsOf(locals.user?.id);
	const canLink = locals.user?.siteRole === 'admin' || ms.some((m) => m.role === 'lead');
	return { solvents: await listSolvents(), canLink, linkable: canLink ? await listLinkableSpectra() : [] };
};

export const actions: Actions = {
	link: async ({ request, locals, url }) => {
		if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname)}`);
		const f = await request.formData();
		try {
			const s = await linkSolventSpectrum(locals, f.get('solventId'), f.get('spectrumId'));
			return { linked: true, solventName: s.name, spectrumName: s.spectrumName };
		} catch (e) {
			if (e instanceof ApiError) return fail(e.status, { message: e.message, field: e.extra.field, solventId: String(f.get('solventId') ?? ''), spectrumId: String(f.get('spectrumId') ?? '') });
			throw e;
		}
	}
};
