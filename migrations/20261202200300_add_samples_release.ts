import type { Knex } from 'knex';

// Release: who authorised a sample's results and when, with an optional comment and whether it was
// released as a concession (not conforming, or undecided). changed_by_user_id is who created the
// sample or last changed its burns (for an API key, its owner): with the lab's independent-release
// setting, that person may not release it. revision counts amendments (1 = as first released).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('samples', (t) => {
    t.string('changed_by_user_id', 40).nullable();
    t.string('released_by_user_id', 40).nullable();
    t.string('released_by_label', 320).nullable();
    t.string('released_at', 30).nullable();
    t.string('release_comment', 2000).nullable();
    t.boolean('concession').notNullable().defaultTo(false);
    t.integer('revision').notNullable().defaultTo(1);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('samples', (t) => {
    for (const column of [
      'changed_by_user_id',
      'released_by_user_id',
      'released_by_label',
      'released_at',
      'release_comment',
      'concession',
      'revision',
    ])
      t.dropColumn(column);
  });
}
