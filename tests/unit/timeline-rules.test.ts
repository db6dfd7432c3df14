/**
 * The threat rules (shared/timeline/rules.ts, stated in the README), with dates
 * on and one day past each edge. The build counts days in America/Denver and
 * its window holds the spring change of 14 March 2027 (IANA time zone database:
 * MST, UTC−7 → MDT, UTC−6), so "today" comes from real instants through the
 * zone, as the server does. Target 20 March 2027, buffer 7 days: cut-off 13 March.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { threatRules } from '@shared/schemas/timeline';
import { todayIn } from '@shared/dates';
import { jobItems, partItems } from '@shared/timeline/items';
import {
  cutoffOf,
  daysLeftOf,
  jobThreats,
  milestoneThreats,
  partThreats,
  readinessOf,
  sendOutThreats,
  type Clock,
  type JobFacts,
  type PartFacts,
} from '@shared/timeline/rules';

const zone = 'America/Denver';
const target = '2027-03-20';

/** The clock of the build at an instant, counted in Denver. */
function at(instant: string, over: Partial<Clock> = {}): Clock {
  return {
    today: todayIn(zone, new Date(instant)),
    target,
    bufferDays: 7,
    stepsPerWeek: null,
    ...over,
  };
}

// 08:00 MST on Saturday 6 March 2027.
const early = at('2027-03-06T15:00:00Z');

function part(over: Partial<PartFacts>): PartFacts {
  return {
    id: 'p1',
    name: 'Turbocharger',
    status: 'ordered',
    expectedOn: null,
    sentOutOn: null,
    turnaroundDays: null,
    shopName: null,
    inEstimate: false,
    neededByJobs: [],
    ...over,
  };
}

describe('the clock', () => {
  it('puts the cut-off the buffer before the target, and counts days left in whole days', () => {
    expect(early.today).toBe('2027-03-06');
    expect(cutoffOf(early)).toBe('2027-03-13');
    // 14 calendar days, though one of them (14 March) is 23 hours long in Denver.
    expect(daysLeftOf(early)).toBe(14);
    expect(cutoffOf({ ...early, bufferDays: 0 })).toBe(target);
    expect(cutoffOf({ ...early, target: null })).toBeNull();
  });
});

describe('a part not yet in hand', () => {
  it('expected exactly on the cut-off is in time', () => {
    expect(partThreats(part({ expectedOn: '2027-03-13' }), early)).toEqual([]);
  });

  it('expected one day past the cut-off misses by 1 day, named with its dates and link', () => {
    const [t] = partThreats(part({ expectedOn: '2027-03-14' }), early);
    expect(t).toMatchObject({
      rule: 'part-late',
      key: 'part-expected:p1',
      missesByDays: 1,
      date: '2027-03-14',
      link: { to: 'part', partId: 'p1', name: 'Turbocharger' },
    });
    expect(t.words).toBe('Expected Mar 14, 1 day after the parts cut-off (Mar 13).');
  });

  it('counts from today once its expected date has passed without it', () => {
    // 23:30 MST on 13 March in Denver (06:30Z on the 14th): still on the cut-off, in time.
    const lastEvening = at('2027-03-14T06:30:00Z');
    expect(lastEvening.today).toBe('2027-03-13');
    expect(partThreats(part({ expectedOn: '2027-03-10' }), lastEvening)).toEqual([]);
    // Half an hour later it is the 14th in Denver: one day past the cut-off.
    const [t] = partThreats(part({ expectedOn: '2027-03-10' }), at('2027-03-14T07:30:00Z'));
    expect(t).toMatchObject({ rule: 'part-late', missesByDays: 1, date: '2027-03-10' });
    expect(t.words).toContain('Was expected Mar 10 and is not in');
  });

  it('in hand, out at a shop, on the truck or sent back is never late as an arrival', () => {
    for (const status of ['in-hand', 'at-shop', 'installed', 'returned'] as const) {
      expect(partThreats(part({ status, expectedOn: '2027-04-01' }), early)).toEqual([]);
    }
  });

  it('with no expected date threatens the date when the estimate or the install log needs it', () => {
    expect(partThreats(part({}), early)).toEqual([]);
    const [rated] = partThreats(part({ inEstimate: true }), early);
    expect(rated).toMatchObject({ rule: 'part-no-date', missesByDays: null, date: null });
    expect(rated.words).toBe('No expected date, and the power estimate counts on it.');
    const [linked] = partThreats(
      part({ status: 'planned', neededByJobs: ['Fit the turbo'] }),
      early,
    );
    expect(linked.words).toBe('No expected date, and the install log needs it (“Fit the turbo”).');
  });

  it('threatens nothing without a target date', () => {
    const none = { ...early, target: null };
    expect(partThreats(part({ expectedOn: '2027-09-01', inEstimate: true }), none)).toEqual([]);
    expect(partThreats(part({ inEstimate: true }), none)).toEqual([]);
  });
});

describe('a send-out', () => {
  const atShop = (turnaroundDays: number) =>
    part({
      status: 'at-shop',
      sentOutOn: '2027-03-01',
      turnaroundDays,
      shopName: 'Ridgeback Fuel Lab',
    });

  it('due back exactly on the cut-off is in time; one day later misses by 1 day', () => {
    expect(sendOutThreats(atShop(12), early)).toEqual([]);
    const [t] = sendOutThreats(atShop(13), early);
    expect(t).toMatchObject({ rule: 'send-out-late', missesByDays: 1, date: '2027-03-14' });
    expect(t.words).toBe(
      'Due back from Ridgeback Fuel Lab Mar 14, 1 day after the parts cut-off (Mar 13).',
    );
  });

  it('is overdue from the day after its due date, in the build’s zone, not UTC', () => {
    // Due 10 March. At 06:30Z on the 11th it is still the 10th in Denver: not overdue.
    const evening = at('2027-03-11T06:30:00Z');
    expect(evening.today).toBe('2027-03-10');
    expect(sendOutThreats(atShop(9), evening)).toEqual([]);
    const [t] = sendOutThreats(atShop(9), at('2027-03-11T07:30:00Z'));
    expect(t).toMatchObject({ rule: 'send-out-overdue', missesByDays: 1, date: '2027-03-10' });
    expect(t.words).toBe('Was due back from Ridgeback Fuel Lab Mar 10: 1 day overdue.');
  });

  it('with no promised turnaround has no due date to judge', () => {
    expect(sendOutThreats(part({ status: 'at-shop', sentOutOn: '2027-03-01' }), early)).toEqual([]);
  });
});

describe('install jobs at the owner’s pace', () => {
  const job = (id: string, position: number, stepsLeft: number): JobFacts => ({
    id,
    title: `Job ${id}`,
    position,
    stepsTotal: stepsLeft + 1,
    stepsLeft,
    nextStepId: `step-${id}`,
    finishedOn: null,
  });
  // 14 days to the target at 2 steps a week: 4 steps fit exactly.
  const paced = { ...early, stepsPerWeek: 2 };

  it('fit when the steps end exactly on the target date, and miss by a day count when not', () => {
    expect(jobThreats([job('a', 1, 4)], paced)).toEqual([]);
    const [t] = jobThreats([job('a', 1, 5)], paced);
    // 5 steps × 7 / 2 = 17.5 → 18 days → 24 March, 4 days past the 20th.
    expect(t).toMatchObject({
      rule: 'job-behind',
      key: 'job:a',
      missesByDays: 4,
      date: '2027-03-24',
      link: { to: 'step', stepId: 'step-a' },
    });
  });

  it('queue one after another in their order', () => {
    const threats = jobThreats([job('b', 2, 2), job('a', 1, 3)], paced);
    // a: 3 steps → 11 days → 17 March, in time; b: 5 steps → 24 March.
    expect(threats.map((t) => t.key)).toEqual(['job:b']);
    expect(threats[0].words).toBe(
      '2 steps left after 3 in the jobs before it: at 2 a week that runs to Mar 24, 4 days past the target date.',
    );
    const items = jobItems([job('a', 1, 3), job('b', 2, 2)], paced);
    expect(items.map((i) => [i.key, i.date, i.inCalendar])).toEqual([
      ['job:a', '2027-03-17', false],
      ['job:b', '2027-03-24', false],
    ]);
  });

  it('are not judged without a stated pace', () => {
    expect(jobThreats([job('a', 1, 50)], early)).toEqual([]);
  });

  it('round the days up without floating-point noise', () => {
    // 1 step at 0.1 a week is exactly 70 days, not 71.
    const slow = { ...early, target: '2027-05-15', stepsPerWeek: 0.1 };
    expect(jobItems([job('a', 1, 1)], slow)[0].date).toBe('2027-05-15');
    expect(jobThreats([job('a', 1, 1)], slow)).toEqual([]);
  });
});

describe('a milestone', () => {
  const m = { id: 'm1', title: 'Engine back together', dueOn: '2027-03-14', done: false };

  it('due today is not late; at local midnight it is 1 day past due', () => {
    // 23:30 MDT on 14 March (05:30Z on the 15th): the day it is due.
    expect(milestoneThreats(m, at('2027-03-15T05:30:00Z'))).toEqual([]);
    const [t] = milestoneThreats(m, at('2027-03-15T06:30:00Z'));
    expect(t).toMatchObject({ rule: 'milestone-past-due', missesByDays: 1 });
    expect(t.words).toBe('Was due Mar 14, 1 day ago, and is not marked done.');
  });

  it('done is never late', () => {
    expect(milestoneThreats({ ...m, done: true }, at('2027-04-01T12:00:00Z'))).toEqual([]);
  });
});

describe('the readiness line', () => {
  const threats = partThreats(part({ expectedOn: '2027-03-15' }), early);

  it('says it in plain words', () => {
    expect(readinessOf([], early).words).toBe('On track');
    expect(readinessOf(threats, early)).toEqual({
      state: 'threatened',
      words: '1 thing threatens the date',
    });
    expect(readinessOf([...threats, ...threats], early).words).toBe('2 things threaten the date');
    expect(readinessOf([], { ...early, target: null }).state).toBe('no-target');
    expect(readinessOf([], at('2027-03-21T12:00:00Z')).state).toBe('passed');
  });

  it('tells a shop, which sees only the parts sent to it, that it speaks of those', () => {
    expect(readinessOf([], early, 'own-parts')).toEqual({
      state: 'on-track',
      words: 'Your parts are on track',
    });
    expect(readinessOf(threats, early, 'own-parts').words).toBe(
      '1 of your parts threatens the date',
    );
    expect(readinessOf([...threats, ...threats], early, 'own-parts').words).toBe(
      '2 of your parts threaten the date',
    );
  });
});

describe('dated items of a part', () => {
  it('an awaited part on its expected date, a send-out on its due date, with stable keys', () => {
    const items = partItems(
      {
        ...part({ status: 'at-shop', sentOutOn: '2027-03-01', turnaroundDays: 14 }),
        vendor: 'Dustline',
        shopName: 'Ridgeback Fuel Lab',
      },
      early.today,
    );
    expect(items).toEqual([
      expect.objectContaining({
        key: 'send-out-due:p1',
        date: '2027-03-15',
        detail: 'Due back from Ridgeback Fuel Lab',
        inCalendar: true,
      }),
    ]);
    expect(
      partItems({ ...part({ expectedOn: '2027-03-09' }), vendor: 'Dustline' }, early.today)[0],
    ).toMatchObject({
      key: 'part-expected:p1',
      date: '2027-03-09',
      detail: 'Expected from Dustline',
    });
  });
});

describe('the README', () => {
  it('states every rule the server applies, one row of its rules table each', () => {
    const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
    const section = readme.slice(readme.indexOf('**What threatens the date.**'));
    const rows = [...section.matchAll(/^\| `([a-z-]+)` +\|/gm)].map((m) => m[1]);
    expect(rows).toEqual([...threatRules]);
  });
});
