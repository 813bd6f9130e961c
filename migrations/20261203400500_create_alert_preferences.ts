import type { Knex } from 'knex';

// Which events e-mail a user: one row per event kind, for one instrument or (instrument_id null) all.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('alert_preferences', (t) => {
    t.string('user_id', 40).notNullable().references('id').inTable('users');
    t.string('kind', 40).notNullable();
    t.string('instrument_id', 40).nullable().references('id').inTable('instruments');
    t.index(['kind']);
    t.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('alert_preferences');
}
