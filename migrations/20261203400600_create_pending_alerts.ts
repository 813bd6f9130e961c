import type { Knex } from 'knex';

// E-mail alerts waiting to be sent: alerts for one user within the grouping window go out as one
// message; sent_at is set when that message was handed to the mail server.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('pending_alerts', (t) => {
    t.string('id', 40).primary();
    t.string('user_id', 40).notNullable().references('id').inTable('users');
    t.string('kind', 40).notNullable();
    t.string('instrument_id', 40).nullable();
    t.string('subject', 500).notNullable();
    t.text('body').notNullable();
    t.string('path', 500).notNullable(); // console page, below PUBLIC_URL
    t.string('created_at', 30).notNullable();
    t.string('sent_at', 30).nullable();
    t.index(['sent_at', 'user_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('pending_alerts');
}
