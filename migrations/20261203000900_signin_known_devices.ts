import type { Knex } from 'knex';

/**
 * Sign-in throttling that does not lock the owner out: `auth_throttle.last_hit_at` for the backoff,
 * and `known_signins` — the browsers (a long-lived random cookie, stored hashed) and addresses an
 * account has signed in from successfully. Failed attempts from a known browser or address count on
 * their own counter, so strangers' failures never lock the owner out.
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.alterTable('auth_throttle', (t) => {
		t.datetime('last_hit_at').nullable();
	});
	await knex.schema.createTable('known_signins', (t) => {
		t.bigIncrements('id').primary();
		t.string('user_id', 64).notNullable().references('id').inTable('users').onDelete('CASCADE');
		/** 'device' (hash of the browser's cookie) or 'address' (hash of the client address). */
		t.enum('kind', ['device', 'address']).notNullable();
		t.string('key_hash', 64).notNullable();
		t.datetime('first_seen_at').notNullable();
		t.datetime('last_seen_at').notNullable();
		t.unique(['user_id', 'kind', 'key_hash']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('known_signins');
	await knex.schema.alterTable('auth_throttle', (t) => {
		t.dropColumn('last_hit_at');
	});
}
