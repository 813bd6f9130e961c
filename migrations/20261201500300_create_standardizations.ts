import type { Knex } from 'knex';

// Standardization runs. Each run holds its measurements and the per-element correction it
// computed (slope, offset, flag, reasons); once activated it is a correction set, in force for its
// instrument and method from effective_from until a later activation takes over.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('standardizations', (t) => {
    t.string('id', 40).primary();
    t.string('instrument_id', 40).notNullable().references('id').inTable('instruments');
    t.string('method_id', 40).notNullable().references('id').inTable('methods');
    t.string('mode', 30).notNullable();
    t.string('status', 20).notNullable(); // draft | activated
    t.string('flag', 10).notNullable(); // worst element flag: ok | warn | fail
    t.string('measured_at', 30).notNullable();
    t.string('note', 500).nullable();
    t.text('measurements_json').notNullable();
    t.text('corrections_json').notNullable();
    t.string('base_set_id', 40).nullable();
    t.string('created_by_label', 320).notNullable();
    t.string('created_at', 30).notNullable();
    t.string('activated_at', 30).nullable();
    t.string('activated_by_label', 320).nullable();
    t.string('effective_from', 30).nullable();
    t.string('override_reason', 1000).nullable();
    t.index(['instrument_id', 'method_id', 'measured_at']);
    t.index(['instrument_id', 'method_id', 'effective_from']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('standardizations');
}
