import type { Knex } from 'knex';

/**
 * Dyno days: a session at a dynamometer and the runs (pulls) made there.
 *
 * Every figure is stored as measured (uncorrected), as a value + unit pair in
 * the units the owner typed or the dyno's file used; corrections are applied
 * on read. Weather is stored the same way, on the session and optionally on a
 * run (a run's own weather wins). A run's curve is one jsonb array of rows
 * `[rpm, power, torque, boost, egt, mixture]` (null where not logged): up to
 * 20 000 rows, always read and written whole with its run.
 *
 * A run may carry one attachment (the dyno's own file or a photo of its
 * printout) in the file store under attachment_key. Deleting a run — directly
 * or by cascade from its session or build — queues that file for removal in
 * the same transaction, and so does replacing it with another.
 */
const weatherColumns = (t: Knex.CreateTableBuilder) => {
  t.double('weather_temperature');
  t.text('weather_temperature_unit');
  t.double('weather_pressure');
  t.text('weather_pressure_unit');
  t.double('weather_relative_humidity_pct');
  t.double('weather_dew_point');
};

/** Weather is all there (temperature and pressure with their units) or not at all. */
const weatherChecks = (table: string) => `
  alter table ${table}
    add constraint ${table}_weather_whole check (
      (weather_temperature is null and weather_temperature_unit is null and weather_pressure is null
        and weather_pressure_unit is null and weather_relative_humidity_pct is null and weather_dew_point is null)
      or (weather_temperature is not null and weather_temperature_unit in ('c', 'f')
        and weather_pressure is not null and weather_pressure_unit in ('kpa', 'mbar', 'inhg', 'psi'))
    ),
    add constraint ${table}_weather_humidity check (
      (weather_relative_humidity_pct is null or weather_relative_humidity_pct between 0 and 100)
      and (weather_relative_humidity_pct is null or weather_dew_point is null)
    )`;

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('dyno_sessions', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.date('session_date').notNullable();
    t.text('place').notNullable().defaultTo('');
    t.text('dyno_kind').notNullable();
    t.text('run_by').notNullable().defaultTo('');
    t.text('notes').notNullable().defaultTo('');
    weatherColumns(t);
    // The shop whose dyno it is: it sees this session and no other.
    t.uuid('shop_user_id').references('users.id').onDelete('SET NULL');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.index(['build_id', 'session_date']);
    t.index(['build_id', 'shop_user_id']);
  });
  await knex.raw(`alter table dyno_sessions
    add constraint dyno_sessions_kind check (dyno_kind in ('chassis', 'engine'))`);
  await knex.raw(weatherChecks('dyno_sessions'));

  await knex.schema.createTable('dyno_runs', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.uuid('session_id').notNullable().references('dyno_sessions.id').onDelete('CASCADE');
    // Pull number within its session: kept when another run is deleted, so "run 3" stays run 3.
    t.integer('run_number').notNullable();
    t.text('status').notNullable();
    t.text('abort_reason');
    t.text('gear').notNullable().defaultTo('');
    t.text('tune_revision').notNullable().defaultTo('');
    t.text('notes').notNullable().defaultTo('');
    t.text('power_unit').notNullable();
    t.text('torque_unit').notNullable();
    t.text('boost_unit').notNullable();
    t.text('egt_unit').notNullable();
    t.text('mixture_kind').notNullable();
    t.double('peak_power');
    t.double('peak_power_rpm');
    t.double('peak_torque');
    t.double('peak_torque_rpm');
    t.double('boost');
    t.double('egt');
    t.double('mixture');
    weatherColumns(t);
    t.jsonb('curve');
    t.integer('curve_rows').notNullable().defaultTo(0);
    t.text('attachment_key');
    t.text('attachment_name');
    t.text('attachment_kind');
    t.text('attachment_content_type');
    t.integer('attachment_bytes');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.unique(['session_id', 'run_number']);
    t.index(['build_id']);
  });
  await knex.raw(`alter table dyno_runs
    add constraint dyno_runs_status check (status in ('complete', 'aborted')),
    add constraint dyno_runs_abort_reason check ((status = 'aborted') = (abort_reason is not null)),
    add constraint dyno_runs_units check (
      power_unit in ('hp', 'kw', 'ps') and torque_unit in ('lbf-ft', 'n-m')
      and boost_unit in ('psi', 'bar', 'kpa') and egt_unit in ('c', 'f')
      and mixture_kind in ('afr', 'lambda')
    ),
    add constraint dyno_runs_figures check (
      (peak_power is null or peak_power >= 0) and (peak_torque is null or peak_torque >= 0)
      and (peak_power_rpm is null or peak_power_rpm > 0) and (peak_torque_rpm is null or peak_torque_rpm > 0)
    ),
    add constraint dyno_runs_curve check (curve is null or jsonb_typeof(curve) = 'array'),
    add constraint dyno_runs_attachment_whole check (
      (attachment_key is null) = (attachment_name is null)
      and (attachment_key is null) = (attachment_kind is null)
      and (attachment_key is null) = (attachment_content_type is null)
      and (attachment_key is null) = (attachment_bytes is null)
    )`);
  await knex.raw(weatherChecks('dyno_runs'));
  await knex.raw(`
    create trigger dyno_runs_queue_file_deletions after delete on dyno_runs
    for each row execute function queue_file_deletions('attachment_key')`);
  // The same function reads OLD, so on an update it queues the file being replaced.
  await knex.raw(`
    create trigger dyno_runs_queue_replaced_files after update of attachment_key on dyno_runs
    for each row when (old.attachment_key is distinct from new.attachment_key)
    execute function queue_file_deletions('attachment_key')`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop trigger if exists dyno_runs_queue_replaced_files on dyno_runs');
  await knex.raw('drop trigger if exists dyno_runs_queue_file_deletions on dyno_runs');
  await knex.schema.dropTable('dyno_runs');
  await knex.schema.dropTable('dyno_sessions');
}
