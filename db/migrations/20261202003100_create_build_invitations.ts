import type { Knex } from 'knex';

// An owner's invitation of an e-mail address to a build with a role. Only the
// SHA-256 hash of the link's token is kept: a copy of the database opens nothing.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('build_invitations', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('build_id').notNullable().references('builds.id').onDelete('CASCADE');
    t.text('email').notNullable();
    t.text('role').notNullable();
    t.text('token_hash').notNullable().unique();
    t.uuid('invited_by').references('users.id').onDelete('SET NULL');
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('last_sent_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.integer('send_count').notNullable().defaultTo(1);
    t.timestamp('accepted_at', { useTz: true });
    t.uuid('accepted_by').references('users.id').onDelete('SET NULL');
    t.timestamp('revoked_at', { useTz: true });
    t.timestamps(true, true);
  });
  await knex.raw(`alter table build_invitations
    add constraint build_invitations_role check (role in ('owner','crew','shop','viewer')),
    add constraint build_invitations_email_lower check (email = lower(email))`);
  // One open invitation per address and build: a second one is a resend.
  await knex.raw(`create unique index build_invitations_open on build_invitations (build_id, email)
    where accepted_at is null and revoked_at is null`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('build_invitations');
}
