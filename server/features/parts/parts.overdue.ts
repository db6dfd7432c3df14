/**
 * The "overdue at the shop" notice: a part at a shop past its sent-out date plus the
 * promised turnaround is told to the owner and to that shop, once per part per overdue
 * spell (a new send-out, or a new turnaround that also passes, is a new spell).
 *
 * How: a periodic pass in every server process (as the mail worker runs), not a check on
 * requests — a part falls overdue at midnight whether or not anyone opens the app. What
 * was sent is recorded in PostgreSQL (part_overdue_notices); its primary key is the spell,
 * so with two or more processes passing at once the insert lands once and only the process
 * that made it queues the notice, in the same transaction. Nothing is kept in memory.
 */
import type { Knex } from 'knex';
import { addDays, buildToday, daysBetween, fallbackTimeZone, todayIn } from '@shared/dates';
import { partCategoryLabels } from '@shared/schemas/parts';
import type { Logger } from '@server/lib/logger';
import { mailDate, quoted } from '@server/features/mail';
import { notify } from '@server/features/notices';
import * as repo from './parts.repository';
import { paths } from '@shared/paths';

/**
 * The latest "today" any build can have at `now`: UTC's date plus one (no zone is more than
 * 14 hours ahead of UTC). Parts overdue by it are the candidates; each is then judged by its
 * own build's today, as the parts service marks it in the ledger.
 */
const latestToday = (now: Date) => addDays(todayIn(fallbackTimeZone, now), 1);

/**
 * One pass: every part overdue at `now` in its build's time zone whose spell has not been told
 * yet. Returns how many notices this process queued (tests pass their own `now`).
 */
export async function notifyOverdueParts(knex: Knex, now: Date): Promise<number> {
  let told = 0;
  for (const candidate of await repo.overdueUntold(knex, latestToday(now))) {
    const today = buildToday(candidate, now);
    if (candidate.dueOn >= today) continue;
    told += await knex.transaction(async (trx) => {
      // Still out and still overdue on the same promise (it may have come back meanwhile)?
      const part = await repo.lockOverdue(trx, candidate.id, today);
      if (!part || !(await repo.recordOverdueNotice(trx, part))) return 0;
      const daysOver = daysBetween(part.dueOn, today);
      const shop = part.shopName ? ` at ${part.shopName}` : ' at the shop';
      const bits = [partCategoryLabels[part.category]];
      if (part.partNumber) bits.push(`part number ${part.partNumber}`);
      await notify(
        trx,
        part.buildId,
        'part-overdue-at-shop',
        {
          subject: `${part.name} overdue${shop}`,
          text:
            `${quoted(part.name)} (${bits.join(', ')}) went out${shop} on ${mailDate(part.sentOutOn)} ` +
            `with a turnaround of ${part.turnaroundDays} day${part.turnaroundDays === 1 ? '' : 's'}, ` +
            `so it was due back on ${mailDate(part.dueOn)}: ${daysOver} day${daysOver === 1 ? '' : 's'} ago.\n\n` +
            'If a new date was agreed, change the turnaround on the part; you will hear again only if that date passes too.',
          link: paths.builds.sendOuts.getHref(part.buildId),
          linkLabel: 'Open the send-outs',
        },
        // Nobody acted: the owner and the shop that has the part both hear.
        { actorUserId: null, shopUserId: part.shopUserId },
      );
      return 1;
    });
  }
  return told;
}

/** Passes every pollMs until stop(); a failed pass is logged and tried again at the next. */
export function createOverdueWorker(opts: {
  knex: Knex;
  logger: Logger;
  pollMs?: number;
  now?: () => Date;
}) {
  const log = opts.logger.child({ component: 'overdue-worker' });
  const now = opts.now ?? (() => new Date());
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<number> | null = null;
  let stopped = true;

  function runOnce(): Promise<number> {
    running ??= notifyOverdueParts(opts.knex, now()).finally(() => {
      running = null;
    });
    return running;
  }

  function schedule(delay: number) {
    if (stopped) return;
    timer = setTimeout(() => {
      runOnce()
        .then((n) => n && log.info({ notices: n }, 'overdue send-outs told'))
        .catch((err) => log.error({ err }, 'overdue pass failed'))
        .finally(() => schedule(opts.pollMs ?? 10 * 60_000));
    }, delay);
    timer.unref();
  }

  return {
    runOnce,
    start() {
      if (!stopped) return;
      stopped = false;
      // A first pass soon after start-up, then every pollMs.
      schedule(5_000);
    },
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      timer = null;
      await running?.catch(() => undefined);
    },
  };
}
export type OverdueWorker = ReturnType<typeof createOverdueWorker>;
