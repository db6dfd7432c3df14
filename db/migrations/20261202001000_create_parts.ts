import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('parts', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.text('category').notNullable();
    t.text('name').notNullable();
    t.text('vendor').notNullable().defaultTo('');
    t.text('part_number').notNullable().defaultTo('');
    t.integer('quantity').notNullable().defaultTo(1);
    t.text('status').notNullable().defaultTo('planned');
    t.uuid('shop_user_id').references('users.id').onDelete('SET NULL');
    t.integer('turnaround_days');
    t.bigInteger('unit_price_cents').notNullable().defaultTo(0);
    t.bigInteger('labour_cents').notNullable().defaultTo(0);
    t.bigInteger('shipping_cents').notNullable().defaultTo(0);
    t.bigInteger('tax_cents').notNullable().defaultTo(0);
    t.bigInteger('core_charge_cents').notNullable().defaultTo(0);
    t.bigInteger('core_refund_cents').notNullable().defaultTo(0);
    t.date('ordered_on');
    t.date('expected_on');
    t.date('received_on');
    t.date('sent_out_on');
    t.date('back_on');
    t.date('installed_on');
    t.text('notes').notNullable().defaultTo('');
    t.decimal('rating_value', 12, 3);
    t.text('rating_unit');
    t.text('rating_for').notNullable().defaultTo('');
    t.timestamps(true, true);
    t.index(['build_id', 'category']);
    t.index(['build_id', 'shop_user_id']);
  });
  await knex.raw(`alter table parts
    add constraint parts_quantity_positive check (quantity >= 1),
    add constraint parts_money_nonnegative check (
      unit_price_cents >= 0 and labour_cents >= 0 and shipping_cents >= 0 and tax_cents >= 0
      and core_charge_cents >= 0 and core_refund_cents >= 0),
    add constraint parts_status check (status in ('planned','ordered','in-hand','at-shop','installed','returned')),
    add constraint parts_rating_pair check ((rating_value is null) = (rating_unit is null))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('parts');
}
