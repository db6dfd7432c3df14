/**
 * The weekly digest: runs in every server process and, on each pass, queues one
 * mail per member who switched the digest on, once per week of their build's
 * time zone (weeks start on Monday; the digest goes from 07:00 that Monday, or
 * on the first pass after, if no process was running). The claim row and the
 * mail are written in one transaction under a primary key of (build, member,
 * week): with any number of processes, each member gets one digest a week. The
 * mail itself goes through the outbox, whose worker sends each row once.
 * Builds without a target date, or whose target date has passed, send none.
 */
import type { Knex } from 'knex';
import { fallbackTimeZone, wallClock, weekOf } from '@shared/dates';
import type { Role } from '@shared/permissions';
import type { Logger } from '@server/lib/logger';
import * as builds from '@server/features/builds';
import { enqueueMail } from '@server/features/mail';
import { subscribers } from '@server/features/notices';
import { digestMail } from './digest.mail';
import * as repo from './digest.repository';
import { loadTimeline } from './timeline.service';

/** The local hour on Monday from which a week's digest goes out. */
export const digestHour = 7;

export type DigestWorkerOptions = {
  knex: Knex;
  logger: Logger;
  /** Between passes; a pass is cheap when everyone's digest for the week is out. */
  pollMs?: number;
  /** The worker's clock; tests set it instead of waiting for Monday. */
  now?: () => Date;
};

type Subscriber = { buildId: string; userId: string; email: string; role: Role };

export function createDigestWorker(opts: DigestWorkerOptions) {
  const { knex } = opts;
  const now = opts.now ?? (() => new Date());
  const log = opts.logger.child({ component: 'digest-worker' });
  let running: Promise<{ queued: number }> | null = null;
  let timer: NodeJS.Timeout | null = null;
  let stopped = true;

  /** Queues the digests due for one build's subscribers; returns how many. */
  async function forBuild(buildId: string, people: Subscriber[], at: Date): Promise<number> {
    const build = await builds.get(knex, buildId, people[0].userId);
    const clock = wallClock(at, build.timeZone ?? fallbackTimeZone);
    if (clock.weekday === 1 && clock.hour < digestHour) return 0;
    if (!build.targetDate || build.targetDate < clock.date) return 0;
    const week = weekOf(clock.date);
    const done = await repo.sentForWeek(knex, buildId, week);
    let queued = 0;
    for (const p of people.filter((s) => !done.has(s.userId))) {
      const scope = { knex, buildId, caller: { userId: p.userId, role: p.role } };
      const { timeline } = await loadTimeline(scope, at);
      const mail = digestMail({
        to: p.email,
        role: p.role,
        buildId,
        buildName: build.name,
        weekOf: week,
        timeline,
      });
      const claimed = await knex.transaction(async (trx) => {
        if (!(await repo.claimWeek(trx, buildId, p.userId, week))) return false;
        await enqueueMail(trx, mail);
        return true;
      });
      if (claimed) queued++;
    }
    return queued;
  }

  async function pass(): Promise<{ queued: number }> {
    const at = now();
    const byBuild = new Map<string, Subscriber[]>();
    for (const s of await subscribers(knex, 'timeline-digest')) {
      byBuild.set(s.buildId, [...(byBuild.get(s.buildId) ?? []), s]);
    }
    let queued = 0;
    for (const [buildId, people] of byBuild) {
      try {
        queued += await forBuild(buildId, people, at);
      } catch (err) {
        // One build's trouble (deleted mid-pass, say) must not hold up the others.
        log.error({ err, buildId }, 'weekly digest not queued for a build');
      }
    }
    if (queued) log.info({ queued }, 'weekly digests queued');
    return { queued };
  }

  /** One pass; a pass already under way is joined, not doubled. */
  function runOnce() {
    running ??= pass().finally(() => {
      running = null;
    });
    return running;
  }

  function schedule() {
    if (stopped) return;
    timer = setTimeout(
      () => {
        runOnce()
          .catch((err) => log.error({ err }, 'digest worker pass failed'))
          .finally(schedule);
      },
      opts.pollMs ?? 10 * 60_000,
    );
    timer.unref();
  }

  return {
    runOnce,
    /** Passes every pollMs until stop(). */
    start() {
      if (!stopped) return;
      stopped = false;
      schedule();
    },
    /** Stops and waits for a pass under way. */
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      timer = null;
      await running?.catch(() => undefined);
    },
  };
}
export type DigestWorker = ReturnType<typeof createDigestWorker>;
