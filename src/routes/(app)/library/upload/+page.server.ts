import { error } from '@sveltejs/kit';
import { pageUser } from '$lib/server/auth/guard';
import { membershipsOf, roleAtLeast } from '$lib/server/policy';
import { uploadLimitBytes } from '$lib/server/services/spectraPrepare';
import { db } from '$lib/server/db';
import type { PageServerLoad } from './$types';

/** Upload page: members (and leads) of a group only; viewers get 403, as the API does. */
export const load: PageServerLoad = async (event) => {
	const user = pageUser(event);
	const ms = (await membershipsOf(user.id)).filter((m) => roleAtLeast(m.role, 'member'));
	if (!ms.length && user.siteRole !== 'admin') error(403, 'Uploading needs the member role in a group; viewers can read the Library but not add to it.');
	const groups = ms.length ? await db()('groups').whereIn('id', ms.map((m) => m.groupId)).select('id', 'name') : [];
	return { groups: groups as { id: number; name: string }[], limitMb: uploadLimitBytes() / 1048576 };
};
