import type { Knex } from 'knex';

// Marks the calls the console app makes for its own pages (session calls sent with the console's
// client header), so the Request log can leave them out by default.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('request_log', (t) => {
    t.boolean('from_console').notNullable().defaultTo(false);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('request_log', (t) => {
    t.dropColumn('from_console');
  });
}
