/**
 * Where the timeline's dated items and threats come from: one source per kind of dated
 * thing in the build, each applying what the caller may see. A feature with dates of its
 * own adds one entry to `sources` (as dyno days do) — the page, the calendar feed and the
 * weekly digest then carry its items with no other change.
 */
import { can } from '@shared/permissions';
import { wallClock, type IsoDate } from '@shared/dates';
import type { Threat, TimelineItem } from '@shared/schemas/timeline';
import { dynoDayItem, jobItems, milestoneItem, partItems } from '@shared/timeline/items';
import {
  jobThreats,
  milestoneThreats,
  partThreats,
  sendOutThreats,
  type Clock,
  type JobFacts,
} from '@shared/timeline/rules';
import type { BuildScope } from '@server/lib/scope';
import * as dyno from '@server/features/dyno';
import * as installLog from '@server/features/install-log';
import * as parts from '@server/features/parts';
import * as milestonesRepo from './milestones.repository';

export type SourceContext = { scope: BuildScope; clock: Clock; timeZone: string };

export type SourceResult = {
  items: Omit<TimelineItem, 'threatened'>[];
  threats: Threat[];
};

export type TimelineSource = {
  name: string;
  load: (ctx: SourceContext) => Promise<SourceResult>;
};

const nothing: SourceResult = { items: [], threats: [] };

/** The owner's milestones; a shop does not see them. */
const milestones: TimelineSource = {
  name: 'milestones',
  async load({ scope, clock }) {
    if (!can(scope.caller.role, 'milestones:read')) return nothing;
    const list = await milestonesRepo.listMilestones(scope.knex, scope.buildId);
    return {
      items: list.map(milestoneItem),
      threats: list.flatMap((m) => milestoneThreats(m, clock)),
    };
  },
};

/** Parts expected and send-outs due back; a shop sees only the parts sent to it. */
const partsAndSendOuts: TimelineSource = {
  name: 'parts',
  async load({ scope, clock }) {
    const { knex, buildId, caller } = scope;
    const [all, needed] = await Promise.all([
      parts.listAll(knex, buildId),
      installLog.listPartsNeededByOpenSteps(knex, buildId),
    ]);
    const jobsNeeding = new Map<string, string[]>();
    for (const n of needed)
      jobsNeeding.set(n.partId, [...(jobsNeeding.get(n.partId) ?? []), n.jobTitle]);
    // Only fields without money leave this function.
    const facts = all
      .filter((p) => parts.seesPart(caller, p))
      .map((p) => ({
        id: p.id,
        name: p.name,
        vendor: p.vendor,
        status: p.status,
        expectedOn: p.expectedOn,
        sentOutOn: p.sentOutOn,
        turnaroundDays: p.turnaroundDays,
        shopName: p.shopName,
        inEstimate: p.ratingValue != null && p.status !== 'returned',
        neededByJobs: jobsNeeding.get(p.id) ?? [],
      }));
    return {
      items: facts.flatMap((p) => partItems(p, clock.today)),
      threats: facts.flatMap((p) => [...partThreats(p, clock), ...sendOutThreats(p, clock)]),
    };
  },
};

/**
 * Install jobs at the owner's pace. Not for a shop: it sees only the steps of its own parts,
 * and a job's pace counts every step.
 */
const installJobs: TimelineSource = {
  name: 'install-jobs',
  async load({ scope, clock, timeZone }) {
    if (scope.caller.role === 'shop') return nothing;
    const progress = await installLog.listJobProgress(scope.knex, scope.buildId);
    const jobs: JobFacts[] = progress.map((j) => ({
      ...j,
      finishedOn: j.finishedAt ? (wallClock(j.finishedAt, timeZone).date as IsoDate) : null,
    }));
    return { items: jobItems(jobs, clock), threats: jobThreats(jobs, clock) };
  },
};

/** Dyno days, booked or held; a shop sees those at its own dyno. They threaten nothing. */
const dynoDays: TimelineSource = {
  name: 'dyno-days',
  async load({ scope, clock }) {
    const days = await dyno.listDynoDays(scope);
    return { items: days.map((d) => dynoDayItem(d, clock.today)), threats: [] };
  },
};

export const sources: TimelineSource[] = [milestones, partsAndSendOuts, installJobs, dynoDays];
