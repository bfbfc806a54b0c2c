import type { Knex } from 'knex';

/** Users: lucia's user table plus our profile fields. `site_role` is 'admin' or 'user'. */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('users', (t) => {
		t.string('id', 40).primary();
		t.string('email', 254).notNullable().unique();
		t.string('name', 120).notNullable();
		t.string('password_hash', 255).notNullable();
		t.boolean('email_verified').notNullable().defaultTo(false);
		t.enu('site_role', ['admin', 'user']).notNullable().defaultTo('user');
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('users');
}
