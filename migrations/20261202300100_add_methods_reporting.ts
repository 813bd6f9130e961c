import type { Knex } from 'knex';

// A method's reporting rules as JSON (mixed qualified burns, balance by difference, sum tolerance,
// unlisted elements); null means the safe defaults (server/domain/methods/methods.schemas.ts).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('methods', (t) => {
    t.text('reporting_json').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('methods', (t) => {
    t.dropColumn('reporting_json');
  });
}
