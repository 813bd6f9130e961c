import type { Knex } from 'knex';

// The result file a standardization run's burns were read from (name and SHA-256), so that a run
// can be traced back to the instrument's own file; null when the burns were typed.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('standardizations', (t) => {
    t.text('source_file_json').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('standardizations', (t) => {
    t.dropColumn('source_file_json');
  });
}
