import type { Knex } from 'knex';

// When the "feed stale" alert went out for the agent's current silence; the next heartbeat clears
// it, so each silence alerts once.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('instrument_feeds', (t) => {
    t.string('stale_alerted_at', 30).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('instrument_feeds', (t) => {
    t.dropColumn('stale_alerted_at');
  });
}
