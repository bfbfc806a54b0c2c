import knexFactory, { type Knex } from 'knex';
import { knexConfig } from '../../../../knexfile';

let instance: Knex | null = null;

/** The app's one knex instance (pool min 0: reconnects by itself after a MariaDB restart). */
export function db(): Knex {
	instance ??= knexFactory(knexConfig(process.env));
	return instance;
}

/** Destroys the pool so the process can exit (SIGTERM, tests). */
export async function closeDb(): Promise<void> {
	const k = instance;
	instance = null;
	if (k) await k.destroy();
}
