import type { Knex } from 'knex';

// Photo log. Files live in the storage module under web_key and thumb_key; a
// row belongs to exactly one step or one part of its build.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('photos', (t) => {
    t.uuid('id').primary();
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.uuid('step_id').references('install_steps.id').onDelete('CASCADE');
    t.uuid('part_id').references('parts.id').onDelete('CASCADE');
    t.text('caption').notNullable().defaultTo('');
    t.text('original_format').notNullable();
    t.integer('original_width').notNullable();
    t.integer('original_height').notNullable();
    t.integer('original_bytes').notNullable();
    t.text('content_type').notNullable();
    t.text('web_key').notNullable();
    t.integer('web_width').notNullable();
    t.integer('web_height').notNullable();
    t.text('thumb_key').notNullable();
    t.integer('thumb_width').notNullable();
    t.integer('thumb_height').notNullable();
    t.uuid('uploaded_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.index(['build_id', 'created_at']);
    t.index(['step_id']);
    t.index(['part_id']);
  });
  await knex.raw(`alter table photos
    add constraint photos_one_subject check ((step_id is null) <> (part_id is null))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('photos');
}
