import type { Knex } from 'knex';

// A sample and its computed results. results_json is recomputed whenever its burns change,
// so lists are served without aggregating burns per request.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('samples', (t) => {
    t.string('id', 40).primary();
    t.string('sample_code', 100).notNullable();
    t.string('heat', 100).nullable();
    t.string('grade', 100).nullable();
    t.string('kind', 20).nullable();
    t.string('instrument_id', 40).notNullable().references('id').inTable('instruments');
    t.string('method_id', 40).notNullable().references('id').inTable('methods');
    t.text('fields_json').notNullable();
    t.string('status', 20).notNullable(); // draft | released
    t.string('source', 20).notNullable(); // push | import
    t.string('import_id', 40).nullable().references('id').inTable('imports');
    t.integer('first_line').nullable();
    t.text('results_json').notNullable();
    t.text('flags_json').notNullable();
    t.string('created_by_label', 320).notNullable();
    t.string('created_at', 30).notNullable();
    t.string('updated_at', 30).notNullable();
    t.index(['heat']);
    t.index(['grade']);
    t.index(['instrument_id']);
    t.index(['method_id']);
    t.index(['import_id']);
    t.index(['created_at', 'id']);
    t.index(['updated_at', 'id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('samples');
}
