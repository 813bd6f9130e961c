import type { Knex } from 'knex';

// One delivery per event × endpoint, created by the delivery worker from the change feed (see
// docs/decisions/0007-event-feed.md), with every attempt kept. webhook_dispatch holds the feed
// cursor the worker fans out from; its one row is locked by the node doing the fan-out.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('webhook_deliveries', (t) => {
    t.string('id', 40).primary();
    t.string('endpoint_id', 40).notNullable().references('id').inTable('webhook_endpoints').onDelete('CASCADE');
    t.string('event_id', 40).notNullable();
    t.string('event_type', 80).notNullable();
    t.string('status', 20).notNullable();
    t.integer('attempt_count').notNullable().defaultTo(0);
    t.string('next_attempt_at', 30).nullable();
    // A claimed delivery is leased to one worker until then; a crash lets the lease run out.
    t.string('locked_until', 30).nullable();
    t.integer('last_status_code').nullable();
    t.string('last_error', 500).nullable();
    t.string('created_at', 30).notNullable();
    t.string('updated_at', 30).notNullable();
    t.string('delivered_at', 30).nullable();
    t.unique(['endpoint_id', 'event_id']);
    t.index(['status', 'next_attempt_at']);
    t.index(['endpoint_id', 'id']);
    t.index(['created_at']);
  });
  await knex.schema.createTable('webhook_attempts', (t) => {
    t.string('id', 40).primary();
    t.string('delivery_id', 40).notNullable().references('id').inTable('webhook_deliveries').onDelete('CASCADE');
    t.integer('number').notNullable();
    t.string('started_at', 30).notNullable();
    t.float('duration_ms').notNullable();
    t.integer('status_code').nullable();
    t.text('response_excerpt').nullable();
    t.string('error', 500).nullable();
    t.string('outcome', 20).notNullable();
    t.string('next_attempt_at', 30).nullable();
    t.index(['delivery_id', 'number']);
  });
  await knex.schema.createTable('webhook_dispatch', (t) => {
    t.string('name', 40).primary();
    t.string('cursor', 500).nullable();
    t.string('updated_at', 30).notNullable();
  });
  await knex('webhook_dispatch').insert({ name: 'fan-out', cursor: null, updated_at: new Date().toISOString() });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('webhook_dispatch');
  await knex.schema.dropTable('webhook_attempts');
  await knex.schema.dropTable('webhook_deliveries');
}
