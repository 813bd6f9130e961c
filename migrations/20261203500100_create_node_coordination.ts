import type { Knex } from 'knex';

// What several API nodes on one PostgreSQL share beyond the data itself:
// - rate_limit_counters: the rate-limit budgets (rate-limiter-flexible's table layout: key, points
//   used in the window, expiry in epoch ms), so N per minute holds across every node;
// - job_leases: when each periodic job last ran and on which node, so exactly one node runs it;
// - cluster_settings: facts every node must agree on (the SESSION_SECRET fingerprint).
// On SQLite (one process) the tables exist but only job_leases and cluster_settings are used.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('rate_limit_counters', (t) => {
    t.string('key', 255).primary();
    t.integer('points').notNullable().defaultTo(0);
    t.bigInteger('expire').nullable();
  });
  await knex.schema.createTable('job_leases', (t) => {
    t.string('job', 60).primary();
    t.string('last_run_at', 30).nullable();
    t.string('run_by', 120).nullable();
  });
  await knex.schema.createTable('cluster_settings', (t) => {
    t.string('key', 60).primary();
    t.text('value').notNullable();
    t.string('set_at', 30).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('cluster_settings');
  await knex.schema.dropTable('job_leases');
  await knex.schema.dropTable('rate_limit_counters');
}
