import type { Knex } from 'knex';

// The control status of an instrument for one method, as a history: a violation sets `verify`
// (naming the point and rules), a disposition (cause, action) sets `in_control` again.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('control_status_changes', (t) => {
    t.string('id', 40).primary();
    t.string('instrument_id', 40).notNullable().references('id').inTable('instruments');
    t.string('method_id', 40).notNullable().references('id').inTable('methods');
    t.string('status', 20).notNullable(); // verify | in_control
    t.string('control_sample_id', 40).nullable().references('id').inTable('control_samples');
    t.string('sample_id', 40).nullable().references('id').inTable('samples');
    t.string('measured_at', 30).nullable();
    t.text('violations_json').nullable();
    t.string('cause', 2000).nullable();
    t.string('action', 2000).nullable();
    t.string('created_by_label', 320).notNullable();
    t.string('created_at', 30).notNullable();
    t.index(['instrument_id', 'method_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('control_status_changes');
}
