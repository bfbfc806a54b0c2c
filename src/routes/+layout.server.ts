import type { LayoutServerLoad } from './$types';

/** Whitelist of user fields sent to the browser. */
export const load: LayoutServerLoad = ({ locals }) => ({
	user: locals.user ? { id: locals.user.id, name: locals.user.name, email: locals.user.email, siteRole: locals.user.siteRole } : null
});
