import type { Knex } from 'knex';

// The request log: every /api/v1 call with its (redacted, truncated) request and response.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('request_log', (t) => {
    t.string('id', 40).primary();
    t.string('occurred_at', 30).notNullable();
    t.string('method', 10).notNullable();
    t.string('path', 2000).notNullable();
    t.text('query').notNullable(); // raw query string without "?", secrets redacted
    t.integer('status').notNullable();
    t.double('duration_ms').notNullable();
    t.string('caller_type', 20).notNullable(); // user | api_key | anonymous
    t.string('caller_id', 40).nullable();
    t.string('caller_label', 320).nullable();
    t.string('owner_user_id', 40).nullable(); // the user, or the user who created the key
    t.string('request_id', 128).notNullable();
    t.text('request_headers_json').notNullable();
    t.string('request_content_type', 200).nullable();
    t.string('request_body_kind', 20).notNullable(); // none | json | text | multipart | binary | unread
    t.text('request_body').nullable();
    t.integer('request_body_size').notNullable();
    t.boolean('request_body_truncated').notNullable();
    t.boolean('request_redacted').notNullable(); // secrets were removed from the body or query
    t.text('response_headers_json').notNullable();
    t.string('response_content_type', 200).nullable();
    t.string('response_body_kind', 20).notNullable();
    t.text('response_body').nullable();
    t.integer('response_body_size').notNullable();
    t.boolean('response_body_truncated').notNullable();
    t.string('replay_of', 40).nullable();
    t.index(['occurred_at']);
    t.index(['owner_user_id']);
    t.index(['caller_id']);
    t.index(['replay_of']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('request_log');
}
