import type { Knex } from 'knex';

// Uploaded result files: the raw bytes are kept with their SHA-256 (re-uploads are found by it).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('imports', (t) => {
    t.string('id', 40).primary();
    t.string('instrument_id', 40).notNullable().references('id').inTable('instruments');
    t.string('method_id', 40).notNullable().references('id').inTable('methods');
    t.string('profile_id', 40).nullable().references('id').inTable('import_profiles');
    t.string('file_name', 255).notNullable();
    t.string('content_type', 100).notNullable();
    t.integer('size_bytes').notNullable();
    t.string('sha256', 64).notNullable().unique();
    t.binary('content').notNullable();
    t.string('mode', 20).notNullable(); // all_or_nothing | per_sample
    t.text('report_json').notNullable();
    t.string('created_by_type', 20).notNullable();
    t.string('created_by_id', 40).nullable();
    t.string('created_by_label', 320).notNullable();
    t.string('created_at', 30).notNullable();
    t.index(['created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('imports');
}
