/**
 * `npm run db:backup` / `npm run db:restore FILE`: a dump of the test database restored into a
 * scratch database has the same tables, row counts and table checksums (MariaDB CHECKSUM TABLE),
 * including the large BLOB rows of spectra (client and server max_allowed_packet match).
 */
import { afterAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import knexFactory from 'knex';
import { knexConfig } from '../../knexfile';

const source = process.env.DB_NAME ?? 'windowsill_test';
const scratch = `${source.startsWith('windowsill_test') ? source : 'windowsill_test'}_restorecheck`.slice(0, 64);
const dir = mkdtempSync(join(tmpdir(), 'windowsill-backup-'));
const file = join(dir, 'dump.sql.gz');
const k = (database: string) => knexFactory({ ...knexConfig({ ...process.env, DB_NAME: database }), pool: { min: 0, max: 2 } });
const run = (args: string[], env: Record<string, string>) => execFileSync('bash', ['scripts/db.sh', ...args], { env: { ...process.env, ...env }, stdio: 'pipe', timeout: 120_000 }).toString();

async function fingerprint(database: string) {
	const conn = k(database);
	try {
		const [tables] = await conn.raw('SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? AND table_type = "BASE TABLE" ORDER BY table_name', [database]);
		const out: Record<string, { rows: number; checksum: string }> = {};
		for (const { t } of tables as { t: string }[]) {
			const [[c]] = await conn.raw('SELECT COUNT(*) AS n FROM ??', [t]);
			const [[s]] = await conn.raw('CHECKSUM TABLE ??', [t]);
			out[t] = { rows: Number(c.n), checksum: String(s.Checksum) };
		}
		return out;
	} finally {
		await conn.destroy();
	}
}

afterAll(async () => {
	const conn = k(source);
	await conn.raw('DROP DATABASE IF EXISTS ??', [scratch]).catch(() => {});
	await conn.destroy();
	rmSync(dir, { recursive: true, force: true });
});

describe('backup and restore', () => {
	it('dumps with --single-transaction and restores into a scratch database, same counts and checksums', async () => {
		run(['backup', file], { DB_NAME: source });
		expect(existsSync(file)).toBe(true);
		expect(statSync(file).size).toBeGreaterThan(1000);
		run(['restore', file, '--yes'], { DB_NAME: scratch });
		const [a, b] = await Promise.all([fingerprint(source), fingerprint(scratch)]);
		expect(Object.keys(b)).toEqual(Object.keys(a));
		expect(a.spectra?.rows ?? 0).toBeGreaterThan(0);
		expect(b).toEqual(a);
	}, 180_000);

	it('restore and reset refuse to run without confirmation when there is no terminal', () => {
		expect(() => run(['restore', file], { DB_NAME: scratch, DB_RESET_YES: '' })).toThrow(/confirmation|--yes/);
		// Pointed at an empty scratch data directory, so even a broken confirmation could not wipe anything real.
		expect(() => run(['reset'], { DB_RESET_YES: '', WINDOWSILL_DATA_DIR: join(dir, 'no-such-data'), DB_PORT: '1' })).toThrow(/confirmation|--yes/);
	});
});
