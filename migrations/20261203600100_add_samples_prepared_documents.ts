import type { Knex } from 'knex';

// Each sample's API representation in %, stored ready to serve: the list entry and the single
// sample with its burns, and the key that says which state of the row they were made from
// (server/domain/samples/prepared-documents.ts). Null until prepared; a stale or missing document
// is never served, the sample is then computed afresh.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('samples', (t) => {
    t.text('summary_doc').nullable();
    t.text('detail_doc').nullable();
    t.string('doc_key', 200).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('samples', (t) => {
    t.dropColumn('summary_doc');
    t.dropColumn('detail_doc');
    t.dropColumn('doc_key');
  });
}
