/**
 * Knex configuration for Windowsill (MariaDB through mysql2).
 *
 * Connection from the environment: DB_HOST [127.0.0.1], DB_PORT [3307], DB_USER [windowsill],
 * DB_PASSWORD [windowsill-dev], DB_NAME [windowsill]. `npm test` sets DB_NAME to the test
 * database. Pool: min 0 so a MariaDB restart is survived without restarting the app,
 * keep-alive on the sockets, and a short acquire timeout so a dead database answers fast.
 */
import type { Knex } from 'knex';

export function connectionFromEnv(env: Record<string, string | undefined> = process.env) {
	return {
		host: env.DB_HOST ?? '127.0.0.1',
		port: Number(env.DB_PORT ?? 3307),
		user: env.DB_USER ?? 'windowsill',
		password: env.DB_PASSWORD ?? 'windowsill-dev',
		database: env.DB_NAME ?? 'windowsill',
		charset: 'utf8mb4',
		timezone: 'Z',
		enableKeepAlive: true,
		keepAliveInitialDelay: 10_000,
		connectTimeout: 3_000,
		// DOUBLE columns come back as numbers; BLOBs as Buffers.
		supportBigNumbers: true,
		bigNumberStrings: false,
		dateStrings: false
	};
}

export function knexConfig(env: Record<string, string | undefined> = process.env): Knex.Config {
	return {
		client: 'mysql2',
		connection: connectionFromEnv(env),
		pool: { min: 0, max: Number(env.DB_POOL_MAX ?? 10), idleTimeoutMillis: 30_000 },
		acquireConnectionTimeout: 4_000,
		migrations: { directory: './migrations', extension: 'ts', tableName: 'knex_migrations', loadExtensions: ['.ts'] },
		seeds: { directory: './seeds', extension: 'ts', loadExtensions: ['.ts'] }
	};
}

const config: Knex.Config = knexConfig();
export default config;
