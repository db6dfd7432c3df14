/**
 * The mail worker: runs in every server process, takes due mail from the
 * PostgreSQL outbox, renders it and hands it to SMTP; retries with exponential
 * backoff and records each mail as sent or failed. Tests call runOnce()/drain()
 * themselves and never start the timer.
 */
import type { Knex } from 'knex';
import type { Logger } from '@server/lib/logger';
import type { Mailer } from '@server/lib/mailer';
import { renderMail } from './mail.templates';
import * as repo from './mail.repository';

/** 30 s, 1 min, 2 min … doubling, at most an hour between tries. */
export function retryDelayMs(attempt: number): number {
  return Math.min(30_000 * 2 ** Math.max(0, attempt - 1), 3_600_000);
}

/** With the defaults a mail is tried for about three hours before it counts as failed. */
export const defaultMaxAttempts = 10;

export type MailWorkerOptions = {
  knex: Knex;
  mailer: Mailer;
  logger: Logger;
  /** Base of the links in mails, e.g. https://headroom.example.com */
  appUrl: string;
  pollMs?: number;
  maxAttempts?: number;
  batchSize?: number;
  /** How long a claimed mail is kept from other workers while it is being sent. */
  leaseMs?: number;
  /** The worker's clock; tests move it forward instead of waiting. */
  now?: () => Date;
  /** Days a sent or failed mail's row (to, subject, outcome) is kept. */
  retentionDays?: number;
};

export type PassResult = { claimed: number; sent: number; retrying: number; failed: number };

export function createMailWorker(opts: MailWorkerOptions) {
  const maxAttempts = opts.maxAttempts ?? defaultMaxAttempts;
  const batchSize = opts.batchSize ?? 20;
  const leaseMs = opts.leaseMs ?? 5 * 60_000;
  const now = opts.now ?? (() => new Date());
  const log = opts.logger.child({ component: 'mail-worker' });
  let running: Promise<PassResult> | null = null;
  let timer: NodeJS.Timeout | null = null;
  let stopped = true;
  let lastPurge = 0;

  async function deliver(row: repo.OutboxRow, result: PassResult) {
    const mail = renderMail({
      subject: row.subject,
      heading: row.heading,
      body: row.body_text,
      action: row.action_path
        ? { label: row.action_label ?? 'Open Headroom', url: opts.appUrl + row.action_path }
        : undefined,
      footer: row.footer_text || undefined,
    });
    try {
      const { messageId } = await opts.mailer.send({ to: row.to_address, ...mail });
      await repo.markSent(opts.knex, row.id, messageId);
      result.sent++;
      log.info({ mailId: row.id, kind: row.kind }, 'mail sent');
    } catch (err) {
      const message = (err instanceof Error ? err.message : String(err)).slice(0, 500);
      if (row.attempts >= maxAttempts) {
        await repo.markFailed(opts.knex, row.id, message);
        result.failed++;
        log.error(
          { mailId: row.id, kind: row.kind, attempts: row.attempts, error: message },
          'mail failed for good',
        );
      } else {
        const next = new Date(now().getTime() + retryDelayMs(row.attempts));
        await repo.markRetry(opts.knex, row.id, next, message);
        result.retrying++;
        log.warn(
          { mailId: row.id, kind: row.kind, attempts: row.attempts, next, error: message },
          'mail not sent; will retry',
        );
      }
    }
  }

  async function pass(): Promise<PassResult> {
    const at = now();
    const rows = await repo.claimDue(opts.knex, at, new Date(at.getTime() + leaseMs), batchSize);
    const result: PassResult = { claimed: rows.length, sent: 0, retrying: 0, failed: 0 };
    // One at a time: a batch is small, and SMTP servers dislike bursts of connections.
    for (const row of rows) await deliver(row, result);
    return result;
  }

  /** One pass over the mail due now; a pass already under way is joined, not doubled. */
  function runOnce(): Promise<PassResult> {
    running ??= pass().finally(() => {
      running = null;
    });
    return running;
  }

  /** Passes until nothing due is left (what was retried is due later, so this ends). */
  async function drain(): Promise<PassResult> {
    const total: PassResult = { claimed: 0, sent: 0, retrying: 0, failed: 0 };
    for (let i = 0; i < 100; i++) {
      const r = await runOnce();
      total.claimed += r.claimed;
      total.sent += r.sent;
      total.retrying += r.retrying;
      total.failed += r.failed;
      if (r.claimed === 0 || r.sent === 0) break;
    }
    return total;
  }

  /** Deletes the rows of mail finished more than retentionDays ago. */
  function purge(): Promise<number> {
    const before = new Date(now().getTime() - (opts.retentionDays ?? 30) * 24 * 3600_000);
    return repo.purgeFinished(opts.knex, before);
  }

  function schedule() {
    if (stopped) return;
    timer = setTimeout(() => {
      const hourly = Date.now() - lastPurge > 3600_000;
      if (hourly) lastPurge = Date.now();
      (hourly ? purge() : Promise.resolve(0))
        .then(() => runOnce())
        .catch((err) => log.error({ err }, 'mail worker pass failed'))
        .finally(schedule);
    }, opts.pollMs ?? 1000);
    timer.unref();
  }

  return {
    runOnce,
    drain,
    purge,
    /** Polls the outbox every pollMs until stop(). */
    start() {
      if (!stopped) return;
      stopped = false;
      schedule();
    },
    /** Stops polling and waits for a pass under way to finish. */
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      timer = null;
      await running?.catch(() => undefined);
    },
  };
}
export type MailWorker = ReturnType<typeof createMailWorker>;
