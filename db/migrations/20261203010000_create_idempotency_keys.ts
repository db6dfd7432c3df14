import type { Knex } from 'knex';

// A write sent twice (the offline queue retrying after a lost answer) is stored once: each
// key is kept per user with a hash of the request and the answer given, written in the
// same transaction as the write (the answer is filled in before that transaction commits),
// and pruned after seven days.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('idempotency_keys', (t) => {
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.uuid('key').notNullable();
    t.text('request_hash').notNullable();
    t.integer('response_status');
    t.jsonb('response_body');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['user_id', 'key']);
    t.index(['created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('idempotency_keys');
}
