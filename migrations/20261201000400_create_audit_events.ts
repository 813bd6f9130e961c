import type { Knex } from 'knex';

// Append-only audit trail (ISO/IEC 17025 §7.5 records): who did what to which record, when.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_events', (t) => {
    t.string('id', 40).primary();
    t.string('occurred_at', 30).notNullable();
    t.string('actor_type', 20).notNullable(); // user | api_key | system
    t.string('actor_id', 40).nullable();
    t.string('actor_label', 320).notNullable();
    t.string('action', 80).notNullable();
    t.string('target_type', 40).notNullable();
    t.string('target_id', 80).nullable();
    t.text('before_json').nullable();
    t.text('after_json').nullable();
    t.string('request_id', 128).nullable();
    t.index(['occurred_at']);
    t.index(['target_type', 'target_id']);
    t.index(['actor_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_events');
}
