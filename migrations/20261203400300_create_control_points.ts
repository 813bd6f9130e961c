import type { Knex } from 'knex';

// Which samples are measurements of which control sample, and when each was measured.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('control_points', (t) => {
    t.string('sample_id', 40).primary().references('id').inTable('samples');
    t.string('control_sample_id', 40).notNullable().references('id').inTable('control_samples');
    t.string('measured_at', 30).notNullable();
    t.index(['control_sample_id', 'measured_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('control_points');
}
