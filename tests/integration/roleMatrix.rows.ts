/**
 * The role × route matrix: one row per /api route and per page action (and guarded page),
 * with the status each actor must get. Add a row when you add a route.
 *
 * Actors: anonymous; viewer, member, lead of the demo group "harbourlight"; outsider = member
 * of the unrelated group "quillon"; admin = site admin (in no group). API rows run with a
 * bearer token, page rows with the same token (pages accept it too) and a same-origin form
 * post. Rows whose action would change demo data send a body that passes the role check but
 * fails validation, so an allowed actor gets 400 and nothing is written.
 *
 * Conventions: /api → 401 anonymous; pages/actions → 303 to /signin anonymous; 404 where a
 * group is not visible to the caller (no leak), 403 where it is visible but the role is too low.
 */
export type Actor = 'anonymous' | 'viewer' | 'member' | 'lead' | 'outsider' | 'admin';
export const ACTORS: Actor[] = ['anonymous', 'viewer', 'member', 'lead', 'outsider', 'admin'];

export interface MatrixRow {
	/** Shown in the test title. */
	name: string;
	method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
	path: string;
	/** `api`: JSON body (or multipart when `form` is given); `action`: urlencoded form post like a browser; `page`: GET of a page. */
	kind: 'api' | 'action' | 'page';
	json?: unknown;
	form?: Record<string, string>;
	expect: Record<Actor, number>;
}

const all = (anonymous: number, signedIn: number): Record<Actor, number> => ({ anonymous, viewer: signedIn, member: signedIn, lead: signedIn, outsider: signedIn, admin: signedIn });
/** Demo-group management: lead and admin allowed (`ok`), member/viewer 403, outsider 404, anonymous 303. */
const leadOnly = (ok: number): Record<Actor, number> => ({ anonymous: 303, viewer: 403, member: 403, lead: ok, outsider: 404, admin: ok });
/** Anything in the demo group: its members and admin allowed, outsider 404. */
const demoGroup = (ok: number): Record<Actor, number> => ({ anonymous: 303, viewer: ok, member: ok, lead: ok, outsider: 404, admin: ok });
/** A row of the demo group over the API: its members and admin allowed, outsider 404, anonymous 401. */
const demoGroupApi = (ok: number): Record<Actor, number> => ({ anonymous: 401, viewer: ok, member: ok, lead: ok, outsider: 404, admin: ok });
const adminOnly = (ok: number): Record<Actor, number> => ({ anonymous: 303, viewer: 403, member: 403, lead: 403, outsider: 403, admin: ok });

export const ROLE_MATRIX_ROWS: MatrixRow[] = [
	// ---- JSON API ----
	{ name: 'health', method: 'GET', path: '/api/health', kind: 'api', expect: all(200, 200) },
	{ name: 'sign-in, bad body', method: 'POST', path: '/api/auth/signin', kind: 'api', json: { email: 'not-an-address' }, expect: all(400, 400) },
	{ name: 'sign-out (token session: nothing to end)', method: 'POST', path: '/api/auth/signout', kind: 'api', json: {}, expect: all(401, 200) },
	{ name: 'me', method: 'GET', path: '/api/me', kind: 'api', expect: all(401, 200) },
	{ name: 'list tokens', method: 'GET', path: '/api/tokens', kind: 'api', expect: all(401, 200) },
	// The matrix calls with bearer tokens: tokens cannot make tokens (a browser session is required; auth.test / robustness e2e check the session path).
	{ name: 'create token with a token', method: 'POST', path: '/api/tokens', kind: 'api', json: { name: 'matrix' }, expect: all(401, 403) },
	{ name: 'create token with a token, empty name', method: 'POST', path: '/api/tokens', kind: 'api', json: { name: '' }, expect: all(401, 403) },
	{ name: "revoke someone else's / unknown token", method: 'DELETE', path: '/api/tokens/999999999', kind: 'api', expect: all(401, 404) },

	// ---- library, reference data, lamps, plans, window (rows by the accounts work; owners may refine) ----
	// Ids: in the freshly seeded test database spectrum 1 is a group-visible spectrum of
	// "harbourlight", spectrum 6 is private to member@, lamp 1 belongs to "harbourlight".
	{ name: 'upload without a file', method: 'POST', path: '/api/spectra', kind: 'api', json: undefined, form: { metadata: '{}' }, expect: { anonymous: 401, viewer: 403, member: 400, lead: 400, outsider: 400, admin: 403 } },
	{ name: 'group spectrum', method: 'GET', path: '/api/spectra/1', kind: 'api', expect: demoGroupApi(200) },
	{ name: "member's private spectrum", method: 'GET', path: '/api/spectra/6', kind: 'api', expect: { anonymous: 401, viewer: 404, member: 200, lead: 404, outsider: 404, admin: 200 } },
	{ name: 'patch spectrum without version', method: 'PATCH', path: '/api/spectra/1', kind: 'api', json: {}, expect: { anonymous: 401, viewer: 403, member: 400, lead: 400, outsider: 404, admin: 400 } },
	{ name: 'spectrum data', method: 'GET', path: '/api/spectra/1/data', kind: 'api', expect: demoGroupApi(200) },
	{ name: 'spectrum export', method: 'GET', path: '/api/spectra/1/export?format=csv', kind: 'api', expect: demoGroupApi(200) },
	{ name: 'spectrum revisions', method: 'GET', path: '/api/spectra/1/revisions', kind: 'api', expect: demoGroupApi(200) },
	{ name: 'similar spectra', method: 'GET', path: '/api/spectra/similar?to=1', kind: 'api', expect: demoGroupApi(200) },
	{ name: 'solvents', method: 'GET', path: '/api/solvents', kind: 'api', expect: all(200, 200) },
	{ name: 'materials', method: 'GET', path: '/api/materials', kind: 'api', expect: all(200, 200) },
	{ name: 'add material, empty body', method: 'POST', path: '/api/materials', kind: 'api', json: {}, expect: { anonymous: 401, viewer: 403, member: 400, lead: 400, outsider: 400, admin: 400 } },
	{ name: 'material transmission', method: 'GET', path: '/api/materials/1/transmission?thicknessMm=2', kind: 'api', expect: all(200, 200) },
	{ name: 'list lamps', method: 'GET', path: '/api/lamps', kind: 'api', expect: all(401, 200) },
	{ name: 'add lamp, empty body', method: 'POST', path: '/api/lamps', kind: 'api', json: {}, expect: { anonymous: 401, viewer: 403, member: 400, lead: 400, outsider: 400, admin: 400 } },
	{ name: 'demo lamp', method: 'GET', path: '/api/lamps/1', kind: 'api', expect: demoGroupApi(200) },
	{ name: 'patch demo lamp, negative power', method: 'PATCH', path: '/api/lamps/1', kind: 'api', json: { powerW: -1 }, expect: { anonymous: 401, viewer: 403, member: 400, lead: 400, outsider: 404, admin: 400 } },
	{ name: 'list plans', method: 'GET', path: '/api/plans', kind: 'api', expect: all(401, 200) },
	{ name: 'create plan, empty body', method: 'POST', path: '/api/plans', kind: 'api', json: {}, expect: { anonymous: 401, viewer: 403, member: 400, lead: 400, outsider: 400, admin: 400 } },
	{ name: 'unknown plan', method: 'GET', path: '/api/plans/999999', kind: 'api', expect: all(401, 404) },
	{ name: 'patch unknown plan', method: 'PATCH', path: '/api/plans/999999', kind: 'api', json: {}, expect: all(401, 404) },
	{ name: 'submit unknown plan', method: 'POST', path: '/api/plans/999999/submit', kind: 'api', json: {}, expect: all(401, 404) },
	{ name: 'approve unknown plan', method: 'POST', path: '/api/plans/999999/approve', kind: 'api', json: {}, expect: all(401, 404) },
	{ name: 'return unknown plan', method: 'POST', path: '/api/plans/999999/return', kind: 'api', json: {}, expect: all(401, 404) },
	{ name: 'window, empty body', method: 'POST', path: '/api/window', kind: 'api', json: {}, expect: all(401, 400) },

	// ---- pages ----
	{ name: 'account page', method: 'GET', path: '/account', kind: 'page', expect: all(303, 200) },
	{ name: 'groups page', method: 'GET', path: '/groups', kind: 'page', expect: all(303, 200) },
	{ name: 'demo group settings', method: 'GET', path: '/groups/harbourlight', kind: 'page', expect: demoGroup(200) },
	{ name: 'other group settings', method: 'GET', path: '/groups/quillon', kind: 'page', expect: { anonymous: 303, viewer: 404, member: 404, lead: 404, outsider: 200, admin: 200 } },
	{ name: 'unknown group', method: 'GET', path: '/groups/no-such-group', kind: 'page', expect: all(303, 404) },
	{ name: 'admin page', method: 'GET', path: '/admin', kind: 'page', expect: adminOnly(200) },
	{ name: 'admin outbox', method: 'GET', path: '/admin/outbox', kind: 'page', expect: adminOnly(200) },

	// ---- account actions ----
	{ name: 'change password, wrong current', method: 'POST', path: '/account?/password', kind: 'action', form: { current: '', password: 'x', confirm: 'y' }, expect: all(303, 400) },
	{ name: 'create token form, empty name', method: 'POST', path: '/account?/createToken', kind: 'action', form: { name: '' }, expect: all(303, 400) },
	{ name: 'revoke unknown token form', method: 'POST', path: '/account?/revokeToken', kind: 'action', form: { id: '999999999' }, expect: all(303, 404) },
	{ name: 'resend verification (already verified)', method: 'POST', path: '/account?/resendVerification', kind: 'action', form: {}, expect: all(303, 400) },
	{ name: 'sign out form', method: 'POST', path: '/signout', kind: 'action', form: {}, expect: all(303, 303) },

	// ---- group actions ----
	{ name: 'create group, empty name', method: 'POST', path: '/groups?/create', kind: 'action', form: { name: '' }, expect: all(303, 400) },
	{ name: 'invite, bad address', method: 'POST', path: '/groups/harbourlight?/invite', kind: 'action', form: { email: 'nope', role: 'member' }, expect: leadOnly(400) },
	{ name: 'change role, bad role', method: 'POST', path: '/groups/harbourlight?/changeRole', kind: 'action', form: { userId: 'demo-member', role: 'emperor' }, expect: leadOnly(400) },
	{ name: 'remove member, none chosen', method: 'POST', path: '/groups/harbourlight?/remove', kind: 'action', form: { userId: '' }, expect: leadOnly(400) },
	{ name: 'leave, not confirmed', method: 'POST', path: '/groups/harbourlight?/leave', kind: 'action', form: {}, expect: demoGroup(400) },
	{ name: 'invite to the other group', method: 'POST', path: '/groups/quillon?/invite', kind: 'action', form: { email: 'nope', role: 'member' }, expect: { anonymous: 303, viewer: 404, member: 404, lead: 404, outsider: 403, admin: 400 } },

	// ---- public account actions (anyone; bad input → 400, nothing written) ----
	{ name: 'sign-in form, bad address', method: 'POST', path: '/signin', kind: 'action', form: { email: 'x', password: '' }, expect: all(400, 303) }, // signed in: the page's load sends them on
	{ name: 'sign-up form, bad input', method: 'POST', path: '/signup', kind: 'action', form: { name: '', email: 'x', password: 'short' }, expect: all(400, 400) },
	{ name: 'forgot form, bad address', method: 'POST', path: '/forgot', kind: 'action', form: { email: 'x' }, expect: all(400, 400) },
	{ name: 'reset form, bad token', method: 'POST', path: '/reset', kind: 'action', form: { token: 'short', password: 'x', confirm: 'x' }, expect: all(400, 400) },
	{ name: 'verify form, unknown token', method: 'POST', path: '/verify', kind: 'action', form: { token: 'aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa' }, expect: all(400, 400) },
	{ name: 'accept unknown invitation', method: 'POST', path: '/invite/aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa?/accept', kind: 'action', form: {}, expect: all(303, 404) },
	{ name: 'sign up from unknown invitation', method: 'POST', path: '/invite/aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa?/signup', kind: 'action', form: { name: 'A', password: 'long-enough-pass' }, expect: all(404, 404) },
	// ---- Library (spectra): unknown ids are 404 for everyone signed in, exactly like another group's private rows ----
	{ name: 'list spectra, absorbsAt out of range', method: 'GET', path: '/api/spectra?absorbsAt=5000', kind: 'api', expect: all(401, 400) },
	{ name: 'upload spectrum as JSON instead of multipart', method: 'POST', path: '/api/spectra', kind: 'api', json: { name: 'x' }, expect: { anonymous: 401, viewer: 403, member: 415, lead: 415, outsider: 415, admin: 403 } },
	{ name: 'unknown spectrum', method: 'GET', path: '/api/spectra/999999999', kind: 'api', expect: all(401, 404) },
	{ name: 'patch unknown spectrum', method: 'PATCH', path: '/api/spectra/999999999', kind: 'api', json: { version: 1, name: 'x' }, expect: all(401, 404) },
	{ name: 'delete unknown spectrum', method: 'DELETE', path: '/api/spectra/999999999', kind: 'api', expect: all(401, 404) },
	{ name: 'restore unknown spectrum', method: 'POST', path: '/api/spectra/999999999/restore', kind: 'api', json: {}, expect: all(401, 404) },
	{ name: 'data of unknown spectrum', method: 'GET', path: '/api/spectra/999999999/data', kind: 'api', expect: all(401, 404) },
	{ name: 'export unknown spectrum', method: 'GET', path: '/api/spectra/999999999/export?format=csv', kind: 'api', expect: all(401, 404) },
	{ name: 'revisions of unknown spectrum', method: 'GET', path: '/api/spectra/999999999/revisions', kind: 'api', expect: all(401, 404) },
	{ name: 'similar without to', method: 'GET', path: '/api/spectra/similar', kind: 'api', expect: all(401, 400) },
	{ name: 'similar to unknown spectrum', method: 'GET', path: '/api/spectra/similar?to=999999999', kind: 'api', expect: all(401, 404) },
	{ name: 'library page', method: 'GET', path: '/library', kind: 'page', expect: all(303, 200) },
	{ name: 'library upload page', method: 'GET', path: '/library/upload', kind: 'page', expect: { anonymous: 303, viewer: 403, member: 200, lead: 200, outsider: 200, admin: 200 } },
	{ name: 'library overlay page', method: 'GET', path: '/library/overlay?ids=999999999', kind: 'page', expect: all(303, 200) },
	{ name: 'unknown spectrum page', method: 'GET', path: '/library/999999999', kind: 'page', expect: all(303, 404) },
	{ name: 'save unknown spectrum form', method: 'POST', path: '/library/999999999?/save', kind: 'action', form: { version: '1', name: 'x' }, expect: all(303, 404) },
	{ name: 'delete unknown spectrum form', method: 'POST', path: '/library/999999999?/delete', kind: 'action', form: {}, expect: all(303, 404) },
	// ---- reference pages, lamps, window finder and plans pages ----
	{ name: 'solvents page', method: 'GET', path: '/reference/solvents', kind: 'page', expect: all(200, 200) },
	{ name: 'materials page', method: 'GET', path: '/reference/materials', kind: 'page', expect: all(200, 200) },
	{ name: 'link solvent spectrum, not public', method: 'POST', path: '/reference/solvents?/link', kind: 'action', form: { solventId: '1', spectrumId: '999999999' }, expect: { anonymous: 303, viewer: 403, member: 403, lead: 400, outsider: 403, admin: 400 } },
	{ name: 'lamps page', method: 'GET', path: '/lamps', kind: 'page', expect: all(303, 200) },
	{ name: 'new lamp page', method: 'GET', path: '/lamps/new', kind: 'page', expect: all(303, 200) },
	{ name: 'add lamp form, no name', method: 'POST', path: '/lamps/new', kind: 'action', form: { name: '', modelType: 'led', powerW: '1' }, expect: { anonymous: 303, viewer: 403, member: 400, lead: 400, outsider: 400, admin: 400 } },
	{ name: 'demo lamp page', method: 'GET', path: '/lamps/1', kind: 'page', expect: demoGroup(200) },
	{ name: 'update demo lamp form, negative power', method: 'POST', path: '/lamps/1?/update', kind: 'action', form: { powerW: '-1', modelType: 'led', peakNm: '365', fwhmNm: '10', name: 'x' }, expect: { anonymous: 303, viewer: 403, member: 400, lead: 400, outsider: 404, admin: 400 } },
	{ name: 'window finder page', method: 'GET', path: '/window', kind: 'page', expect: all(303, 200) },
	{ name: 'plans page', method: 'GET', path: '/plans', kind: 'page', expect: all(303, 200) },
	{ name: 'unknown plan page', method: 'GET', path: '/plans/999999', kind: 'page', expect: all(303, 404) },
	{ name: 'submit unknown plan form', method: 'POST', path: '/plans/999999?/submit', kind: 'action', form: {}, expect: all(303, 404) },
	// ---- library (solvent links) ----
	{ name: 'one solvent', method: 'GET', path: '/api/solvents/1', kind: 'api', expect: all(200, 200) },
	{ name: 'link solvent spectrum over the API, unknown spectrum', method: 'PATCH', path: '/api/solvents/1', kind: 'api', json: { spectrumId: 999999999 }, expect: { anonymous: 401, viewer: 403, member: 403, lead: 400, outsider: 403, admin: 400 } },
	// ---- lamps helper: actinometry, calibrations, calibration interval ----
	{ name: 'actinometers', method: 'GET', path: '/api/actinometers', kind: 'api', expect: all(200, 200) },
	{ name: 'actinometry run, empty body', method: 'POST', path: '/api/actinometry', kind: 'api', json: {}, expect: { anonymous: 401, viewer: 403, member: 400, lead: 400, outsider: 400, admin: 400 } },
	{ name: 'demo lamp calibrations', method: 'GET', path: '/api/lamps/1/calibrations', kind: 'api', expect: demoGroupApi(200) },
	{ name: 'radiometer reading, negative power', method: 'POST', path: '/api/lamps/1/calibrations', kind: 'api', json: { kind: 'radiometer', opticalPowerW: -1 }, expect: { anonymous: 401, viewer: 403, member: 400, lead: 400, outsider: 404, admin: 400 } },
	{ name: 'demo lamp actinometry page', method: 'GET', path: '/lamps/1/actinometry', kind: 'page', expect: demoGroup(200) },
	{ name: 'record actinometry form, no time', method: 'POST', path: '/lamps/1/actinometry?/record', kind: 'action', form: { actinometer: 'ferrioxalate', concentrationM: '0.006' }, expect: { anonymous: 303, viewer: 403, member: 400, lead: 400, outsider: 404, admin: 400 } },
	{ name: 'record radiometer form, no power', method: 'POST', path: '/lamps/1/actinometry?/radiometer', kind: 'action', form: { materialId: '1' }, expect: { anonymous: 303, viewer: 403, member: 400, lead: 400, outsider: 404, admin: 400 } },
	{ name: 'set calibration interval form, zero days', method: 'POST', path: '/lamps/1?/interval', kind: 'action', form: { intervalDays: '0' }, expect: leadOnly(400) },
	{ name: 'preview lamp form, negative power', method: 'POST', path: '/lamps/new', kind: 'action', form: { intent: 'preview', name: '', modelType: 'led', powerW: '-1', peakNm: '365', fwhmNm: '10' }, expect: all(303, 400) },
	// ---- finder: the Window finder's save action (role first: viewers 403; others fail validation, nothing saved) ----
	{ name: 'window finder save form, no inputs', method: 'POST', path: '/window?/save', kind: 'action', form: { title: 'x', inputs: '{}' }, expect: { anonymous: 303, viewer: 403, member: 400, lead: 400, outsider: 400, admin: 400 } },
	// ---- desk: plans review, recompute, report, matrix, audit, outbox ----
	// Group 1 is "harbourlight" in the freshly seeded test database; plan 999999 does not exist.
	{ name: 'list plans, unknown state filter', method: 'GET', path: '/api/plans?state=pending', kind: 'api', expect: all(401, 400) },
	{ name: 'list plans filtered by state and lamp', method: 'GET', path: '/api/plans?state=submitted&lamp=1', kind: 'api', expect: all(401, 200) },
	{ name: 'create plan, bad idempotency key', method: 'POST', path: '/api/plans', kind: 'api', json: { title: 'x', inputs: {}, idempotencyKey: 'twice' }, expect: { anonymous: 401, viewer: 403, member: 400, lead: 400, outsider: 400, admin: 400 } },
	{ name: 'comments of unknown plan', method: 'GET', path: '/api/plans/999999/comments', kind: 'api', expect: all(401, 404) },
	{ name: 'comment on unknown plan', method: 'POST', path: '/api/plans/999999/comments', kind: 'api', json: { body: 'x' }, expect: all(401, 404) },
	{ name: 'recompute unknown plan', method: 'POST', path: '/api/plans/999999/recompute', kind: 'api', json: {}, expect: all(401, 404) },
	{ name: 'report of unknown plan (pdf)', method: 'GET', path: '/api/plans/999999/report?format=pdf', kind: 'api', expect: all(401, 404) },
	{ name: 'report of unknown plan (html)', method: 'GET', path: '/api/plans/999999/report?format=html', kind: 'api', expect: all(401, 404) },
	{ name: 'revision of unknown plan', method: 'GET', path: '/api/plans/999999/revisions/1', kind: 'api', expect: all(401, 404) },
	{ name: 'demo group matrix', method: 'GET', path: '/api/groups/1/matrix', kind: 'api', expect: demoGroupApi(200) },
	{ name: 'demo group matrix, negative path', method: 'GET', path: '/api/groups/1/matrix?pathCm=-1', kind: 'api', expect: demoGroupApi(422) },
	{ name: 'demo group matrix, unreadable concentration', method: 'GET', path: '/api/groups/1/matrix?concentrationM=lots', kind: 'api', expect: demoGroupApi(400) },
	{ name: 'unknown group matrix', method: 'GET', path: '/api/groups/999999/matrix', kind: 'api', expect: all(401, 404) },
	{ name: 'audit log, own groups', method: 'GET', path: '/api/audit', kind: 'api', expect: { anonymous: 401, viewer: 403, member: 403, lead: 200, outsider: 403, admin: 200 } },
	{ name: 'audit log of the demo group', method: 'GET', path: '/api/audit?groupId=1&limit=5', kind: 'api', expect: { anonymous: 401, viewer: 403, member: 403, lead: 200, outsider: 404, admin: 200 } },
	{ name: 'audit log, limit out of range', method: 'GET', path: '/api/audit?limit=0', kind: 'api', expect: { anonymous: 401, viewer: 400, member: 400, lead: 400, outsider: 400, admin: 400 } },
	{ name: 'outbox (development and test)', method: 'GET', path: '/api/admin/outbox?limit=5', kind: 'api', expect: { anonymous: 401, viewer: 403, member: 403, lead: 403, outsider: 403, admin: 200 } },
	{ name: 'audit page', method: 'GET', path: '/audit', kind: 'page', expect: { anonymous: 303, viewer: 403, member: 403, lead: 200, outsider: 403, admin: 200 } },
	{ name: 'audit page of the demo group', method: 'GET', path: '/audit?groupId=1', kind: 'page', expect: { anonymous: 303, viewer: 403, member: 403, lead: 200, outsider: 404, admin: 200 } },
	{ name: 'demo group matrix page', method: 'GET', path: '/groups/harbourlight/matrix', kind: 'page', expect: demoGroup(200) },
	{ name: 'other group matrix page', method: 'GET', path: '/groups/quillon/matrix', kind: 'page', expect: { anonymous: 303, viewer: 404, member: 404, lead: 404, outsider: 200, admin: 200 } },
	{ name: 'plans page, filters', method: 'GET', path: '/plans?state=approved&lamp=1&substrate=2', kind: 'page', expect: all(303, 200) },
	{ name: 'approve unknown plan form', method: 'POST', path: '/plans/999999?/approve', kind: 'action', form: {}, expect: all(303, 404) },
	{ name: 'return unknown plan form', method: 'POST', path: '/plans/999999?/return', kind: 'action', form: { comment: 'x' }, expect: all(303, 404) },
	{ name: 'comment on unknown plan form', method: 'POST', path: '/plans/999999?/comment', kind: 'action', form: { body: 'x' }, expect: all(303, 404) },
	{ name: 'recompute unknown plan form', method: 'POST', path: '/plans/999999?/recompute', kind: 'action', form: {}, expect: all(303, 404) },
	{ name: 'save recomputation of unknown plan form', method: 'POST', path: '/plans/999999?/saveRecompute', kind: 'action', form: { version: '1' }, expect: all(303, 404) },
	{ name: 'change decision of unknown plan form', method: 'POST', path: '/plans/999999?/decision', kind: 'action', form: { version: '1' }, expect: all(303, 404) },
	// ---- reactions: measured quantum yields ----
	{ name: 'quantum yield, empty body', method: 'POST', path: '/api/quantum-yield', kind: 'api', json: {}, expect: all(401, 400) },
	{ name: 'quantum-yield page', method: 'GET', path: '/library/quantum-yield', kind: 'page', expect: all(303, 200) },
	// ---- jcamp: several spectra as one JCAMP-DX LINK file ----
	{ name: 'spectra LINK export', method: 'GET', path: '/api/spectra/export?ids=1&format=jcamp', kind: 'api', expect: demoGroupApi(200) },
	// ---- csv: a wall material from an uploaded n, k table ----
	{ name: 'add material from n, k, JSON body', method: 'POST', path: '/api/materials/optical-constants', kind: 'api', json: {}, expect: { anonymous: 401, viewer: 403, member: 415, lead: 415, outsider: 415, admin: 415 } }
];
