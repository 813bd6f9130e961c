import type { Knex } from 'knex';

// Grade definitions, one row per version: a PUT adds a version, nothing is overwritten, so every
// verdict can name the exact limits it was judged against. The latest version is the grade.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('grade_versions', (t) => {
    t.string('id', 40).primary();
    t.string('code', 60).notNullable();
    t.string('code_key', 60).notNullable();
    t.integer('version').notNullable();
    t.string('matrix', 3).notNullable();
    t.text('definition_json').notNullable();
    t.string('created_by_label', 320).notNullable();
    t.string('created_at', 30).notNullable();
    t.unique(['code_key', 'version']);
    t.index(['matrix']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('grade_versions');
}
