import type { Knex } from 'knex';

// Claims per endpoint (server/domain/webhooks/deliveries.repository.ts): an index that finds an
// endpoint's due deliveries in the order they are sent, and which worker holds a lease, so that a
// restarted single-process (SQLite) server takes back the leases its previous run left behind.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('webhook_deliveries', (t) => {
    t.string('locked_by', 60).nullable();
    t.index(['endpoint_id', 'status', 'next_attempt_at', 'id'], 'webhook_deliveries_due_per_endpoint');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('webhook_deliveries', (t) => {
    t.dropIndex(['endpoint_id', 'status', 'next_attempt_at', 'id'], 'webhook_deliveries_due_per_endpoint');
    t.dropColumn('locked_by');
  });
}
