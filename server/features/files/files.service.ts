/**
 * Removing stored files after their rows are gone. Deleting a row (a photo, or
 * a part, step or build that cascades to photos) queues its file keys in the
 * same transaction; `purge` removes what is queued, and a file that will not go
 * is retried with backoff instead of being forgotten.
 */
import type { Knex } from 'knex';
import type { Logger } from '@server/lib/logger';
import type { Storage } from '@server/lib/storage';
import * as repo from './files.repository';

export type FilesCtx = { knex: Knex; storage: Storage; logger: Logger };

const leaseMs = 5 * 60_000;
/** 1 min, 5 min, 25 min … capped at 6 h. */
export const retryDelayMs = (attempts: number) =>
  Math.min(6 * 3600_000, 60_000 * 5 ** Math.max(0, attempts - 1));

/** Removes the queued files that are due; returns how many went and how many wait for a retry. */
export async function purge(ctx: FilesCtx, limit = 200) {
  const due = await repo.claimDue(ctx.knex, leaseMs, limit);
  let removed = 0;
  let retrying = 0;
  for (const d of due) {
    try {
      await ctx.storage.delete(d.key);
      await repo.markDone(ctx.knex, d.id);
      removed++;
    } catch (err) {
      retrying++;
      const message = err instanceof Error ? err.message : String(err);
      ctx.logger.warn(
        { key: d.key, attempts: d.attempts, error: message },
        'file not removed; will retry',
      );
      await repo.markRetry(ctx.knex, d.id, retryDelayMs(d.attempts), message);
    }
  }
  return { removed, retrying };
}

/**
 * After a delete commits: remove its files now, so the common case leaves
 * nothing behind; a failure here is the worker's to retry, never the request's.
 */
export async function purgeSoon(ctx: FilesCtx) {
  await purge(ctx).catch((err) => ctx.logger.warn({ err: String(err) }, 'file purge deferred'));
}

/** Files written for rows that were never committed (a failed upload). */
export async function discard(ctx: FilesCtx, keys: string[]) {
  await repo.queue(ctx.knex, keys);
  await purgeSoon(ctx);
}

export const pendingKeys = (knex: Knex) => repo.pending(knex);

/** Polls the queue every pollMs until stop(); a failed pass is logged and tried again. */
export function createFileWorker(ctx: FilesCtx, pollMs = 30_000) {
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<unknown> | null = null;
  let stopped = true;
  const schedule = () => {
    if (stopped) return;
    timer = setTimeout(() => {
      running = purge(ctx)
        .catch((err) => ctx.logger.warn({ err: String(err) }, 'file purge pass failed'))
        .finally(() => {
          running = null;
          schedule();
        });
    }, pollMs);
    timer.unref();
  };
  return {
    start() {
      if (!stopped) return;
      stopped = false;
      schedule();
    },
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      await running;
    },
  };
}
