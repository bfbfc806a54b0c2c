/** The revision history of a spectrum as the API and the detail page show it. */
import { listRevisions } from '../db/spectrumRevisions';

/** Revisions newest first: `{ version, action, userName, changes, createdAt }`. */
export async function revisionsOf(spectrumId: number) {
	const rows = await listRevisions(spectrumId);
	return rows.map((r) => ({
		version: r.version,
		action: r.action,
		userName: r.user_name ?? null,
		changes: r.changes ? (JSON.parse(r.changes) as Record<string, { from: unknown; to: unknown }>) : null,
		createdAt: new Date(r.created_at).toISOString()
	}));
}
