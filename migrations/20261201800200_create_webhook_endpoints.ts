import type { Knex } from 'knex';

// Webhook endpoints. The secret is kept as issued (not hashed): the server signs every delivery
// with it. During a rotation the previous secret signs too, until previous_secret_expires_at.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('webhook_endpoints', (t) => {
    t.string('id', 40).primary();
    t.string('url', 2000).notNullable();
    t.string('description', 500).nullable();
    t.text('event_types_json').notNullable();
    t.boolean('enabled').notNullable().defaultTo(true);
    t.string('disabled_reason', 500).nullable();
    t.string('secret', 100).notNullable();
    t.string('previous_secret', 100).nullable();
    t.string('previous_secret_expires_at', 30).nullable();
    // Since when every attempt has failed (null while deliveries succeed).
    t.string('failing_since', 30).nullable();
    t.string('owner_user_id', 40).nullable();
    t.string('created_by_label', 255).notNullable();
    t.string('created_at', 30).notNullable();
    t.string('updated_at', 30).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('webhook_endpoints');
}
