import type { Knex } from 'knex';

// Rate-limit counters live in PostgreSQL so every app process behind a load
// balancer shares them and a restart does not reset an attacker's count.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('rate_limit_hits', (t) => {
    t.text('key').primary();
    t.integer('hits').notNullable();
    t.timestamp('reset_at', { useTz: true }).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rate_limit_hits');
}
