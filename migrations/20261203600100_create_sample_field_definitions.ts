import type { Knex } from 'knex';

// The lab's own words for the custom identification fields of samples (`furnace` → "Furnace"),
// in the order the console lists them.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sample_field_definitions', (t) => {
    t.string('key', 60).primary();
    t.string('label', 100).notNullable();
    t.text('description').nullable();
    t.integer('position').notNullable();
    t.string('updated_at', 30).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sample_field_definitions');
}
