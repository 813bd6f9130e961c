import type { Knex } from 'knex';

// Burns (replicate sparks) of a sample. Values are kept as measured (raw_json: the cell text
// and its unit) and canonical (values_json: exact % decimal strings). Burns are never deleted:
// an excluded burn keeps its values, the reason and who excluded it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('burns', (t) => {
    t.string('id', 40).primary();
    t.string('sample_id', 40).notNullable().references('id').inTable('samples');
    t.integer('burn_number').notNullable();
    t.string('measured_at', 30).nullable();
    t.text('values_json').notNullable();
    t.text('raw_json').notNullable();
    t.boolean('excluded').notNullable().defaultTo(false);
    t.string('exclusion_reason', 500).nullable();
    t.string('excluded_by', 320).nullable();
    t.string('excluded_at', 30).nullable();
    t.integer('source_line').nullable();
    t.unique(['sample_id', 'burn_number']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('burns');
}
