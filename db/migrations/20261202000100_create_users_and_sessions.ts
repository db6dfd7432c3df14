import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('email').notNullable().unique();
    t.text('display_name').notNullable();
    t.text('password_hash').notNullable();
    t.timestamps(true, true);
  });
  await knex.raw('alter table users add constraint users_email_lower check (email = lower(email))');

  // Shape required by lucia's PostgreSQL adapter: text id, user_id, expires_at.
  await knex.schema.createTable('user_sessions', (t) => {
    t.text('id').primary();
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('user_sessions');
  await knex.schema.dropTable('users');
}
