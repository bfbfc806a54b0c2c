/**
 * Talks to the real private MariaDB through knex (no mocks): the connection, the migrations that
 * `npm test` applied to the test database, and the column types the house style requires.
 */
import { afterAll, describe, expect, it } from 'vitest';
import knexFactory from 'knex';
import { knexConfig } from '../../knexfile';

const knex = knexFactory(knexConfig(process.env));
afterAll(() => knex.destroy());

describe('MariaDB through knex', () => {
	it('answers on the test database', async () => {
		const [rows] = await knex.raw('SELECT DATABASE() AS db, VERSION() AS version');
		expect(rows[0].db).toBe(process.env.DB_NAME ?? 'windowsill');
		// MariaDB identifies itself in VERSION() (e.g. "10.11.x-MariaDB-…")
		expect(String(rows[0].version)).toMatch(/MariaDB/i);
	});

	it('has run the migrations (users, sessions, groups, memberships)', async () => {
		for (const table of ['users', 'sessions', 'groups', 'memberships']) {
			expect(await knex.schema.hasTable(table)).toBe(true);
		}
		const [done] = await knex('knex_migrations').count({ n: '*' });
		expect(Number(done.n)).toBeGreaterThanOrEqual(3);
	});

	it('round-trips a row inside a transaction that is rolled back (writes nothing)', async () => {
		const before = await knex('groups').count({ n: '*' });
		await knex
			.transaction(async (trx) => {
				await trx('groups').insert({ name: 'Scratch group (rolled back)', slug: 'scratch-rolled-back' });
				const got = await trx('groups').where({ slug: 'scratch-rolled-back' }).first();
				expect(got.name).toBe('Scratch group (rolled back)');
				throw new Error('roll back');
			})
			.catch((e: Error) => expect(e.message).toBe('roll back'));
		const after = await knex('groups').count({ n: '*' });
		expect(after[0].n).toEqual(before[0].n);
	});

	it('stores measurements as DOUBLE, never DECIMAL', async () => {
		const [cols] = await knex.raw(
			`SELECT TABLE_NAME, COLUMN_NAME FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND DATA_TYPE = 'decimal'`
		);
		expect(cols).toEqual([]);
	});
});
