/**
 * Database outages, timeouts and pool exhaustion, told apart from bugs: every such error becomes
 * a 503 with Retry-After (pages and API alike, see src/hooks.server.ts) instead of a 500.
 */

/** mysql2 / knex / MariaDB error codes and numbers that mean "the database is not answering now". */
const OUTAGE_CODES = new Set([
	'ECONNREFUSED',
	'ECONNRESET',
	'ETIMEDOUT',
	'EPIPE',
	'EHOSTUNREACH',
	'ENOTFOUND',
	'PROTOCOL_CONNECTION_LOST',
	'PROTOCOL_SEQUENCE_TIMEOUT',
	'ER_CON_COUNT_ERROR',
	'ER_SERVER_SHUTDOWN',
	'ER_LOCK_WAIT_TIMEOUT',
	'ER_QUERY_INTERRUPTED',
	'ER_STATEMENT_TIMEOUT',
	'ER_TOO_MANY_USER_CONNECTIONS',
	'ER_CONNECTION_KILLED'
]);
/** MariaDB error numbers: 1969 max_statement_time exceeded, 1040 too many connections, 1053 shutdown, 1205 lock wait, 1317 interrupted, 1927 connection killed, 2002/2003/2006/2013 client lost the server. */
const OUTAGE_ERRNOS = new Set([1969, 1040, 1053, 1205, 1317, 1927, 2002, 2003, 2006, 2013]);

export function isDatabaseOutage(e: unknown): boolean {
	for (let err = e as { code?: string; errno?: number; name?: string; message?: string; cause?: unknown } | undefined, depth = 0; err && depth < 4; err = err.cause as typeof err, depth++) {
		if (typeof err !== 'object') return false;
		if (err.name === 'KnexTimeoutError') return true; // pool exhausted or connection not acquired in time
		if (err.code && OUTAGE_CODES.has(err.code)) return true;
		if (typeof err.errno === 'number' && OUTAGE_ERRNOS.has(err.errno)) return true;
		if (typeof err.message === 'string' && /Timeout acquiring a connection|Connection lost|max_statement_time|Query execution was interrupted/i.test(err.message)) return true;
	}
	return false;
}

/** Seconds a client should wait before trying again (RETRY_AFTER_S, default 5). */
export const retryAfterSeconds = () => {
	const n = Number(process.env.RETRY_AFTER_S ?? 5);
	return Number.isFinite(n) && n > 0 ? Math.round(n) : 5;
};

export const OUTAGE_MESSAGE = 'The database is not answering at the moment. Nothing was changed; please try again in a few seconds.';
