import type { Knex } from 'knex';

// Which correction set(s) a sample's results were computed with, and how they were chosen
// (by measurement time at ingest, or on request with a reason). Null: no correction applied.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('samples', (t) => {
    t.text('correction_json').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('samples', (t) => {
    t.dropColumn('correction_json');
  });
}
