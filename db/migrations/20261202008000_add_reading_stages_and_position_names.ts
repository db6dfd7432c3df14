import type { Knex } from 'knex';

/**
 * A torque reading may name the stage it was taken at (1 = the spec's first stage; null
 * = the final torque), and a fastener spec may name its positions (e.g. "Cyl 1" … "Cyl 8")
 * instead of #1–#n. A stage reading supersedes only the current reading of the same stage,
 * so the one-current-reading index now counts the stage too.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('fastener_specs', (t) => {
    t.jsonb('position_names').notNullable().defaultTo('[]');
  });
  await knex.schema.alterTable('torque_readings', (t) => {
    t.smallint('stage');
  });
  await knex.raw(`alter table torque_readings
    add constraint torque_readings_stage check (stage is null or (stage between 1 and 10 and kind = 'install'))`);
  await knex.raw('drop index torque_readings_one_current');
  await knex.raw(`create unique index torque_readings_one_current
    on torque_readings (spec_id, kind, position, coalesce(stage, 0)) where superseded_at is null`);
}

export async function down(knex: Knex): Promise<void> {
  // Stage readings cannot stand in the old index (one current reading per position): they go.
  await knex('torque_readings').whereNotNull('stage').delete();
  await knex.raw('drop index torque_readings_one_current');
  await knex.raw(`create unique index torque_readings_one_current
    on torque_readings (spec_id, kind, position) where superseded_at is null`);
  await knex.raw('alter table torque_readings drop constraint torque_readings_stage');
  await knex.schema.alterTable('torque_readings', (t) => {
    t.dropColumn('stage');
  });
  await knex.schema.alterTable('fastener_specs', (t) => {
    t.dropColumn('position_names');
  });
}
