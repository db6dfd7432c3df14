import type { Knex } from 'knex';

/**
 * Each person's torque wrenches, with the date each was last calibrated, offered when a
 * reading is taken. A reading keeps the wrench's name and calibration date as they were
 * when it was taken, and the date its calibration fell due under the build's interval
 * (builds.wrench_calibration_months, set by the owner; 12 by default), so a later change
 * to the wrench or the interval does not rewrite what the reading was taken with.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('torque_wrenches', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.date('calibrated_on');
    t.timestamps(true, true);
    t.index(['user_id']);
  });
  await knex.raw(`alter table torque_wrenches
    add constraint torque_wrenches_name check (length(name) between 1 and 120)`);
  await knex.raw(
    'create unique index torque_wrenches_user_name on torque_wrenches (user_id, lower(name))',
  );

  await knex.schema.alterTable('builds', (t) => {
    t.integer('wrench_calibration_months').notNullable().defaultTo(12);
  });
  await knex.raw(`alter table builds
    add constraint builds_wrench_calibration_months check (wrench_calibration_months between 1 and 60)`);

  await knex.schema.alterTable('torque_readings', (t) => {
    t.uuid('wrench_id').references('torque_wrenches.id').onDelete('SET NULL');
    t.date('wrench_calibrated_on');
    t.date('wrench_calibration_due_on');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('torque_readings', (t) => {
    t.dropColumn('wrench_id');
    t.dropColumn('wrench_calibrated_on');
    t.dropColumn('wrench_calibration_due_on');
  });
  await knex.raw('alter table builds drop constraint builds_wrench_calibration_months');
  await knex.schema.alterTable('builds', (t) => {
    t.dropColumn('wrench_calibration_months');
  });
  await knex.schema.dropTable('torque_wrenches');
}
