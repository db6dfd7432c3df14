import type { Knex } from 'knex';

// Outgoing mail waits here until the worker has handed it to SMTP, so a request
// never waits for (or fails with) the mail server and a restart loses nothing.
// The body is kept as content (text, one action link as an app path) and
// rendered at send time; it is cleared once the mail is sent or given up on,
// because an invitation or reset link is as good as a password while it lives.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mail_outbox', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('kind').notNullable();
    t.text('to_address').notNullable();
    t.text('subject').notNullable();
    t.text('heading').notNullable().defaultTo('');
    t.text('body_text').notNullable().defaultTo('');
    t.text('action_label');
    t.text('action_path');
    t.text('footer_text').notNullable().defaultTo('');
    t.text('status').notNullable().defaultTo('queued');
    t.integer('attempts').notNullable().defaultTo(0);
    t.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.text('last_error');
    t.text('message_id');
    t.timestamp('sent_at', { useTz: true });
    t.timestamps(true, true);
  });
  await knex.raw(`alter table mail_outbox
    add constraint mail_outbox_status check (status in ('queued','sent','failed')),
    add constraint mail_outbox_action_pair check ((action_label is null) = (action_path is null))`);
  // The worker's only question: which queued mail is due?
  await knex.raw(
    `create index mail_outbox_due on mail_outbox (next_attempt_at) where status = 'queued'`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mail_outbox');
}
