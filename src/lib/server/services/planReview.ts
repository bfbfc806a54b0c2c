/**
 * Review of a plan: submit (the author) mails the group's leads; approve / return (another lead of the group, or an
 * admin) mail the author; comments form a thread the author and reviewers write in. Every transition and comment is
 * written to audit_log in the same transaction as the change; mail goes out after the commit (a mail failure is
 * logged and never undoes the change).
 */
import { planCommentSchema, planReviewSchema } from '$lib/schemas/plans';
import { db } from '$lib/server/db';
import { audit } from '$lib/server/db/audit';
import { findGroupById, membersOf } from '$lib/server/db/groups';
import { insertPlanComment, listPlanComments, type PlanCommentKind } from '$lib/server/db/planComments';
import { insertPlanRevision } from '$lib/server/db/planRevisions';
import { findPlan, updatePlanIfVersion, type PlanRow, type PlanState } from '$lib/server/db/plans';
import { findUserById } from '$lib/server/db/users';
import { ApiError, forbidden, zodToApiError } from '$lib/server/http';
import { planCommentMail, planReviewedMail, planSubmittedMail } from '$lib/server/mail/planMessages';
import { sendMail } from '$lib/server/mail/send';
import { expectState, expectVersion, isReviewerRole, roleInPlanGroup, staleVersion, visiblePlan } from './plans';

/** Where links in mail point (PUBLIC_ORIGIN / ORIGIN / the request origin, see mail/send.ts linkBase). */
export interface MailContext {
	origin: string;
}

const planLink = (ctx: MailContext, id: number) => `${ctx.origin}/plans/${id}`;

/** The addresses of the group's leads other than `exceptUserId`; site admins when the group has no other lead. */
async function reviewerAddresses(groupId: number, exceptUserId: string): Promise<string[]> {
	const leads = (await membersOf(groupId)).filter((m) => m.role === 'lead' && m.userId !== exceptUserId).map((m) => m.email);
	if (leads.length) return leads;
	const admins = await db()('users').where({ site_role: 'admin' }).whereNot({ id: exceptUserId }).select('email');
	return admins.map((a: { email: string }) => a.email);
}

/** One transition with its audit entry and (optional) thread entry, guarded by version and state in SQL. */
async function transition(plan: PlanRow, actorId: string, to: PlanState, from: PlanState[], extra: { comment?: string | null; reviewer?: boolean }) {
	await db().transaction(async (trx) => {
		const now = new Date();
		const n = await updatePlanIfVersion(
			plan.id,
			plan.version,
			{
				state: to,
				...(to === 'submitted' ? { submittedAt: now, reviewerId: null, reviewedAt: null } : {}),
				...(extra.reviewer ? { reviewerId: actorId, reviewComment: extra.comment ?? null, reviewedAt: now } : {})
			},
			trx,
			from
		);
		if (!n) throw staleVersion();
		if (extra.comment || to !== 'submitted') {
			const kind: PlanCommentKind = to === 'submitted' ? 'submitted' : to === 'approved' ? 'approved' : 'returned';
			await insertPlanComment({ planId: plan.id, authorId: actorId, kind, body: extra.comment || (to === 'approved' ? 'Approved.' : ''), planVersion: plan.version + 1 }, trx);
		}
		if (to === 'approved') {
			await insertPlanRevision({ planId: plan.id, reason: 'approved', state: 'approved', inputs: plan.inputs, decision: plan.decision, results: plan.results, createdBy: actorId }, trx);
		}
		await audit({ actorId, action: `plan.${to === 'submitted' ? 'submit' : to === 'approved' ? 'approve' : 'return'}`, target: `plan:${plan.id}`, groupId: plan.groupId, details: { from: plan.state, to, version: plan.version + 1, ...(extra.comment ? { comment: extra.comment } : {}) } }, trx);
	});
	return (await findPlan(plan.id))!;
}

/** Submits for review (the author, while draft or returned); mails the group's leads. */
export async function submitPlan(locals: App.Locals, idParam: string | undefined, body: unknown, ctx: MailContext): Promise<PlanRow> {
	const plan = await visiblePlan(locals, idParam);
	const user = locals.user!;
	if (plan.ownerId !== user.id) throw forbidden('Only the plan’s author may submit it.');
	expectState(plan, ['draft', 'returned'], 'submitted');
	const parsed = planReviewSchema.safeParse(body ?? {});
	if (!parsed.success) throw zodToApiError(parsed.error);
	expectVersion(plan, parsed.data.version);
	if (!plan.decision || !plan.lampId) throw new ApiError(400, 'invalid', 'decision.lampId: choose the lamp before submitting.', { field: 'decision.lampId' });
	const done = await transition(plan, user.id, 'submitted', ['draft', 'returned'], { comment: parsed.data.comment });
	const group = await findGroupById(plan.groupId);
	const mail = planSubmittedMail({ title: plan.title, author: user.name, groupName: group?.name ?? 'your group', lamp: plan.lampName, link: planLink(ctx, plan.id), comment: parsed.data.comment });
	for (const to of await reviewerAddresses(plan.groupId, user.id)) await sendMail(to, mail);
	return done;
}

/**
 * Approves or returns a submitted plan: a lead of its group or a site admin, never its author (a lead who wrote the
 * plan needs another lead or an admin). Returning needs a comment. Mails the author.
 */
export async function reviewPlan(locals: App.Locals, idParam: string | undefined, body: unknown, verdict: 'approved' | 'returned', ctx: MailContext): Promise<PlanRow> {
	const plan = await visiblePlan(locals, idParam);
	const user = locals.user!;
	const role = await roleInPlanGroup(locals, plan);
	if (!isReviewerRole(role)) throw forbidden('Only a lead of the group (or an admin) reviews plans.');
	if (plan.ownerId === user.id && role !== 'admin') throw forbidden(`You wrote this plan, so you cannot ${verdict === 'approved' ? 'approve' : 'return'} it: another lead of the group or an admin must.`);
	expectState(plan, ['submitted'], verdict);
	const parsed = planReviewSchema.safeParse(body ?? {});
	if (!parsed.success) throw zodToApiError(parsed.error);
	expectVersion(plan, parsed.data.version);
	if (verdict === 'returned' && !parsed.data.comment) throw new ApiError(400, 'invalid', 'comment: say what to change when returning a plan.', { field: 'comment' });
	const done = await transition(plan, user.id, verdict, ['submitted'], { comment: parsed.data.comment ?? null, reviewer: true });
	const author = plan.ownerId ? await findUserById(plan.ownerId) : null;
	if (author) await sendMail(author.email, planReviewedMail({ title: plan.title, reviewer: user.name, verdict, comment: parsed.data.comment ?? null, link: planLink(ctx, plan.id) }));
	return done;
}

/** Adds a comment to the plan's thread (its author, a lead of the group, an admin); mails the other side. */
export async function commentOnPlan(locals: App.Locals, idParam: string | undefined, body: unknown, ctx: MailContext) {
	const plan = await visiblePlan(locals, idParam);
	const user = locals.user!;
	const role = await roleInPlanGroup(locals, plan);
	const isAuthor = plan.ownerId === user.id;
	if (!isAuthor && !isReviewerRole(role)) throw forbidden('Only the plan’s author and the group’s leads write in its review thread.');
	const parsed = planCommentSchema.safeParse(body ?? {});
	if (!parsed.success) throw zodToApiError(parsed.error);
	const id = await db().transaction(async (trx) => {
		const id = await insertPlanComment({ planId: plan.id, authorId: user.id, kind: 'comment', body: parsed.data.body, planVersion: plan.version }, trx);
		await audit({ actorId: user.id, action: 'plan.comment', target: `plan:${plan.id}`, groupId: plan.groupId, details: { commentId: id, body: parsed.data.body.slice(0, 500) } }, trx);
		return id;
	});
	const mail = planCommentMail({ title: plan.title, author: user.name, body: parsed.data.body, link: planLink(ctx, plan.id) });
	let recipients: string[] = [];
	if (!isAuthor && plan.ownerId) {
		const author = await findUserById(plan.ownerId);
		if (author) recipients = [author.email];
	} else if (plan.reviewerId && plan.reviewerId !== user.id) {
		const reviewer = await findUserById(plan.reviewerId);
		if (reviewer) recipients = [reviewer.email];
	} else {
		recipients = await reviewerAddresses(plan.groupId, user.id);
	}
	for (const to of recipients) await sendMail(to, mail);
	return (await listPlanComments(plan.id)).find((c) => c.id === id)!;
}

/** The plan's thread, oldest first (anyone who may see the plan). */
export async function planThread(locals: App.Locals, idParam: string | undefined) {
	const plan = await visiblePlan(locals, idParam);
	return listPlanComments(plan.id);
}
