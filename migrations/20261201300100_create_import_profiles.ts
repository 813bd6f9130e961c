import type { Knex } from 'knex';

// Import profiles: how to read one family of result files. The layout is one JSON document
// (validated by the API before it is stored); the name is unique ignoring case (name_key).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('import_profiles', (t) => {
    t.string('id', 40).primary();
    t.string('name', 100).notNullable();
    t.string('name_key', 100).notNullable().unique();
    t.text('description').nullable();
    t.text('definition_json').notNullable();
    t.integer('revision').notNullable();
    t.string('created_by', 40).nullable().references('id').inTable('users');
    t.string('created_at', 30).notNullable();
    t.string('updated_at', 30).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('import_profiles');
}
