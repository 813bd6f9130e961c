import type { Knex } from 'knex';

// API keys: only the SHA-256 of the secret is stored, with a display prefix.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('api_keys', (t) => {
    t.string('id', 40).primary();
    t.string('name', 200).notNullable();
    t.string('prefix', 20).notNullable();
    t.string('secret_hash', 64).notNullable().unique();
    t.text('scopes_json').notNullable();
    t.text('instrument_ids_json').nullable(); // null = every instrument
    t.string('created_by', 40).notNullable().references('id').inTable('users');
    t.string('created_at', 30).notNullable();
    t.string('expires_at', 30).nullable();
    t.string('revoked_at', 30).nullable();
    t.string('last_used_at', 30).nullable();
    t.string('replaced_by', 40).nullable();
    t.index(['created_by']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('api_keys');
}
