import type { Knex } from 'knex';

// Each sample's verdict against its grade, stored with the grade version it used so that a later
// grade version never changes an existing verdict silently. conforms: true | false | undecided,
// null when the sample names no grade known to Meltwire.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('samples', (t) => {
    t.text('conformance_json').nullable();
    t.string('conforms', 10).nullable();
    t.index(['conforms']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('samples', (t) => {
    t.dropIndex(['conforms']);
    t.dropColumn('conformance_json');
    t.dropColumn('conforms');
  });
}
