import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('builds', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('name').notNullable();
    t.integer('vehicle_year');
    t.text('vehicle_description').notNullable().defaultTo('');
    t.text('engine_description').notNullable().defaultTo('');
    t.decimal('displacement_liters', 5, 2);
    t.integer('cylinders').notNullable();
    t.text('aspiration').notNullable();
    t.text('transmission').notNullable().defaultTo('');
    t.decimal('stock_power_hp', 8, 1);
    t.text('stock_power_basis').notNullable().defaultTo('crank');
    t.decimal('target_power_hp', 8, 1).notNullable();
    t.text('target_power_basis').notNullable();
    t.decimal('target_torque_lbft', 8, 1);
    t.date('target_date');
    t.text('target_event').notNullable().defaultTo('');
    t.bigInteger('budget_cents').notNullable().defaultTo(0);
    t.string('currency', 3).notNullable().defaultTo('USD');
    t.timestamps(true, true);
  });
  await knex.raw(`alter table builds
    add constraint builds_power_basis check (stock_power_basis in ('crank','wheel') and target_power_basis in ('crank','wheel')),
    add constraint builds_budget_nonnegative check (budget_cents >= 0),
    add constraint builds_cylinders_range check (cylinders between 1 and 16)`);

  await knex.schema.createTable('build_members', (t) => {
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('role').notNullable();
    t.timestamps(true, true);
    t.primary(['build_id', 'user_id']);
    t.index(['user_id']);
  });
  await knex.raw(
    "alter table build_members add constraint build_members_role check (role in ('owner','crew','shop','viewer'))",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('build_members');
  await knex.schema.dropTable('builds');
}
