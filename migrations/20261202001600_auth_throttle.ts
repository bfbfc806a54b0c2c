import type { Knex } from 'knex';

/**
 * Throttle counters kept in MariaDB so several stateless app servers share them.
 * `bucket` is e.g. "signin-account:<email>", "signin-ip:<ip>", "reset-mail:<email>".
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('auth_throttle', (t) => {
		t.string('bucket', 300).primary();
		t.integer('hits').unsigned().notNullable().defaultTo(0);
		t.datetime('window_start').notNullable();
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('auth_throttle');
}
