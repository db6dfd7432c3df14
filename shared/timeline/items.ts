/**
 * The dated items of a build's timeline, made from the same facts the threat
 * rules read. Each item's key is stable (kind and the id of what it is about),
 * so the calendar feed's UIDs stay the same from one fetch to the next and a
 * phone's calendar updates an event instead of adding a second one.
 */
import type { IsoDate } from '@shared/dates';
import type { DynoKind } from '@shared/schemas/dyno';
import type { Threat, TimelineItem } from '@shared/schemas/timeline';
import {
  awaitedStatuses,
  dueBackOf,
  projectedFinishes,
  type Clock,
  type JobFacts,
  type MilestoneFacts,
  type PartFacts,
} from './rules';

type Unjudged = Omit<TimelineItem, 'threatened'>;

export function targetItem(buildId: string, date: IsoDate, event: string): Unjudged {
  return {
    key: `target:${buildId}`,
    kind: 'target',
    date,
    title: event || 'Target date',
    detail: event ? 'Target date' : 'The date the build is working to',
    done: false,
    inCalendar: true,
    link: { to: 'target' },
  };
}

export function milestoneItem(m: MilestoneFacts): Unjudged {
  return {
    key: `milestone:${m.id}`,
    kind: 'milestone',
    date: m.dueOn,
    title: m.title,
    detail: m.done ? 'Milestone, done' : 'Milestone',
    done: m.done,
    inCalendar: true,
    link: { to: 'milestone', milestoneId: m.id },
  };
}

/** A part's expected arrival (while not in hand) and its due-back date (while at a shop). */
export function partItems(p: PartFacts & { vendor: string }, today: IsoDate): Unjudged[] {
  const items: Unjudged[] = [];
  if (awaitedStatuses.has(p.status) && p.expectedOn) {
    items.push({
      key: `part-expected:${p.id}`,
      kind: 'part-expected',
      date: p.expectedOn,
      title: p.name,
      detail: p.vendor ? `Expected from ${p.vendor}` : 'Expected',
      done: false,
      inCalendar: true,
      link: { to: 'part', partId: p.id, name: p.name },
    });
  }
  const due = dueBackOf(p, today);
  if (due) {
    items.push({
      key: `send-out-due:${p.id}`,
      kind: 'send-out-due',
      date: due,
      title: p.name,
      detail: p.shopName ? `Due back from ${p.shopName}` : 'Due back from the shop',
      done: false,
      inCalendar: true,
      link: { to: 'send-out', partId: p.id, name: p.name },
    });
  }
  return items;
}

/**
 * Finished jobs on the day their last step was signed off; unfinished ones on the day the
 * owner's pace would finish them (not in the calendar: that date moves every day).
 */
export function jobItems(jobs: JobFacts[], clock: Clock): Unjudged[] {
  const finishes = projectedFinishes(jobs, clock);
  const items: Unjudged[] = [];
  for (const job of jobs) {
    const link = job.nextStepId
      ? ({ to: 'step', stepId: job.nextStepId } as const)
      : ({ to: 'install' } as const);
    const base = { key: `job:${job.id}`, kind: 'job' as const, title: job.title, link };
    if (job.stepsLeft === 0 && job.finishedOn) {
      items.push({
        ...base,
        date: job.finishedOn,
        detail: 'Install job, finished',
        done: true,
        inCalendar: false,
      });
    } else if (finishes.has(job.id)) {
      const left = `${job.stepsLeft} of ${job.stepsTotal} ${job.stepsTotal === 1 ? 'step' : 'steps'} left`;
      items.push({
        ...base,
        date: finishes.get(job.id)!,
        detail: `Install job: ${left}; done by then at your pace`,
        done: false,
        inCalendar: false,
      });
    }
  }
  return items;
}

const dynoKindWords: Record<DynoKind, string> = { chassis: 'Chassis dyno', engine: 'Engine dyno' };

/** A dyno day: booked ahead, or held (with its runs) on its date. */
export function dynoDayItem(
  d: { id: string; date: IsoDate; place: string; dynoKind: DynoKind; runCount: number },
  today: IsoDate,
): Unjudged {
  const runs = d.runCount ? `, ${d.runCount} ${d.runCount === 1 ? 'run' : 'runs'}` : '';
  return {
    key: `dyno-session:${d.id}`,
    kind: 'dyno-session',
    date: d.date,
    title: d.place ? `Dyno day at ${d.place}` : 'Dyno day',
    detail: `${dynoKindWords[d.dynoKind]}${runs}`,
    done: d.date < today,
    inCalendar: true,
    link: { to: 'dyno-session', sessionId: d.id },
  };
}

/** Marks the items a threat names and puts them in date order (then by kind and title). */
export function judgeItems(items: Unjudged[], threats: Threat[]): TimelineItem[] {
  const threatened = new Set(threats.map((t) => t.key));
  return items
    .map((i) => ({ ...i, threatened: threatened.has(i.key) }))
    .sort(
      (a, b) =>
        a.date.localeCompare(b.date) ||
        Number(b.kind === 'target') - Number(a.kind === 'target') ||
        a.title.localeCompare(b.title),
    );
}
