import type { Knex } from 'knex';

// A method's limits for standardization slopes, as JSON { warn, fail } (decimal strings);
// null means the defaults (0.2 and 0.5).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('methods', (t) => {
    t.text('drift_limits_json').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('methods', (t) => {
    t.dropColumn('drift_limits_json');
  });
}
