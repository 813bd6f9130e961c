import type { Knex } from 'knex';

// Idempotency-Key records: one per caller and key, holding the first response for 24 hours so a
// retried write is answered from here instead of being done twice.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('idempotency_keys', (t) => {
    t.string('caller', 60).notNullable(); // "key:<api key id>" or "user:<user id>"
    t.string('idempotency_key', 255).notNullable();
    t.string('fingerprint', 64).notNullable(); // SHA-256 of method, path and body
    t.string('method', 10).notNullable();
    t.string('path', 2000).notNullable();
    t.string('state', 20).notNullable(); // in_flight | done
    t.integer('status').nullable();
    t.text('response_headers_json').nullable();
    t.text('response_body_base64').nullable();
    t.boolean('body_withheld').notNullable().defaultTo(false);
    t.string('created_at', 30).notNullable();
    t.string('locked_at', 30).notNullable();
    t.string('expires_at', 30).notNullable();
    t.primary(['caller', 'idempotency_key']);
    t.index(['expires_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('idempotency_keys');
}
