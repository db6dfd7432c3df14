import type { Knex } from 'knex';

/**
 * Timeline and calendar (modules 8 and 12).
 *
 * - builds.time_zone: the IANA zone a build's "today", countdowns, cut-offs and digest
 *   week are counted in. Null until the owner's browser or the owner chooses one (UTC
 *   meanwhile); the application checks the name against the engine's zone database.
 * - timeline_settings: the owner's buffer before the target date (days) and stated pace
 *   (install steps per week); no row means the defaults (7 days, no pace).
 * - milestones: dated goals the owner adds.
 * - calendar_feeds: one secret feed per member and build; only the SHA-256 of its token is
 *   kept. Leaving the build removes it with the membership, so the link stops working.
 * - timeline_digests: one row per member, build and week (the Monday that names it) whose
 *   digest was queued; the primary key is what keeps two processes from sending two.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('builds', (t) => {
    t.text('time_zone');
  });
  await knex.raw(`alter table builds
    add constraint builds_time_zone_shape check (time_zone is null or time_zone ~ '^[A-Za-z][A-Za-z0-9_+/-]{0,63}$')`);

  await knex.schema.createTable('timeline_settings', (t) => {
    t.uuid('build_id').primary().references('builds.id').onDelete('CASCADE');
    t.integer('buffer_days').notNullable().defaultTo(7);
    t.double('steps_per_week');
    t.timestamps(true, true);
  });
  await knex.raw(`alter table timeline_settings
    add constraint timeline_settings_buffer check (buffer_days between 0 and 365),
    add constraint timeline_settings_pace check (steps_per_week is null or (steps_per_week > 0 and steps_per_week <= 100))`);

  await knex.schema.createTable('milestones', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.text('title').notNullable();
    t.date('due_on').notNullable();
    t.boolean('done').notNullable().defaultTo(false);
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.index(['build_id', 'due_on']);
  });

  await knex.schema.createTable('calendar_feeds', (t) => {
    t.uuid('build_id').notNullable();
    t.uuid('user_id').notNullable();
    t.text('token_hash').notNullable().unique();
    t.timestamps(true, true);
    t.primary(['build_id', 'user_id']);
    t.foreign(['build_id', 'user_id'])
      .references(['build_id', 'user_id'])
      .inTable('build_members')
      .onDelete('CASCADE');
  });

  await knex.schema.createTable('timeline_digests', (t) => {
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.date('week_of').notNullable();
    t.timestamp('queued_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['build_id', 'user_id', 'week_of']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('timeline_digests');
  await knex.schema.dropTable('calendar_feeds');
  await knex.schema.dropTable('milestones');
  await knex.schema.dropTable('timeline_settings');
  await knex.raw('alter table builds drop constraint builds_time_zone_shape');
  await knex.schema.alterTable('builds', (t) => {
    t.dropColumn('time_zone');
  });
}
