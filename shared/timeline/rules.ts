/**
 * What threatens a build's target date: pure rules over the build's dated
 * facts, counted in whole calendar days from "today" in the build's time zone
 * (shared/dates). The server is the authority; the README states the same
 * rules for people.
 *
 * The cut-off is the target date less the owner's buffer (default 7 days):
 * parts and send-outs should be back by then, leaving the buffer to fit them.
 * A date exactly on the cut-off is in time; one day later misses by one day.
 */
import { addDays, daysBetween, laterOf, shortDate, dayCount, type IsoDate } from '@shared/dates';
import { sendOutStatus } from '@shared/ledger/send-out';
import type { PartStatus } from '@shared/schemas/parts';
import type { Readiness, Threat, TimelineLink } from '@shared/schemas/timeline';

/** Today and the owner's settings: everything the rules count with. */
export type Clock = {
  today: IsoDate;
  target: IsoDate | null;
  bufferDays: number;
  stepsPerWeek: number | null;
};

/** The date parts must be in by: the target less the buffer; null without a target. */
export function cutoffOf(clock: Clock): IsoDate | null {
  return clock.target ? addDays(clock.target, -clock.bufferDays) : null;
}

/** Whole days from today to the target (0 on the day, negative after); null without a target. */
export function daysLeftOf(clock: Clock): number | null {
  return clock.target ? daysBetween(clock.today, clock.target) : null;
}

/** A part as the rules need it. */
export type PartFacts = {
  id: string;
  name: string;
  status: PartStatus;
  expectedOn: IsoDate | null;
  sentOutOn: IsoDate | null;
  turnaroundDays: number | null;
  shopName: string | null;
  /** The power estimate counts it (a rated part not sent back). */
  inEstimate: boolean;
  /** Titles of install jobs whose unfinished steps use it. */
  neededByJobs: string[];
};

/** Not yet in hand: still to be bought or still on its way. */
export const awaitedStatuses: ReadonlySet<PartStatus> = new Set(['planned', 'ordered']);

const cutoffText = (cutoff: IsoDate) => `the parts cut-off (${shortDate(cutoff)})`;

/**
 * A part not yet in hand threatens the date when it arrives after the cut-off: its expected
 * date, or today when that date has passed without it arriving. A part with no expected date
 * threatens it when the estimate or an unfinished install step needs it. Both need a target.
 */
export function partThreats(part: PartFacts, clock: Clock): Threat[] {
  const cutoff = cutoffOf(clock);
  if (!cutoff || !awaitedStatuses.has(part.status)) return [];
  const link: TimelineLink = { to: 'part', partId: part.id, name: part.name };
  if (part.expectedOn) {
    const arrival = laterOf(part.expectedOn, clock.today);
    if (arrival <= cutoff) return [];
    const late = daysBetween(cutoff, arrival);
    const words =
      part.expectedOn >= clock.today
        ? `Expected ${shortDate(part.expectedOn)}, ${dayCount(late)} after ${cutoffText(cutoff)}.`
        : `Was expected ${shortDate(part.expectedOn)} and is not in; today is already ${dayCount(late)} past ${cutoffText(cutoff)}.`;
    return [
      {
        key: `part-expected:${part.id}`,
        rule: 'part-late',
        title: part.name,
        words,
        missesByDays: late,
        date: part.expectedOn,
        link,
      },
    ];
  }
  const needs = [
    part.inEstimate ? 'the power estimate counts on it' : null,
    part.neededByJobs.length
      ? `the install log needs it (${part.neededByJobs.map((t) => `“${t}”`).join(', ')})`
      : null,
  ].filter(Boolean);
  if (!needs.length) return [];
  return [
    {
      key: `part-no-date:${part.id}`,
      rule: 'part-no-date',
      title: part.name,
      words: `No expected date, and ${needs.join(' and ')}.`,
      missesByDays: null,
      date: null,
      link,
    },
  ];
}

/** The date a part out at a shop is promised back (sent-out date + turnaround), if known. */
export function dueBackOf(part: PartFacts, today: IsoDate): IsoDate | null {
  return sendOutStatus(part, today)?.dueOn ?? null;
}

/**
 * A send-out threatens the date when it is overdue (today is past the date it was promised
 * back), or when that date is after the cut-off. Overdue is named first: it is already late.
 */
export function sendOutThreats(part: PartFacts, clock: Clock): Threat[] {
  const due = dueBackOf(part, clock.today);
  if (!due) return [];
  const from = part.shopName ? ` from ${part.shopName}` : '';
  const base = {
    key: `send-out-due:${part.id}`,
    title: part.name,
    date: due,
    link: { to: 'send-out', partId: part.id, name: part.name } as TimelineLink,
  };
  if (clock.today > due) {
    const late = daysBetween(due, clock.today);
    return [
      {
        ...base,
        rule: 'send-out-overdue',
        words: `Was due back${from} ${shortDate(due)}: ${dayCount(late)} overdue.`,
        missesByDays: late,
      },
    ];
  }
  const cutoff = cutoffOf(clock);
  if (cutoff && due > cutoff) {
    const late = daysBetween(cutoff, due);
    return [
      {
        ...base,
        rule: 'send-out-late',
        words: `Due back${from} ${shortDate(due)}, ${dayCount(late)} after ${cutoffText(cutoff)}.`,
        missesByDays: late,
      },
    ];
  }
  return [];
}

/** An install job as the rules need it. */
export type JobFacts = {
  id: string;
  title: string;
  position: number;
  stepsTotal: number;
  stepsLeft: number;
  /** The first step not signed off, for the link; null when the job is done. */
  nextStepId: string | null;
  /** The day its last step was signed off, in the build's zone; null while steps are left. */
  finishedOn: IsoDate | null;
};

/** Days needed for `steps` at `perWeek`, rounded up; the slack keeps 7 × 1 / 0.1 from being 71. */
function daysFor(steps: number, perWeek: number): number {
  return Math.ceil((steps * 7) / perWeek - 1e-9);
}

/**
 * When each unfinished job would be finished at the owner's pace, working through the jobs in
 * their order: a job's steps wait for the steps of the jobs before it. Empty without a pace.
 */
export function projectedFinishes(jobs: JobFacts[], clock: Clock): Map<string, IsoDate> {
  const out = new Map<string, IsoDate>();
  if (!clock.stepsPerWeek) return out;
  let steps = 0;
  for (const job of [...jobs].sort((a, b) => a.position - b.position)) {
    if (job.stepsLeft <= 0) continue;
    steps += job.stepsLeft;
    out.set(job.id, addDays(clock.today, daysFor(steps, clock.stepsPerWeek)));
  }
  return out;
}

/**
 * An unfinished job threatens the date when its remaining steps, after those of the jobs
 * before it, cannot be done by the target date at the owner's pace (steps per week). Jobs
 * are the work that fills the buffer, so they count to the target itself, not the cut-off.
 */
export function jobThreats(jobs: JobFacts[], clock: Clock): Threat[] {
  if (!clock.target || !clock.stepsPerWeek) return [];
  const finishes = projectedFinishes(jobs, clock);
  const threats: Threat[] = [];
  let before = 0;
  for (const job of [...jobs].sort((a, b) => a.position - b.position)) {
    const finish = finishes.get(job.id);
    if (!finish) continue;
    const queued = before;
    before += job.stepsLeft;
    if (finish <= clock.target) continue;
    const late = daysBetween(clock.target, finish);
    const left = `${job.stepsLeft} ${job.stepsLeft === 1 ? 'step' : 'steps'} left`;
    const after = queued ? ` after ${queued} in the jobs before it` : '';
    threats.push({
      key: `job:${job.id}`,
      rule: 'job-behind',
      title: job.title,
      words: `${left}${after}: at ${clock.stepsPerWeek} a week that runs to ${shortDate(finish)}, ${dayCount(late)} past the target date.`,
      missesByDays: late,
      date: finish,
      link: job.nextStepId ? { to: 'step', stepId: job.nextStepId } : { to: 'install' },
    });
  }
  return threats;
}

export type MilestoneFacts = { id: string; title: string; dueOn: IsoDate; done: boolean };

/** A milestone not done whose date has passed (one due today is not yet late). */
export function milestoneThreats(m: MilestoneFacts, clock: Clock): Threat[] {
  if (m.done || m.dueOn >= clock.today) return [];
  const late = daysBetween(m.dueOn, clock.today);
  return [
    {
      key: `milestone:${m.id}`,
      rule: 'milestone-past-due',
      title: m.title,
      words: `Was due ${shortDate(m.dueOn)}, ${dayCount(late)} ago, and is not marked done.`,
      missesByDays: late,
      date: m.dueOn,
      link: { to: 'milestone', milestoneId: m.id },
    },
  ];
}

/**
 * The readiness line: "On track", "1 thing threatens the date", "3 things threaten the date".
 * A shop judges only the parts sent to it, so its line says so ("Your parts are on track"):
 * a plain "On track" would read as the whole build's.
 */
export function readinessOf(
  threats: Threat[],
  clock: Clock,
  seen: 'whole-build' | 'own-parts' = 'whole-build',
): Readiness {
  if (!clock.target) return { state: 'no-target', words: 'No target date set' };
  if (clock.today > clock.target) return { state: 'passed', words: 'The target date has passed' };
  const n = threats.length;
  const own = seen === 'own-parts';
  if (n === 0) return { state: 'on-track', words: own ? 'Your parts are on track' : 'On track' };
  const things = own ? `of your parts` : n === 1 ? 'thing' : 'things';
  return {
    state: 'threatened',
    words: `${n} ${things} ${n === 1 ? 'threatens' : 'threaten'} the date`,
  };
}
