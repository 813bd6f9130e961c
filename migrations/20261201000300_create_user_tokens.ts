import type { Knex } from 'knex';

// One-time tokens for invitations and password resets; only their SHA-256 is stored.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('user_tokens', (t) => {
    t.string('id', 40).primary();
    t.string('user_id', 40).notNullable().references('id').inTable('users');
    t.string('purpose', 20).notNullable(); // invitation | password_reset
    t.string('token_hash', 64).notNullable().unique();
    t.string('created_at', 30).notNullable();
    t.string('expires_at', 30).notNullable();
    t.string('used_at', 30).nullable();
    t.index(['user_id', 'purpose']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('user_tokens');
}
