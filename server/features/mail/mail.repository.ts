import type { Knex } from 'knex';

/** A mail as services queue it. The action is an app path; the worker adds APP_URL when it sends. */
export type QueuedMail = {
  /** What kind of mail, for the log and the table: invitation, password-reset, notice:part-received … */
  kind: string;
  to: string;
  subject: string;
  heading: string;
  body: string;
  action?: { label: string; path: string };
  footer?: string;
};

export type OutboxRow = {
  id: string;
  kind: string;
  to_address: string;
  subject: string;
  heading: string;
  body_text: string;
  action_label: string | null;
  action_path: string | null;
  footer_text: string;
  status: 'queued' | 'sent' | 'failed';
  attempts: number;
  next_attempt_at: Date;
  last_error: string | null;
};

// Headers cannot carry line breaks; a subject built from a part name must not try.
const oneLine = (s: string) => s.replace(/[\r\n]+/g, ' ').trim();

/**
 * Queues mail. Pass the transaction of the change that causes it, so the mail is
 * queued exactly when the change is committed, and never blocks on SMTP.
 */
export async function enqueueMail(knex: Knex, mails: QueuedMail | QueuedMail[]): Promise<void> {
  const list = Array.isArray(mails) ? mails : [mails];
  if (list.length === 0) return;
  await knex('mail_outbox').insert(
    list.map((m) => {
      if (m.action && !m.action.path.startsWith('/'))
        throw new Error(`mail action path must start with /: ${m.action.path}`);
      return {
        kind: m.kind,
        to_address: oneLine(m.to),
        subject: oneLine(m.subject),
        heading: m.heading,
        body_text: m.body,
        action_label: m.action?.label ?? null,
        action_path: m.action?.path ?? null,
        footer_text: m.footer ?? '',
      };
    }),
  );
}

/** How many mails of a kind were queued to an address since a moment (for per-address caps). */
export async function countQueuedSince(
  knex: Knex,
  kind: string,
  to: string,
  since: Date,
): Promise<number> {
  const [{ n }] = await knex('mail_outbox')
    .where({ kind, to_address: to })
    .where('created_at', '>', since)
    .count<{ n: string }[]>('* as n');
  return Number(n);
}

/**
 * Claims due mail for this worker: the rows are locked while being picked
 * (`skip locked`, so two processes never take the same row) and leased by moving
 * next_attempt_at past `leaseUntil`; a worker that dies mid-send leaves its rows
 * to be taken again once the lease runs out.
 * Due means due by the worker's clock or the database's, whichever is later: the
 * database stamps microseconds, a JavaScript Date only milliseconds, so a mail queued
 * this very millisecond would otherwise wait for the next pass.
 */
export async function claimDue(
  knex: Knex,
  now: Date,
  leaseUntil: Date,
  limit: number,
): Promise<OutboxRow[]> {
  const { rows } = await knex.raw<{ rows: OutboxRow[] }>(
    `update mail_outbox set attempts = attempts + 1, next_attempt_at = ?, updated_at = now()
     where id in (
       select id from mail_outbox
       where status = 'queued' and next_attempt_at <= greatest(?::timestamptz, now())
       order by next_attempt_at, created_at
       limit ?
       for update skip locked)
     returning *`,
    [leaseUntil, now, limit],
  );
  return rows;
}

// Once a mail has gone out (or been given up on) its body, which may hold a
// sign-in or invitation link, is cleared; to, subject and outcome stay.
const clearedBody = {
  heading: '',
  body_text: '',
  action_path: null,
  action_label: null,
  footer_text: '',
};

export async function markSent(knex: Knex, id: string, messageId: string) {
  await knex('mail_outbox')
    .where({ id })
    .update({
      ...clearedBody,
      status: 'sent',
      sent_at: knex.fn.now(),
      message_id: messageId,
      last_error: null,
      updated_at: knex.fn.now(),
    });
}

export async function markRetry(knex: Knex, id: string, nextAttemptAt: Date, error: string) {
  await knex('mail_outbox')
    .where({ id })
    .update({ next_attempt_at: nextAttemptAt, last_error: error, updated_at: knex.fn.now() });
}

export async function markFailed(knex: Knex, id: string, error: string) {
  await knex('mail_outbox')
    .where({ id })
    .update({ ...clearedBody, status: 'failed', last_error: error, updated_at: knex.fn.now() });
}

/** Forgets mail that was sent or given up on before `before`; queued mail is never touched. */
export async function purgeFinished(knex: Knex, before: Date): Promise<number> {
  return knex('mail_outbox')
    .whereIn('status', ['sent', 'failed'])
    .where('updated_at', '<', before)
    .delete();
}
