import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.string('id', 40).primary();
    t.string('email', 320).notNullable();
    t.string('email_key', 320).notNullable().unique(); // lower-cased e-mail: uniqueness ignores case
    t.string('name', 200).notNullable();
    t.string('role', 20).notNullable();
    t.string('status', 20).notNullable(); // invited | active | disabled
    t.string('password_hash', 200).nullable();
    t.string('created_at', 30).notNullable();
    t.string('updated_at', 30).notNullable();
    t.string('last_login_at', 30).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users');
}
