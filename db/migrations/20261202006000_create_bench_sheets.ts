import type { Knex } from 'knex';

/**
 * Bench results: flow-bench sheets of an injector set (a part), their test
 * points and each injector position's value at each point, and the shop's
 * original sheet as a stored file.
 *
 * A value that was not measured has no row (never a zero). A sheet entered by
 * a shop member names it in shop_user_id; sheets typed in by the owner or crew
 * (say, from a shop that is not on Headroom) leave it null.
 *
 * The checks below repeat the bounds of shared/schemas/bench so that no path
 * around the service can store a negative flow, a position beyond 16, a point
 * listed twice or a tolerance of zero or less.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('bench_sheets', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.uuid('part_id').notNullable().references('parts.id').onDelete('CASCADE');
    t.text('occasion').notNullable();
    t.date('tested_on').notNullable();
    t.text('tested_by').notNullable().defaultTo('');
    t.text('fluid').notNullable().defaultTo('');
    t.double('fluid_temperature_value');
    t.text('fluid_temperature_unit');
    t.text('notes').notNullable().defaultTo('');
    t.uuid('shop_user_id').references('users.id').onDelete('SET NULL');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.uuid('updated_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.index(['build_id', 'part_id', 'tested_on']);
    t.index(['build_id', 'shop_user_id']);
  });
  await knex.raw(`alter table bench_sheets
    add constraint bench_sheets_fluid_temperature_pair check (
      (fluid_temperature_value is null) = (fluid_temperature_unit is null)),
    add constraint bench_sheets_fluid_temperature_unit check (fluid_temperature_unit in ('c', 'f'))`);

  await knex.schema.createTable('bench_test_points', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('sheet_id').notNullable().references('bench_sheets.id').onDelete('CASCADE');
    /** The point's place on the sheet, from 0. */
    t.integer('seq').notNullable();
    t.text('kind').notNullable();
    t.text('label').notNullable();
    t.text('unit').notNullable();
    t.double('strokes_per_min');
    t.text('condition').notNullable().defaultTo('');
    t.double('nominal');
    t.text('tolerance_type').notNullable();
    t.double('tolerance_value').notNullable();
    t.double('return_limit');
    t.unique(['sheet_id', 'seq']);
  });
  await knex.raw(`alter table bench_test_points
    add constraint bench_test_points_seq check (seq >= 0 and seq < 30),
    add constraint bench_test_points_kind check (kind in
      ('full-load','part-load','idle','pilot','return-flow','opening-pressure','custom')),
    add constraint bench_test_points_unit check (unit in
      ('mm3-per-stroke','ml-per-1000-strokes','ml-per-min','bar','mpa','psi')),
    add constraint bench_test_points_tolerance check (
      tolerance_type in ('percent','absolute') and tolerance_value > 0
      and tolerance_value <= 1000000),
    add constraint bench_test_points_figures check (
      (nominal is null or nominal between 0 and 1000000)
      and (return_limit is null or return_limit between 0 and 1000000)
      and (strokes_per_min is null or (strokes_per_min > 0 and strokes_per_min <= 10000)))`);
  await knex.raw(
    `create unique index bench_test_points_label on bench_test_points (sheet_id, lower(label))`,
  );

  await knex.schema.createTable('bench_values', (t) => {
    t.uuid('point_id').notNullable().references('bench_test_points.id').onDelete('CASCADE');
    /** Injector position, from 1. */
    t.smallint('position').notNullable();
    t.double('value').notNullable();
    t.primary(['point_id', 'position']);
  });
  await knex.raw(`alter table bench_values
    add constraint bench_values_position check (position between 1 and 16),
    add constraint bench_values_range check (value >= 0 and value <= 1000000)`);

  // The shop's original sheet: one per sheet. Files live in the storage module
  // under original_key (and, for a photo, web_key and thumb_key).
  await knex.schema.createTable('bench_sheet_originals', (t) => {
    t.uuid('id').primary();
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.uuid('sheet_id').notNullable().unique().references('bench_sheets.id').onDelete('CASCADE');
    t.text('file_name').notNullable();
    t.text('format').notNullable();
    t.text('content_type').notNullable();
    t.integer('bytes').notNullable();
    t.integer('width');
    t.integer('height');
    t.text('original_key').notNullable();
    t.text('web_key');
    t.text('thumb_key');
    t.uuid('uploaded_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
  });
  await knex.raw(`alter table bench_sheet_originals
    add constraint bench_sheet_originals_format check (format in ('pdf','jpeg','png','webp','heif')),
    add constraint bench_sheet_originals_copies check (
      (format = 'pdf') = (web_key is null) and (web_key is null) = (thumb_key is null))`);
  // Deleted rows — directly, or by cascade from a sheet, part or build — queue
  // their files in the same transaction (see create_file_deletions).
  await knex.raw(`
    create trigger bench_sheet_originals_queue_file_deletions after delete on bench_sheet_originals
    for each row execute function queue_file_deletions('original_key', 'web_key', 'thumb_key')`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(
    'drop trigger if exists bench_sheet_originals_queue_file_deletions on bench_sheet_originals',
  );
  await knex.schema.dropTable('bench_sheet_originals');
  await knex.schema.dropTable('bench_values');
  await knex.schema.dropTable('bench_test_points');
  await knex.schema.dropTable('bench_sheets');
}
