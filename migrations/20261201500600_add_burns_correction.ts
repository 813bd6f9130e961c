import type { Knex } from 'knex';

// The correction set applied to a burn and its corrected values (same shape as values_json).
// The measured values stay in values_json and raw_json untouched.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('burns', (t) => {
    t.string('correction_set_id', 40).nullable();
    t.text('corrected_json').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('burns', (t) => {
    t.dropColumn('correction_set_id');
    t.dropColumn('corrected_json');
  });
}
