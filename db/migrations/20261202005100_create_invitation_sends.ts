import type { Knex } from 'knex';

/**
 * One row for every invitation mail sent (first send and resends), so the
 * number an owner can send per hour and per day, and to one build, is counted
 * in PostgreSQL and holds across processes and restarts.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invitation_sends', (t) => {
    t.bigIncrements('id');
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.uuid('sent_by').references('users.id').onDelete('SET NULL');
    t.timestamp('sent_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['sent_by', 'sent_at']);
    t.index(['build_id', 'sent_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invitation_sends');
}
