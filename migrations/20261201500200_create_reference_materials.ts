import type { Knex } from 'knex';

// Reference materials for standardization: certified (nominal) values per element, in %, kept
// exactly as decimal strings in values_json together with the value and unit as given.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('reference_materials', (t) => {
    t.string('id', 40).primary();
    t.string('code', 60).notNullable();
    t.string('code_key', 60).notNullable().unique();
    t.string('name', 200).notNullable();
    t.string('matrix', 3).notNullable();
    t.string('kind', 20).notNullable(); // high | low | type | control
    t.text('values_json').notNullable();
    t.string('certificate', 500).nullable();
    t.string('created_by_label', 320).notNullable();
    t.string('created_at', 30).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('reference_materials');
}
