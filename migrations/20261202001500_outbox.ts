import type { Knex } from 'knex';

/** Messages received by the local fake SMTP server (development and tests only). */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('outbox', (t) => {
		t.increments('id').primary();
		t.string('mail_from', 254).notNullable().defaultTo('');
		t.text('mail_to').notNullable();
		t.string('subject', 255).notNullable().defaultTo('');
		t.text('body_text', 'mediumtext').notNullable();
		t.text('links').notNullable();
		t.timestamp('received_at').notNullable().defaultTo(knex.fn.now());
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('outbox');
}
