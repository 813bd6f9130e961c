import type { Knex } from 'knex';

// Every released revision of a sample, kept as it was served: revision 1 at release, one more per
// amendment (ISO/IEC 17025 §7.5: original and amended data, what changed, who, when and why).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sample_revisions', (t) => {
    t.string('id', 40).primary();
    t.string('sample_id', 40).notNullable().references('id').inTable('samples');
    t.integer('revision').notNullable();
    t.text('document_json').notNullable();
    t.string('reason', 2000).nullable(); // null for revision 1, the release itself
    t.text('changes_json').notNullable();
    t.string('created_by_label', 320).notNullable();
    t.string('created_at', 30).notNullable();
    t.unique(['sample_id', 'revision']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sample_revisions');
}
