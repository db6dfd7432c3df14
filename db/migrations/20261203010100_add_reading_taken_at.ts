import type { Knex } from 'knex';

// A reading queued on a phone without signal arrives late: taken_at keeps the time it was
// taken on the device beside recorded_at, the time it arrived. Null: taken when it arrived.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('torque_readings', (t) => {
    t.timestamp('taken_at', { useTz: true });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('torque_readings', (t) => {
    t.dropColumn('taken_at');
  });
}
