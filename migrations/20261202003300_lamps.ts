import type { Knex } from 'knex';

/**
 * The group's lamps: an emission model (JSON: LED, mercury, laser, blackbody, … or a measured spectrum id),
 * optical power (W), a coupling factor (fraction of the power that reaches the vessel) and free notes.
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('lamps', (t) => {
		t.increments('id').primary();
		t.integer('group_id').unsigned().notNullable().references('id').inTable('groups').onDelete('CASCADE');
		t.string('owner_id', 40).references('id').inTable('users').onDelete('SET NULL');
		t.string('name', 160).notNullable();
		t.json('model').notNullable();
		t.double('power_w').notNullable();
		t.double('coupling_factor').notNullable().defaultTo(1);
		t.string('distance_note', 255);
		t.text('notes');
		t.integer('version').notNullable().defaultTo(1);
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
		t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
		t.unique(['group_id', 'name']);
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('lamps');
}
