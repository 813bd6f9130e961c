import type { Knex } from 'knex';

// A control sample definition: one homogeneous piece (reference material or in-house) measured
// regularly on one instrument with one method. elements_json lists the charted elements,
// rules_json the run rules switched on, baseline_n how many points establish limits not entered.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('control_samples', (t) => {
    t.string('id', 40).primary();
    t.string('instrument_id', 40).notNullable().references('id').inTable('instruments');
    t.string('method_id', 40).notNullable().references('id').inTable('methods');
    t.string('code', 100).notNullable();
    t.string('description', 2000).notNullable();
    t.string('kind', 30).notNullable(); // reference_material | in_house
    t.text('elements_json').notNullable();
    t.text('rules_json').notNullable();
    t.integer('baseline_n').notNullable();
    t.string('created_at', 30).notNullable();
    t.string('updated_at', 30).notNullable();
    t.unique(['instrument_id', 'method_id', 'code']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('control_samples');
}
