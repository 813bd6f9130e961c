import type { Knex } from 'knex';

// Entered control limits per element, each valid from a time until the next one for that element:
// old limits are kept so every point is judged with the limits in force when it was measured.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('control_limits', (t) => {
    t.string('id', 40).primary();
    t.string('control_sample_id', 40).notNullable().references('id').inTable('control_samples');
    t.string('element', 3).notNullable();
    t.string('centre', 40).notNullable();
    t.string('sd', 40).notNullable();
    t.string('source', 500).notNullable();
    t.string('valid_from', 30).notNullable();
    t.string('created_by_label', 320).notNullable();
    t.string('created_at', 30).notNullable();
    t.index(['control_sample_id', 'element', 'valid_from']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('control_limits');
}
