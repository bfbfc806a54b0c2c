/** GET /api/audit and the audit page: a group's log for its leads, every group's for admins. */
import { z } from 'zod';
import { listAudit } from '$lib/server/db/audit';
import { ApiError, forbidden, zodToApiError } from '$lib/server/http';
import { membershipsOf, requireUser } from '$lib/server/policy';

export const auditQuerySchema = z.object({
	groupId: z.coerce.number({ error: 'groupId must be a group id' }).int('groupId must be a group id').positive('groupId must be a group id').optional(),
	limit: z.coerce.number({ error: 'limit must be a number' }).int('limit must be a whole number').min(1, 'limit must be at least 1').max(500, 'limit must be at most 500').optional(),
	before: z.coerce.number().int().positive().optional()
});

/**
 * Audit entries newest first. With `groupId`: that group's (its leads and admins; 404 when the caller is not in the
 * group, 403 below lead). Without: admins get everything, leads the groups they lead, anyone else 403.
 */
export async function auditFor(locals: App.Locals, raw: Record<string, string>) {
	const user = requireUser(locals);
	const parsed = auditQuerySchema.safeParse(Object.fromEntries(Object.entries(raw).filter(([, v]) => v !== '')));
	if (!parsed.success) throw zodToApiError(parsed.error);
	const { groupId, limit = 100, before } = parsed.data;
	const isAdmin = user.siteRole === 'admin';
	const led = (await membershipsOf(user.id)).filter((m) => m.role === 'lead').map((m) => m.groupId);
	let groupIds: number[] | null;
	if (groupId) {
		if (!isAdmin) {
			const m = (await membershipsOf(user.id)).find((x) => x.groupId === groupId);
			if (!m) throw new ApiError(404, 'not_found', 'No such group.');
			if (m.role !== 'lead') throw forbidden('The audit log is for the group’s leads.');
		}
		groupIds = [groupId];
	} else if (isAdmin) groupIds = null;
	else if (led.length) groupIds = led;
	else throw forbidden('The audit log is for group leads and admins.');
	return listAudit({ groupIds, limit, beforeId: before });
}

/** The JSON shape of an entry. */
export const auditToApi = (e: Awaited<ReturnType<typeof listAudit>>[number]) => ({
	id: e.id,
	action: e.action,
	actor: { id: e.actorId, name: e.actorName },
	target: e.target,
	groupId: e.groupId,
	groupName: e.groupName,
	details: e.details,
	createdAt: e.createdAt
});
