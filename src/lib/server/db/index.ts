import knexFactory, { type Knex } from 'knex';
import { knexConfig } from '../../../../knexfile';

let instance: Knex | null = null;

/**
 * Per-statement time limit of the app's connections in seconds (MariaDB `max_statement_time`,
 * env DB_STATEMENT_TIMEOUT_S, default 15; 0 turns it off). A frozen or overloaded database then
 * answers within that time and the request gets a 503 instead of hanging. Migrations, seeds and
 * benchmarks use knexfile.ts directly and are not limited.
 */
export function statementTimeoutSeconds(env: Record<string, string | undefined> = process.env): number {
	const n = Number(env.DB_STATEMENT_TIMEOUT_S ?? 15);
	return Number.isFinite(n) && n >= 0 ? n : 15;
}

/** The app's knex configuration: knexfile.ts plus the statement time limit on every new connection. */
export function appKnexConfig(env: Record<string, string | undefined> = process.env): Knex.Config {
	const base = knexConfig(env);
	const limit = statementTimeoutSeconds(env);
	return {
		...base,
		pool: {
			...(base.pool ?? {}),
			afterCreate(conn: { query: (sql: string, cb: (err: unknown) => void) => void }, done: (err: unknown, conn: unknown) => void) {
				if (!limit) return done(null, conn);
				conn.query(`SET SESSION max_statement_time = ${limit}`, (err) => done(err, conn));
			}
		}
	};
}

/** The app's one knex instance (pool min 0: reconnects by itself after a MariaDB restart). */
export function db(): Knex {
	instance ??= knexFactory(appKnexConfig(process.env));
	return instance;
}

/** Destroys the pool so the process can exit (SIGTERM, tests). */
export async function closeDb(): Promise<void> {
	const k = instance;
	instance = null;
	if (k) await k.destroy();
}
