import type { Knex } from 'knex';

// Install log: jobs → ordered steps → checklist items, fastener specs and torque
// readings. Torque values are double precision with their unit beside them
// (value + unit pair); readings are never updated except to mark them superseded.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('install_jobs', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.integer('position').notNullable();
    t.text('title').notNullable();
    t.text('notes').notNullable().defaultTo('');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamps(true, true);
    t.index(['build_id', 'position']);
  });

  await knex.schema.createTable('install_steps', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.uuid('job_id').notNullable().references('install_jobs.id').onDelete('CASCADE');
    t.integer('position').notNullable();
    t.text('title').notNullable();
    t.text('description').notNullable().defaultTo('');
    t.boolean('lifts_vehicle').notNullable().defaultTo(false);
    t.text('status').notNullable().defaultTo('not-started');
    t.uuid('signed_off_by').references('users.id').onDelete('SET NULL');
    t.timestamp('signed_off_at', { useTz: true });
    t.text('override_reason');
    t.jsonb('override_blockers');
    t.timestamps(true, true);
    t.index(['job_id', 'position']);
    t.index(['build_id']);
  });
  await knex.raw(`alter table install_steps
    add constraint install_steps_status check (status in ('not-started','under-way','signed-off')),
    add constraint install_steps_sign_off check ((status = 'signed-off') = (signed_off_at is not null))`);

  await knex.schema.createTable('install_step_parts', (t) => {
    t.uuid('step_id').notNullable().references('install_steps.id').onDelete('CASCADE');
    t.uuid('part_id').notNullable().references('parts.id').onDelete('CASCADE');
    t.primary(['step_id', 'part_id']);
    t.index(['part_id']);
  });

  await knex.schema.createTable('install_checklist_items', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('step_id').notNullable().references('install_steps.id').onDelete('CASCADE');
    t.integer('position').notNullable();
    t.text('label').notNullable();
    t.uuid('done_by').references('users.id').onDelete('SET NULL');
    t.timestamp('done_at', { useTz: true });
    t.timestamps(true, true);
    t.index(['step_id', 'position']);
  });

  await knex.schema.createTable('fastener_specs', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('step_id').notNullable().references('install_steps.id').onDelete('CASCADE');
    t.integer('position').notNullable();
    t.text('name').notNullable();
    t.integer('count').notNullable();
    t.double('target_value').notNullable();
    t.text('target_unit').notNullable();
    t.text('tolerance_type').notNullable();
    t.double('tolerance_value').notNullable();
    t.jsonb('stages').notNullable().defaultTo('[]');
    t.double('final_angle_deg');
    t.text('thread_condition').notNullable();
    t.text('sequence_note').notNullable().defaultTo('');
    t.text('spec_source').notNullable();
    t.integer('retorque_after_heat_cycles');
    t.integer('retorque_after_miles');
    t.uuid('retorque_closed_by').references('users.id').onDelete('SET NULL');
    t.timestamp('retorque_closed_at', { useTz: true });
    t.text('retorque_close_note').notNullable().defaultTo('');
    t.timestamps(true, true);
    t.index(['step_id', 'position']);
  });
  await knex.raw(`alter table fastener_specs
    add constraint fastener_specs_count check (count between 1 and 100),
    add constraint fastener_specs_target check (target_value > 0),
    add constraint fastener_specs_unit check (target_unit in ('lbf-ft','lbf-in','n-m')),
    add constraint fastener_specs_tolerance check (tolerance_type in ('value','percent') and tolerance_value >= 0),
    add constraint fastener_specs_thread check (thread_condition in ('dry','oiled','anti-seize','sealant'))`);

  await knex.schema.createTable('torque_readings', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('spec_id').notNullable().references('fastener_specs.id').onDelete('CASCADE');
    t.integer('position').notNullable();
    t.text('kind').notNullable().defaultTo('install');
    t.double('value').notNullable();
    t.text('unit').notNullable();
    t.text('wrench').notNullable().defaultTo('');
    t.text('note').notNullable().defaultTo('');
    t.uuid('recorded_by').references('users.id').onDelete('SET NULL');
    t.timestamp('recorded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.uuid('superseded_by_id').references('torque_readings.id').onDelete('SET NULL');
    t.timestamp('superseded_at', { useTz: true });
    t.index(['spec_id', 'position']);
  });
  await knex.raw(`alter table torque_readings
    add constraint torque_readings_position check (position >= 1),
    add constraint torque_readings_value check (value > 0),
    add constraint torque_readings_unit check (unit in ('lbf-ft','lbf-in','n-m')),
    add constraint torque_readings_kind check (kind in ('install','retorque'))`);
  // At most one current (not superseded) reading per spec, kind and position.
  await knex.raw(`create unique index torque_readings_one_current
    on torque_readings (spec_id, kind, position) where superseded_at is null`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('torque_readings');
  await knex.schema.dropTable('fastener_specs');
  await knex.schema.dropTable('install_checklist_items');
  await knex.schema.dropTable('install_step_parts');
  await knex.schema.dropTable('install_steps');
  await knex.schema.dropTable('install_jobs');
}
