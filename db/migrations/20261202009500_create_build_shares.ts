import type { Knex } from 'knex';

// A build's public page: one row per build, made when the owner first switches it on.
// The token is the page's address (32 random bytes, base64url). It is kept as it is, not
// hashed: the owner copies the address again whenever they send it to someone, and it opens
// only what the owner chose to publish. A new token replaces the old, which then opens nothing.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('build_shares', (t) => {
    t.uuid('build_id').primary().references('builds.id').onDelete('CASCADE');
    t.text('token').notNullable().unique();
    t.boolean('enabled').notNullable().defaultTo(false);
    t.boolean('show_summary').notNullable().defaultTo(true);
    t.boolean('show_parts').notNullable().defaultTo(true);
    t.boolean('show_estimate').notNullable().defaultTo(true);
    t.boolean('show_install').notNullable().defaultTo(true);
    t.boolean('show_bench').notNullable().defaultTo(true);
    t.boolean('show_dyno').notNullable().defaultTo(true);
    t.boolean('show_photos').notNullable().defaultTo(true);
    t.boolean('show_member_names').notNullable().defaultTo(false);
    t.boolean('allow_indexing').notNullable().defaultTo(false);
    t.uuid('cover_photo_id').references('photos.id').onDelete('SET NULL');
    t.timestamps(true, true);
  });
  await knex.raw(
    "alter table build_shares add constraint build_shares_token check (token ~ '^[A-Za-z0-9_-]{43}$')",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('build_shares');
}
