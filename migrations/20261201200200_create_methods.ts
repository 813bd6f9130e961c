import type { Knex } from 'knex';

// An analytical method for one base matrix; its per-element settings live in elements_json.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('methods', (t) => {
    t.string('id', 40).primary();
    t.string('code', 40).notNullable().unique();
    t.string('name', 200).notNullable();
    t.string('matrix', 3).notNullable();
    t.string('default_unit', 10).notNullable();
    t.text('elements_json').notNullable();
    t.string('created_at', 30).notNullable();
    t.string('updated_at', 30).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('methods');
}
