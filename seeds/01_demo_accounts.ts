/**
 * Demo accounts and groups (invented scenario, demo only). Idempotent: re-running adds what is
 * missing and changes nothing else. Production mode (NODE_ENV=production without
 * WINDOWSILL_DEMO=1) seeds nothing. Password: DEMO_PASSWORD, default "sunlit-bench-demo".
 */
import type { Knex } from 'knex';
import { hashPassword } from '../src/lib/server/auth/password';

type Role = 'lead' | 'member' | 'viewer';

export const DEMO_GROUPS = [
	{ slug: 'harbourlight', name: 'Harbourlight Photochemistry Group', description: 'Demo group: visible-light photoredox and [2+2] photocycloadditions in batch and flow.' },
	{ slug: 'quillon', name: 'Quillon Materials Lab', description: 'Demo group: photo-curable coatings; unrelated to Harbourlight.' }
] as const;

export const DEMO_USERS: { id: string; email: string; name: string; siteRole: 'admin' | 'user'; group?: { slug: string; role: Role } }[] = [
	{ id: 'demo-admin', email: 'admin@windowsill.test', name: 'Site Admin (demo)', siteRole: 'admin' },
	{ id: 'demo-lead', email: 'lead@windowsill.test', name: 'Dr. Ilse Marwick', siteRole: 'user', group: { slug: 'harbourlight', role: 'lead' } },
	// A second lead of the demo group: reviews plans the first lead wrote (nobody approves their own plan).
	{ id: 'demo-lead2', email: 'lead2@windowsill.test', name: 'Dr. Maelis Orrin', siteRole: 'user', group: { slug: 'harbourlight', role: 'lead' } },
	{ id: 'demo-member', email: 'member@windowsill.test', name: 'Tomasz Ferrante', siteRole: 'user', group: { slug: 'harbourlight', role: 'member' } },
	{ id: 'demo-viewer', email: 'viewer@windowsill.test', name: 'Ana Quibell', siteRole: 'user', group: { slug: 'harbourlight', role: 'viewer' } },
	{ id: 'demo-outsider', email: 'outsider@windowsill.test', name: 'Rafe Oyelaran', siteRole: 'user', group: { slug: 'quillon', role: 'member' } }
];

export async function seed(knex: Knex): Promise<void> {
	if (process.env.NODE_ENV === 'production' && process.env.WINDOWSILL_DEMO !== '1') {
		console.log('[seed] production mode: no demo accounts');
		return;
	}
	const password = process.env.DEMO_PASSWORD ?? 'sunlit-bench-demo';
	await knex.transaction(async (trx) => {
		for (const u of DEMO_USERS) {
			if (await trx('users').where({ email: u.email }).first('id')) continue;
			await trx('users').insert({ id: u.id, email: u.email, name: u.name, password_hash: await hashPassword(password), email_verified: true, site_role: u.siteRole });
		}
		const lead = await trx('users').where({ email: 'lead@windowsill.test' }).first('id');
		const outsider = await trx('users').where({ email: 'outsider@windowsill.test' }).first('id');
		for (const g of DEMO_GROUPS) {
			if (await trx('groups').where({ slug: g.slug }).first('id')) continue;
			await trx('groups').insert({ ...g, created_by: g.slug === 'quillon' ? outsider?.id : lead?.id });
		}
		for (const u of DEMO_USERS) {
			if (!u.group) continue;
			const [user, group] = await Promise.all([trx('users').where({ email: u.email }).first('id'), trx('groups').where({ slug: u.group.slug }).first('id')]);
			await trx('memberships').insert({ group_id: group.id, user_id: user.id, role: u.group.role }).onConflict(['group_id', 'user_id']).ignore();
		}
	});
}
