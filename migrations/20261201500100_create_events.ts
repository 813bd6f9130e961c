import type { Knex } from 'knex';

// Append-only domain events (standardization.flagged, standardization.activated …), written in the
// same transaction as the change they describe. The change feed and webhooks read from here later.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('events', (t) => {
    t.string('id', 40).primary();
    t.string('type', 80).notNullable();
    t.string('occurred_at', 30).notNullable();
    t.text('data_json').notNullable();
    t.index(['occurred_at', 'id']);
    t.index(['type']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('events');
}
