import type { Knex } from 'knex';

/**
 * One row per overdue spell of a part at a shop that has been told about: the part, the
 * day it was sent out and the day it was due back (sent out + promised turnaround). The
 * primary key makes the notice go out once per spell however many server processes look
 * for overdue parts at once: the one whose insert lands sends it. A part sent out again,
 * or given a new turnaround that then also passes, is a new spell.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('part_overdue_notices', (t) => {
    t.uuid('part_id').notNullable().references('parts.id').onDelete('CASCADE');
    t.date('sent_out_on').notNullable();
    t.date('due_on').notNullable();
    t.timestamp('notified_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['part_id', 'sent_out_on', 'due_on']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('part_overdue_notices');
}
