import type { Knex } from 'knex';

/** One plan per (author, idempotency key): a double-submitted save form inserts once (the unique index is the guard). */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.alterTable('plans', (t) => {
		t.string('idempotency_key', 36).nullable();
		t.unique(['owner_id', 'idempotency_key'], { indexName: 'plans_owner_idempotency_unique' });
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.alterTable('plans', (t) => {
		t.dropUnique(['owner_id', 'idempotency_key'], 'plans_owner_idempotency_unique');
		t.dropColumn('idempotency_key');
	});
}
