import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (t) => {
    t.string('id', 40).primary();
    t.string('user_id', 40).notNullable().references('id').inTable('users');
    t.string('created_at', 30).notNullable();
    t.string('last_seen_at', 30).notNullable();
    t.string('revoked_at', 30).nullable();
    t.string('ip', 64).nullable();
    t.string('user_agent', 300).nullable();
    t.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
