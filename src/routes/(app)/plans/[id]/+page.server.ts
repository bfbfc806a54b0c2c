import { fail } from '@sveltejs/kit';
import { DEFAULT_WINDOW_THRESHOLDS } from '$lib/irradiation/window';
import { asPage, pageUser } from '$lib/server/auth/guard';
import { listLamps } from '$lib/server/db/lamps';
import { listPlanComments } from '$lib/server/db/planComments';
import { listPlanRevisions } from '$lib/server/db/planRevisions';
import { listSolvents } from '$lib/server/db/solvents';
import { listWallMaterials } from '$lib/server/db/wallMaterials';
import { ApiError } from '$lib/server/http';
import { mailContext } from '$lib/server/services/planHttp';
import { recomputePlan } from '$lib/server/services/planRecompute';
import { commentOnPlan, reviewPlan, submitPlan } from '$lib/server/services/planReview';
import { isReviewerRole, patchPlan, planToApi, roleInPlanGroup, visiblePlan } from '$lib/server/services/plans';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = pageUser(event);
	const plan = await asPage(event, () => visiblePlan(event.locals, event.params.id));
	const role = await roleInPlanGroup(event.locals, plan);
	const isAuthor = plan.ownerId === user.id;
	const [comments, revisions, lamps, materials, solvents] = await Promise.all([
		listPlanComments(plan.id),
		listPlanRevisions(plan.id),
		listLamps([plan.groupId]),
		listWallMaterials([plan.groupId]),
		listSolvents()
	]);
	return {
		plan: planToApi(plan),
		comments: comments.map((c) => ({ id: c.id, kind: c.kind, body: c.body, authorName: c.authorName, authorId: c.authorId, createdAt: c.createdAt })),
		revisions: revisions.map((r) => ({ revision: r.revision, reason: r.reason, state: r.state, createdByName: r.createdByName, createdAt: r.createdAt, changes: r.changes })),
		isAuthor,
		canEdit: isAuthor && (plan.state === 'draft' || plan.state === 'returned') && role !== 'viewer',
		canReview: isReviewerRole(role) && (!isAuthor || role === 'admin'),
		isReviewerRole: isReviewerRole(role),
		canComment: isAuthor || isReviewerRole(role),
		canRecompute: isAuthor || isReviewerRole(role),
		choices: {
			lamps: lamps.map((l) => ({ id: l.id, name: l.name })),
			materials: materials.map((m) => ({ id: m.id, name: m.name })),
			solvents: solvents.map((s) => ({ id: s.id, name: s.name, cutoffNm: s.cutoffNm }))
		},
		defaultThresholds: { ...DEFAULT_WINDOW_THRESHOLDS }
	};
};

type Form = Record<string, string>;

/** Runs a service call for an action: bad input and refusals come back as `fail(status, { action, message, field })`. */
async function act(event: Parameters<Actions[string]>[0], action: string, fn: (form: Form) => Promise<unknown>) {
	pageUser(event);
	const form = Object.fromEntries([...(await event.request.formData()).entries()].map(([k, v]) => [k, String(v)])) as Form;
	try {
		const out = (await fn(form)) as { changes?: unknown; saved?: boolean } | null;
		return { action, done: true, ...(out && typeof out === 'object' && 'changes' in out ? { changes: out.changes, saved: out.saved } : {}) };
	} catch (e) {
		if (e instanceof ApiError) return fail(e.status, { action, message: e.message, field: e.extra.field ?? null });
		throw e;
	}
}

const version = (f: Form) => (f.version && /^\d+$/.test(f.version) ? Number(f.version) : undefined);
/** An optional number field: '' = cleared (null); anything unreadable stays as text so the schema names the field. */
const optNumber = (v: string | undefined) => (v === undefined ? undefined : v.trim() === '' ? null : Number.isFinite(Number(v)) ? Number(v) : (v as unknown as number));

export const actions: Actions = {
	submit: (e) => act(e, 'submit', (f) => submitPlan(e.locals, e.params.id, { version: version(f), comment: f.comment || undefined }, mailContext(e.url))),
	approve: (e) => act(e, 'review', (f) => reviewPlan(e.locals, e.params.id, { version: version(f), comment: f.comment || undefined }, 'approved', mailContext(e.url))),
	return: (e) => act(e, 'review', (f) => reviewPlan(e.locals, e.params.id, { version: version(f), comment: f.comment || undefined }, 'returned', mailContext(e.url))),
	comment: (e) => act(e, 'comment', (f) => commentOnPlan(e.locals, e.params.id, { body: f.body ?? '' }, mailContext(e.url))),
	recompute: (e) => act(e, 'recompute', () => recomputePlan(e.locals, e.params.id, {})),
	saveRecompute: (e) => act(e, 'recompute', (f) => recomputePlan(e.locals, e.params.id, { save: true, version: version(f) })),
	decision: (e) =>
		act(e, 'decision', (f) => {
			const minutes = optNumber(f.irradiationTimeMin);
			return patchPlan(e.locals, e.params.id, {
				version: version(f),
				...(f.title !== undefined ? { title: f.title } : {}),
				decision: {
					lampId: optNumber(f.lampId) ?? undefined,
					wall: { materialId: optNumber(f.materialId), thicknessMm: optNumber(f.thicknessMm) },
					solventId: optNumber(f.solventId) ?? undefined,
					pathCm: optNumber(f.pathCm) ?? undefined,
					irradiationTimeS: typeof minutes === 'number' ? minutes * 60 : minutes,
					temperatureC: optNumber(f.temperatureC),
					safetyMeasures: f.safetyMeasures ?? null,
					notes: f.notes ?? null
				}
			});
		})
};
