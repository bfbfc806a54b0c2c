import type { Knex } from 'knex';

/**
 * Reactor wall materials. `model` holds the optical model as JSON: tabulated k(λ) with n, a measured transmission
 * curve at a stated thickness, or an approximate absorption edge. Reference rows have no group; a member may add
 * their group's own material from a measured transmission spectrum (`spectrum_id`, `group_id`, `created_by`).
 */
export async function up(knex: Knex): Promise<void> {
	await knex.schema.createTable('wall_materials', (t) => {
		t.increments('id').primary();
		t.string('slug', 80).notNullable().unique();
		t.string('name', 160).notNullable();
		t.string('family', 60);
		t.json('model').notNullable();
		t.double('refractive_index').notNullable();
		t.double('typical_thickness_mm');
		t.text('source').notNullable();
		t.string('status', 40).notNullable();
		t.text('notes');
		t.integer('group_id').unsigned().references('id').inTable('groups').onDelete('CASCADE');
		t.integer('spectrum_id').unsigned();
		t.string('created_by', 40).references('id').inTable('users').onDelete('SET NULL');
		t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
	});
}

export async function down(knex: Knex): Promise<void> {
	await knex.schema.dropTable('wall_materials');
}
