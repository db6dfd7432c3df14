/**
 * A build's timeline as one member sees it: today in the build's zone, the
 * countdown, what threatens the target date and every dated item. The page, the
 * calendar feed and the weekly digest all read this one answer.
 */
import { fallbackTimeZone, todayIn } from '@shared/dates';
import { can } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import {
  threatRules,
  type Threat,
  type Timeline,
  type TimelineSettingsInput,
} from '@shared/schemas/timeline';
import { judgeItems, targetItem } from '@shared/timeline/items';
import { cutoffOf, daysLeftOf, readinessOf, type Clock } from '@shared/timeline/rules';
import type { BuildScope } from '@server/lib/scope';
import * as builds from '@server/features/builds';
import * as milestonesRepo from './milestones.repository';
import * as settingsRepo from './settings.repository';
import { sources } from './sources';

/** Rules in the README's order, then the worst miss first, then by name. */
function byConcern(a: Threat, b: Threat): number {
  return (
    threatRules.indexOf(a.rule) - threatRules.indexOf(b.rule) ||
    (b.missesByDays ?? 0) - (a.missesByDays ?? 0) ||
    a.title.localeCompare(b.title)
  );
}

/** The build's timeline for the caller, at `now` (tests move it). */
export async function getTimeline(scope: BuildScope, now: Date = new Date()): Promise<Timeline> {
  return (await loadTimeline(scope, now)).timeline;
}

/** The timeline with the build it was read from (its name, for the feed and the digest). */
export async function loadTimeline(
  scope: BuildScope,
  now: Date = new Date(),
): Promise<{ build: Build; timeline: Timeline }> {
  const { knex, buildId, caller } = scope;
  const [build, settings] = await Promise.all([
    builds.get(knex, buildId, caller.userId),
    settingsRepo.findSettings(knex, buildId),
  ]);
  const timeZone = build.timeZone ?? fallbackTimeZone;
  const clock: Clock = {
    today: todayIn(timeZone, now),
    target: build.targetDate,
    bufferDays: settings.bufferDays,
    stepsPerWeek: settings.stepsPerWeek,
  };
  const results = await Promise.all(sources.map((s) => s.load({ scope, clock, timeZone })));
  const threats = results.flatMap((r) => r.threats).sort(byConcern);
  const items = results.flatMap((r) => r.items);
  if (build.targetDate) items.push(targetItem(buildId, build.targetDate, build.targetEvent));
  const milestones = can(caller.role, 'milestones:read')
    ? await milestonesRepo.listMilestones(knex, buildId)
    : null;
  const timeline: Timeline = {
    today: clock.today,
    timeZone,
    timeZoneChosen: build.timeZone !== null,
    settings,
    target: {
      date: build.targetDate,
      event: build.targetEvent,
      daysLeft: daysLeftOf(clock),
      cutoff: cutoffOf(clock),
    },
    // A shop sees only the parts sent to it: its line speaks of those.
    readiness: readinessOf(threats, clock, caller.role === 'shop' ? 'own-parts' : 'whole-build'),
    threats,
    items: judgeItems(items, threats),
    milestones,
  };
  return { build, timeline };
}

/** The owner's buffer, pace and the build's time zone, saved together. */
export async function updateSettings(scope: BuildScope, input: TimelineSettingsInput) {
  const { knex, buildId, caller } = scope;
  await knex.transaction(async (trx) => {
    if (input.timeZone !== undefined) {
      await builds.update(trx, buildId, caller.userId, { timeZone: input.timeZone });
    }
    await settingsRepo.saveSettings(trx, buildId, input);
  });
  return getTimeline(scope);
}
