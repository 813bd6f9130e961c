import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('instruments', (t) => {
    t.string('id', 40).primary();
    t.string('code', 40).notNullable().unique();
    t.string('name', 200).notNullable();
    t.string('site', 200).notNullable();
    t.string('created_at', 30).notNullable();
    t.string('updated_at', 30).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('instruments');
}
