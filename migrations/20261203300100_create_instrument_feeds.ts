import type { Knex } from 'knex';

// What an instrument PC's agent last said about its feed: one row per instrument, replaced by
// every heartbeat (the history of files lives in the imports themselves).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('instrument_feeds', (t) => {
    t.string('instrument_id', 40).primary().references('id').inTable('instruments');
    t.string('agent_version', 40).notNullable();
    t.string('agent_host', 200).nullable();
    t.integer('queue_length').notNullable();
    t.string('last_success_at', 30).nullable();
    t.string('last_file_name', 260).nullable();
    t.string('last_file_at', 30).nullable();
    t.string('last_error', 2000).nullable();
    t.string('last_error_at', 30).nullable();
    t.string('reported_at', 30).notNullable();
    t.string('reported_by_label', 320).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('instrument_feeds');
}
