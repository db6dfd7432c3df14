import type { Knex } from 'knex';

/**
 * A change of e-mail address waiting to be confirmed from the new address: a single-use
 * link (only its SHA-256 hash is kept) mailed there. The address changes only when the
 * link is followed, so nobody can move an account to an address they cannot read.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('email_changes', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('new_email').notNullable();
    t.text('token_hash').notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['user_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('email_changes');
}
