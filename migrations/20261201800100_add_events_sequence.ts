import type { Knex } from 'knex';

// Events get a strictly increasing `sequence` (the change feed's order), the instrument they are
// about (restricted API keys see only theirs), the endpoint a targeted test event is for, and on
// PostgreSQL the id of the writing transaction (xid8), so the feed can hand out only what no
// still-running transaction can precede. SQLite cannot add an autoincrement column to a table,
// so the table is rebuilt on both databases, existing events keeping their order.
export async function up(knex: Knex): Promise<void> {
  const pg = knex.client.config.client === 'pg';
  await knex.schema.createTable('events_v2', (t) => {
    // PostgreSQL: bigserial primary key; SQLite: integer primary key autoincrement (never reused).
    t.bigIncrements('sequence');
    t.string('id', 40).notNullable().unique();
    t.string('type', 80).notNullable();
    t.string('occurred_at', 30).notNullable();
    t.string('instrument_id', 40).nullable();
    t.string('endpoint_id', 40).nullable();
    t.text('data_json').notNullable();
    if (pg) t.specificType('txid', 'xid8').notNullable().defaultTo(knex.raw('pg_current_xact_id()'));
  });
  const old = await knex('events')
    .select('id', 'type', 'occurred_at', 'data_json')
    .orderBy([{ column: 'occurred_at' }, { column: 'id' }]);
  for (const row of old as { id: string; type: string; occurred_at: string; data_json: string }[]) {
    const data = JSON.parse(row.data_json) as { standardization?: { instrument_id?: string } };
    await knex('events_v2').insert({ ...row, instrument_id: data.standardization?.instrument_id ?? null });
  }
  await knex.schema.dropTable('events');
  await knex.schema.renameTable('events_v2', 'events');
  await knex.schema.alterTable('events', (t) => {
    t.index(['occurred_at'], 'events_occurred_at_idx');
    t.index(['type', 'sequence'], 'events_type_sequence_idx');
    if (pg) t.index(['txid', 'sequence'], 'events_txid_sequence_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.createTable('events_v1', (t) => {
    t.string('id', 40).primary();
    t.string('type', 80).notNullable();
    t.string('occurred_at', 30).notNullable();
    t.text('data_json').notNullable();
  });
  await knex.raw('insert into events_v1 (id, type, occurred_at, data_json) select id, type, occurred_at, data_json from events');
  await knex.schema.dropTable('events');
  await knex.schema.renameTable('events_v1', 'events');
  await knex.schema.alterTable('events', (t) => {
    t.index(['occurred_at', 'id']);
    t.index(['type']);
  });
}
